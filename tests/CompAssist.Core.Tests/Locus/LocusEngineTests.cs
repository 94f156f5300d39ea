using System.Numerics;
using CompAssist.Core.Locus;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Parsing;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Locus;

public class LocusEngineTests
{
    private static Loop LoopOf(string plant, FeedbackSign sign = FeedbackSign.Negative) =>
        Loop.Create(ExpressionParser.ParseProper(plant).Value!, sign: sign);

    private static void AssertOnLocus(Loop loop, LocusResult locus)
    {
        var open = loop.RationalOpenLoop(TransferFunction.Unity).Scaled(loop.SignFactor);
        foreach (var branch in locus.Branches)
        {
            Assert.Equal(0.0, branch[0].Gain);
            Assert.Contains(branch[0].Root, open.Poles);
            for (var i = 1; i < branch.Length; i++)
            {
                Assert.True(branch[i].Gain > branch[i - 1].Gain, "gains increase along a branch");
                var f = new CharacteristicFunction(open.PoleFactors, branch[i].Gain * open.Gain, open.ZeroFactors);
                Assert.True(f.RelativeResidual(branch[i].Root) <= 1e-9, $"residual {f.RelativeResidual(branch[i].Root)} at K={branch[i].Gain}");
            }
        }

        // At every gain all branches share, the branches are distinct roots (no two coincide but at break points;
        // the exact break points themselves are added only to the branches that meet there).
        var common = locus.Branches.Select(br => br.Select(p => p.Gain).ToHashSet()).Aggregate((x, y) => { x.IntersectWith(y); return x; });
        foreach (var gain in common.Where(k => k > 0))
        {
            var roots = locus.Branches.Select(br => br.First(p => p.Gain == gain).Root).ToList();
            var isBreak = locus.BreakPoints.Any(bp => roots.Any(r => Complex.Abs(r - bp.Point) < 1e-2 * Math.Max(1, bp.Point.Magnitude)));
            if (isBreak)
            {
                continue;
            }

            for (var i = 0; i < roots.Count; i++)
            {
                for (var j = i + 1; j < roots.Count; j++)
                {
                    Assert.True(Complex.Abs(roots[i] - roots[j]) > 1e-9, $"branches {i} and {j} coincide at K={gain}");
                }
            }
        }
    }

    [Fact]
    public void Compute_OgataThreePoles_FeaturesMatchBook()
    {
        // Ogata, Modern Control Engineering, 5th ed., Example 6-1 (from memory): K/(s(s+1)(s+2)) has asymptotes
        // from −1 at ±60° and 180°, break-away at −0.4226 (K = 0.3849) and crosses the imaginary axis at
        // ±j√2 for K = 6 (Routh). Exact: break-away at −1 + 1/√3, K = |s(s+1)(s+2)| there.
        var loop = LoopOf("1/(s(s+1)(s+2))");
        var locus = LocusEngine.Compute(loop);
        Tolerance.Close(-1.0, locus.Centroid, 1e-15);
        Assert.Equal([60.0, 180.0, 300.0], locus.AsymptoteAnglesDegrees.Select(a => Math.Round(a, 9)));
        var b = Assert.Single(locus.BreakPoints);
        var exact = -1 + (1 / Math.Sqrt(3));
        Tolerance.Close(exact, b.Point.Real, 1e-14);
        Tolerance.Close(Math.Abs(exact * (exact + 1) * (exact + 2)), b.Gain, 1e-13);
        Tolerance.Close(0.3849, b.Gain, 1e-4, what: "book");
        var c = Assert.Single(locus.AxisCrossings);
        Tolerance.Close(Math.Sqrt(2), c.Frequency, 1e-13);
        Tolerance.Close(6.0, c.Gain, 1e-13);
        Assert.Equal([new RealAxisSegment(double.NegativeInfinity, -2), new RealAxisSegment(-1, 0)], locus.RealAxisSegments.ToArray());
        Assert.All(locus.BranchEnds, e => Assert.Null(e));
        AssertOnLocus(loop, locus);
    }

