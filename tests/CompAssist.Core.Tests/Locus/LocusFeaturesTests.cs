using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Locus;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Locus;

public class LocusFeaturesTests
{
    private static LocusResult LocusOf(string plant) =>
        LocusEngine.Compute(Loop.Create(ExpressionParser.ParseProper(plant).Value!));

    private static double GainOnAxis(double sigma, double[] poles, double[] zeros, double g) =>
        -poles.Aggregate(1.0, (v, p) => v * (sigma - p)) / (g * zeros.Aggregate(1.0, (v, z) => v * (sigma - z)));

    [Fact]
    public void BreakPoints_RandomRealPolesAndZeros_EveryLocalExtremumOfTheGainOnTheAxisAndNoOther()
    {
        // A different route from the roots of N·D′ − N′·D: on the real axis the gain K(σ) = −D(σ)/(g·N(σ)) is
        // real, and a break point on a locus segment is where two real roots meet, i.e. where K(σ) has a
        // local extremum (common practice). A dense scan of each segment finds the extrema by the sign change
        // of the difference of K; the reported real break points must be exactly those, each with its gain.
        var random = new Random(20261203);
        for (var trial = 0; trial < 150; trial++)
        {
            var poles = Enumerable.Range(0, random.Next(2, 7)).Select(_ => -Math.Round(random.NextDouble() * 10, 3)).ToArray();
            var zeros = Enumerable.Range(0, random.Next(0, poles.Length)).Select(_ => -Math.Round(0.05 + (random.NextDouble() * 12), 3)).ToArray();
            if (poles.Concat(zeros).Distinct().Count() < poles.Length + zeros.Length
                || poles.Concat(zeros).SelectMany(a => poles.Concat(zeros).Where(b => b != a).Select(b => Math.Abs(a - b))).Min() < 0.05)
            {
                continue;
            }

            var g = 1.0;
            var breakPoints = LocusFeatures.BreakPoints(
                [.. poles.Select(p => new Complex(p, 0))], [.. zeros.Select(z => new Complex(z, 0))], g);
            var segments = LocusFeatures.Segments([.. poles.Select(p => new Complex(p, 0))], [.. zeros.Select(z => new Complex(z, 0))], zeroDegree: false);
            var reach = 20 * (1 + poles.Concat(zeros).Max(Math.Abs));
            var found = new List<double>();
            foreach (var segment in segments)
            {
                var from = Math.Max(segment.From, -reach);
                var to = segment.To;
                const int Points = 200_000;
                var h = (to - from) / Points;
                double? previousSlope = null;
                for (var i = 1; i < Points; i++)
                {
                    var a = from + (i * h);
                    var slope = GainOnAxis(a + (h / 2), poles, zeros, g) - GainOnAxis(a - (h / 2), poles, zeros, g);
                    if (previousSlope is { } ps && Math.Sign(ps) != Math.Sign(slope) && slope != 0)
                    {
                        found.Add(a - (h / 2));
                    }

                    previousSlope = slope;
                }
            }

            var real = breakPoints.Where(b => b.Point.Imaginary == 0).ToList();
            var scale = 1 + poles.Concat(zeros).Max(Math.Abs);
            Assert.True(found.Count == real.Count, $"trial {trial}: poles [{string.Join(", ", poles)}] zeros [{string.Join(", ", zeros)}]: scan {string.Join(", ", found)} vs reported {string.Join(", ", real.Select(b => b.Point.Real))}");
            foreach (var sigma in found)
            {
                var match = real.MinBy(b => Math.Abs(b.Point.Real - sigma))!;
                Tolerance.Close(sigma, match.Point.Real, 0, 1e-3 * scale, $"trial {trial} break point");
                Tolerance.Close(GainOnAxis(match.Point.Real, poles, zeros, g), match.Gain, 1e-9, what: $"trial {trial} gain");
            }
        }
    }

    [Fact]
    public void BreakPoints_PoleCancelledByAZero_NoBreakPointOrDepartureThere()
    {
        // C(s) = (s + 5)/(s + 9) on 25/(s(s + 5)): the closed-loop root at −5 stays for every gain, so −5 (a
        // double root of N·D′ − N′·D) is no break point; the rest is the locus of 25/(s(s + 9)), break-away
        // at −4.5 with K·25 = 4.5² (common practice: midpoint of two real poles).
        var locus = LocusEngine.Compute(Loop.Create(ExpressionParser.ParseProper("25/(s(s+5))").Value!), ExpressionParser.ParseProper("(s+5)/(s+9)").Value!);
        var b = Assert.Single(locus.BreakPoints);
        Tolerance.Close(-4.5, b.Point.Real, 1e-12);
        Tolerance.Close(4.5 * 4.5 / 25, b.Gain, 1e-12);

        var complexCancelled = LocusOf("(s^2+2s+5)/((s+1)(s^2+2s+5))");
        Assert.Empty(complexCancelled.BreakPoints);
        Assert.Empty(complexCancelled.BranchAngles);
    }