    [Fact]
    public void Compute_OgataComplexPolesWithZero_BreakInAndDeparture()
    {
        // Ogata, 5th ed., Example 6-2 (from memory): K(s+2)/(s²+2s+3): the locus is a circle about −2 of radius
        // √3 with break-in at −2 − √3 = −3.732 and departure angle 145° (exactly 180° + 54.74° − 90° = 144.74°).
        var loop = LoopOf("(s+2)/(s^2+2s+3)");
        var locus = LocusEngine.Compute(loop);
        var b = Assert.Single(locus.BreakPoints);
        Tolerance.Close(-2 - Math.Sqrt(3), b.Point.Real, 1e-13);
        var dep = Assert.Single(locus.BranchAngles);
        Assert.True(dep.IsDeparture);
        Tolerance.Close(180 + (Math.Atan(Math.Sqrt(2)) * 180 / Math.PI) - 90, dep.AngleDegrees, 1e-12);
        Tolerance.Close(145.0, dep.AngleDegrees, 0, 0.5, "book");
        Assert.Contains(locus.BranchEnds, e => e == new Complex(-2, 0));
        AssertOnLocus(loop, locus);

        // Every complex point lies on the circle |s + 2| = √3.
        foreach (var p in locus.Branches.SelectMany(x => x).Where(p => Math.Abs(p.Root.Imaginary) > 1e-6))
        {
            Tolerance.Close(Math.Sqrt(3), Complex.Abs(p.Root + 2), 1e-7);
        }
    }

    [Fact]
    public void Compute_TripleRoot_AtOneGain()
    {
        // (s+1)³ + K·… : for 1/(s(s+3)²)... choose K/(s(s^2+3s+3)) = K/((s+1)³ − 1): at K = 1 the
        // characteristic polynomial is (s+1)³, a triple root at −1 (a published-style check, exact).
        var loop = LoopOf("1/(s(s^2+3s+3))");
        var locus = LocusEngine.Compute(loop);
        var b = Assert.Single(locus.BreakPoints);
        Tolerance.Close(-1.0, b.Point.Real, 1e-7);
        Tolerance.Close(1.0, b.Gain, 1e-7);
        AssertOnLocus(loop, locus);
    }

    [Fact]
    public void Compute_PositiveFeedback_ZeroDegreeLocus()
    {
        var loop = LoopOf("1/(s(s+1)(s+2))", FeedbackSign.Positive);
        var locus = LocusEngine.Compute(loop);
        Assert.True(locus.ZeroDegreeLocus);
        Assert.Equal([0.0, 120.0, 240.0], locus.AsymptoteAnglesDegrees.Select(a => Math.Round(a, 9)));
        Assert.Equal([new RealAxisSegment(-2, -1), new RealAxisSegment(0, double.PositiveInfinity)], locus.RealAxisSegments.ToArray());
        AssertOnLocus(loop, locus);
    }

    [Theory]
    [InlineData(10)]
    [InlineData(20)]
    [InlineData(30)]
    public void Compute_HighOrder_EveryPointOnTheLocus(int order)
    {
        var poles = new List<Complex>();
        for (var i = 0; i < order - 2; i++)
        {
            poles.Add(new Complex(-0.5 * Math.Pow(60.0, (double)i / (order - 3)), 0));
        }

        poles.Add(new Complex(-1, 3));
        poles.Add(new Complex(-1, -3));
        var loop = Loop.Create(TransferFunction.FromFactors(1, [new Complex(-2, 0), new Complex(-8, 0)], poles));
        var locus = LocusEngine.Compute(loop);
        Assert.Equal(order, locus.Branches.Length);
        Assert.Equal(2, locus.BranchEnds.Count(e => e is not null));
        AssertOnLocus(loop, locus);
    }

    [Fact]
    public void Compute_OgataThreePoles_TwoBranchesPassThroughTheExactBreakAway()
    {
        // Ogata, 5th ed., Example 6-1 (from memory): break-away at −0.4226 with K = 0.3849; exact −1 + 1/√3.
        var locus = LocusEngine.Compute(LoopOf("1/(s(s+1)(s+2))"));
        var s0 = -1 + (1 / Math.Sqrt(3));
        var k0 = Math.Abs(s0 * (s0 + 1) * (s0 + 2));
        var through = locus.Branches.Count(b => b.Any(p => Complex.Abs(p.Root - s0) < 1e-9 && Math.Abs(p.Gain - k0) < 1e-9 * k0));
        Assert.Equal(2, through);
    }