    [Theory]
    [InlineData("1/((s+1)^2 (s+4))", -1.0, new[] { -90.0, 90.0 })]
    [InlineData("1/(s^3 (s+4))", 0.0, new[] { -60.0, 60.0, 180.0 })]
    [InlineData("1/((s^2+2s+1) (s+4))", -1.0, new[] { -90.0, 90.0 })]
    public void BreakPoints_RepeatedRealPole_BreakPointAtGainZeroWithEveryDepartureAngle(string plant, double pole, double[] angles)
    {
        // A pole of multiplicity m is left by m branches at once (K = 0) at the angles θ with
        // m·θ = 180° + Σ∠(s − z) − Σ∠(s − p) + k·360° over the other poles and zeros (common practice;
        // Franklin–Powell–Emami-Naeini, ch. 5, rules of the locus, from memory). The expanded double pole
        // s² + 2s + 1 is split by root finding into two roots about 1e-8 apart: still one repeated pole.
        var locus = LocusOf(plant);
        var b = Assert.Single(locus.BreakPoints, x => x.Gain == 0);
        Tolerance.Close(pole, b.Point.Real, 0, 1e-7);
        Assert.Equal(0.0, b.Point.Imaginary);
        var departures = locus.BranchAngles.Where(a => a.IsDeparture && Math.Abs(a.At.Real - pole) < 1e-6).Select(a => a.AngleDegrees).ToArray();
        Assert.Equal(angles.Length, departures.Length);
        for (var i = 0; i < angles.Length; i++)
        {
            Tolerance.Close(angles[i], departures[i], 0, 1e-6);
        }
    }

    [Fact]
    public void BranchAngles_DoubleComplexPair_TwoDeparturesHalfATurnApart()
    {
        // 1/(s² + 2s + 5)²: at −1 + 2j the other double pole adds 2·90°, so 2θ = 180° − 180° (mod 360°):
        // θ = 0° and 180° (common practice, the rule for a multiple pole).
        var locus = LocusOf("1/((s^2+2s+5)^2)");
        var upper = locus.BranchAngles.Where(a => a.At.Imaginary > 0).Select(a => a.AngleDegrees).ToArray();
        Assert.Equal(2, upper.Length);
        Tolerance.Close(0.0, upper[0], 0, 1e-6);
        Tolerance.Close(180.0, upper[1], 0, 1e-6);
        Assert.Equal(2, locus.BreakPoints.Count(x => x.Gain == 0));
    }

    [Fact]
    public void BreakPoints_TripleClosedLoopRoot_OneBreakPointWithItsGain()
    {
        // (s + 1)/(s²(s + 9)): the characteristic polynomial s³ + 9s² + K(s + 1) is (s + 3)³ at K = 27, a
        // double root of N·D′ − N′·D at −3 (Franklin–Powell–Emami-Naeini, ch. 5 example, from memory), and
        // the double pole at the origin breaks away at K = 0.
        var locus = LocusOf("(s+1)/(s^2 (s+9))");
        var triple = Assert.Single(locus.BreakPoints, b => b.Gain > 0);
        Tolerance.Close(-3.0, triple.Point.Real, 1e-6);
        Tolerance.Close(27.0, triple.Gain, 1e-9);
        var origin = Assert.Single(locus.BreakPoints, b => b.Gain == 0);
        Tolerance.Close(0.0, origin.Point.Real, 0, 1e-12);
    }

    [Fact]
    public void BreakPoints_TightClusterOfPoles_OneBetweenEveryPairOnASegment()
    {
        // Poles 1e-3 apart: the segment [−1.002, −1.001] holds a break-away whose gain is about 1e-10, and
        // [−1, 0] its own; the scan route of the random test, on a cluster it cannot draw from a random draw.
        double[] poles = [0, -1, -1.001, -1.002];
        var locus = LocusOf("1/(s (s+1) (s+1.001) (s+1.002))");
        var real = locus.BreakPoints.Where(b => b.Point.Imaginary == 0).OrderBy(b => b.Point.Real).ToArray();
        Assert.Equal(2, real.Length);
        Assert.InRange(real[0].Point.Real, -1.002, -1.001);
        Assert.InRange(real[1].Point.Real, -1, 0);
        foreach (var b in real)
        {
            Tolerance.Close(GainOnAxis(b.Point.Real, poles, [], 1), b.Gain, 1e-9);
            var phi = poles.Sum(p => 1 / (b.Point.Real - p));
            Assert.True(Math.Abs(phi) <= 1e-9 * poles.Sum(p => Math.Abs(1 / (b.Point.Real - p))), $"Σ1/(σ − p) = {phi} at {b.Point.Real}");
        }
    }

    [Fact]
    public void WithRepeatedPoles_NoRepeats_ListUnchanged()
    {
        ImmutableArray<BreakPoint> given = [new BreakPoint(new Complex(-0.5, 0), 0.25)];
        var result = LocusFeatures.WithRepeatedPoles(given, [new Complex(0, 0), new Complex(-1, 0)], []);
        Assert.Equal(given.ToArray(), result.ToArray());
    }
}