    [Theory]
    [InlineData("1/(s(s+1)(s+2))")]
    [InlineData("(s+2)/(s^2+2s+3)")]
    [InlineData("(s+2)(s+8)/((s+0.5)(s+1.2)(s+3)(s+7)(s+30)(s^2+2s+10))")]
    public void Compute_SimpleBreakPoints_AreCrossedWithoutAnEigenvalueSolve(string plant)
    {
        // Two roots meeting at a break point leave it by the local expansion; only the start needs an
        // eigenvalue solve. Every point must still be on the locus.
        var loop = LoopOf(plant);
        var locus = LocusEngine.Compute(loop);
        Assert.NotEmpty(locus.BreakPoints);
        Assert.Equal(locus.BreakPoints.Length, locus.ExpansionCrossings);
        AssertOnLocus(loop, locus);
    }

    [Theory]
    [InlineData("1/(s(s+1)(s+2))")]
    [InlineData("(s+2)/(s^2+2s+3)")]
    [InlineData("1/(s(s+4)(s^2+4s+20))")]
    [InlineData("(s+0.5)/(s^2(s+4)^2)")]
    public void Compute_NearTheOrigin_ConsecutivePointsAreCloseEnoughToDraw(string plant)
    {
        // The jumps across break points must not leave long straight chords in the picture: within twice the
        // region's size, consecutive points of a branch are at most a quarter of the region apart.
        var loop = LoopOf(plant);
        var locus = LocusEngine.Compute(loop);
        var open = loop.RationalOpenLoop(TransferFunction.Unity);
        var scale = open.Poles.Concat(open.Zeros).Max(z => z.Magnitude);
        foreach (var branch in locus.Branches)
        {
            for (var i = 1; i < branch.Length; i++)
            {
                if (branch[i].Root.Magnitude < 2 * scale && branch[i - 1].Root.Magnitude < 2 * scale)
                {
                    var gap = Complex.Abs(branch[i].Root - branch[i - 1].Root);
                    Assert.True(gap <= 0.25 * scale, $"gap {gap} between K={branch[i - 1].Gain} and K={branch[i].Gain}");
                }
            }
        }
    }

    [Fact]
    public void Compute_LagDipoleBesideAFastPole_DrawsTheSmallCircleInSteps()
    {
        // A lag-like dipole near the origin on a plant with a pole a thousand times faster: the small circle
        // from the break-away near −0.005 to the break-in near −0.195 must be drawn, not replaced by one chord
        // from one break point to the other.
        var loop = LoopOf("(s+0.1)/(s(s+0.01)(s+100))");
        var locus = LocusEngine.Compute(loop);
        AssertOnLocus(loop, locus);
        var onCircle = locus.Branches.Max(b => b.Count(p => p.Root.Imaginary > 0.02 && p.Root.Magnitude < 0.3));
        Assert.True(onCircle >= 6, $"{onCircle} points on the upper half of the circle");
        foreach (var branch in locus.Branches)
        {
            for (var i = 1; i < branch.Length; i++)
            {
                if (branch[i].Root.Magnitude < 0.3 && branch[i - 1].Root.Magnitude < 0.3)
                {
                    var gap = Complex.Abs(branch[i].Root - branch[i - 1].Root);
                    Assert.True(gap <= 0.1, $"gap {gap} between K={branch[i - 1].Gain} and K={branch[i].Gain}");
                }
            }
        }
    }

    [Fact]
    public void Compute_RepeatedPolesAndIntegrators_Works()
    {
        var loop = LoopOf("(s+0.5)/(s^2(s+4)^2)");
        var locus = LocusEngine.Compute(loop);
        Assert.Equal(4, locus.Branches.Length);
        AssertOnLocus(loop, locus);
    }

    [Fact]
    public void Compute_Delay_IsMarkedApproximate()
    {
        var locus = LocusEngine.Compute(LoopOf("exp(-0.1s)/(s(s+1))"));
        Assert.True(locus.Approximate);
        Assert.Equal(2 + 3, locus.Branches.Length);
    }
}
