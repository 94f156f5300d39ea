using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Simulation;

namespace CompAssist.Core.Proof;

/// <summary>Re-proves the loop at every corner of a box of plant variations.</summary>
public static class RobustnessSweep
{
    /// <summary>Largest number of variations (2¹⁰ = 1024 corners).</summary>
    public const int MaxVariations = 10;

    /// <summary>Number of corners a sweep of <paramref name="variationCount"/> variations visits.</summary>
    public static int CornerCount(int variationCount) => 1 << variationCount;

    /// <summary>
    /// Runs the sweep; refuses variations that name no plant pole. <paramref name="progress"/> hears the number of
    /// corners done after each one; <paramref name="cancellation"/> stops between corners.
    /// </summary>
    /// <exception cref="OperationCanceledException">The sweep was cancelled.</exception>
    public static Outcome<RobustnessReport> Run(
        Loop loop,
        TransferFunction compensator,
        IReadOnlyList<PlantVariation> variations,
        int intervals = 2000,
        IProgress<int>? progress = null,
        CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(loop);
        ArgumentNullException.ThrowIfNull(compensator);
        ArgumentNullException.ThrowIfNull(variations);
        if (variations.Count > MaxVariations)
        {
            return Outcome<RobustnessReport>.Refused($"{variations.Count} variations make too many corners", $"Vary at most {MaxVariations} parameters at once.");
        }

        foreach (var v in variations)
        {
            if (v.Pole is { } origin && origin == Complex.Zero)
            {
                return Outcome<RobustnessReport>.Refused("A pole at the origin (an integrator) cannot be scaled", "Vary the plant gain instead.");
            }

            if (v.Pole is { } p && !loop.Plant.Poles.Any(q => Matches(q, p)))
            {
                return Outcome<RobustnessReport>.Refused(
                    $"The plant has no pole at {TransferFunctionFormatter.Number(p.Real)} to vary",
                    $"Plant poles: {string.Join(", ", loop.Plant.Poles.Select(q => TransferFunctionFormatter.Complex(q, 4)))}.");
            }
        }

        var corners = ImmutableArray.CreateBuilder<RobustnessCorner>(1 << variations.Count);
        for (var mask = 0; mask < 1 << variations.Count; mask++)
        {
            var factors = Enumerable.Range(0, variations.Count)
                .Select(i => 1.0 + ((((mask >> i) & 1) == 1 ? 1 : -1) * variations[i].Percent / 100.0))
                .ToImmutableArray();
            cancellation.ThrowIfCancellationRequested();
            corners.Add(Corner(loop, compensator, variations, factors, intervals));
            progress?.Report(mask + 1);
        }

        return Outcome<RobustnessReport>.Success(new RobustnessReport([.. variations], corners.MoveToImmutable()));
    }

    private static RobustnessCorner Corner(Loop loop, TransferFunction compensator, IReadOnlyList<PlantVariation> variations, ImmutableArray<double> factors, int intervals)
    {
        var gain = loop.Plant.Gain;
        var poles = loop.Plant.Poles.ToList();
        for (var i = 0; i < variations.Count; i++)
        {
            if (variations[i].Pole is { } target)
            {
                for (var k = 0; k < poles.Count; k++)
                {
                    if (Matches(poles[k], target))
                    {
                        // Scale the pole (a pair keeps its damping); keep the DC gain of a non-origin pole fixed
                        // so that only the dynamics move, not the loop gain.
                        gain *= factors[i];
                        poles[k] *= factors[i];
                    }
                }
            }
            else
            {
                gain *= factors[i];
            }
        }

        var plant = TransferFunction.FromFactors(gain, loop.Plant.Zeros, poles, loop.Plant.Delay);
        var varied = loop.WithPlant(plant);
        try
        {
            var roots = RootFinder.Find(varied.Characteristic(compensator)).Roots;
            var leastDamping = roots.Min(r => r.Magnitude == 0 ? 0.0 : -r.Real / r.Magnitude);
            if (roots.Any(r => r.Real >= 0))
            {
                return new RobustnessCorner(factors, false, double.NaN, double.NaN, leastDamping);
            }

            var output = ClosedLoopTransfers.Of(varied, compensator, roots).Output;
            var horizon = LoopCheck.Horizon(roots);
            var y = StepSimulator.Step(CascadeRealization.Of(output), horizon / intervals, intervals);
            var m = StepMetrics.Measure(y, output.DcGain);
            return new RobustnessCorner(factors, true, m.OvershootPercent, m.SettlingTime2Percent, leastDamping);
        }
        catch (RootFindingException)
        {
            return new RobustnessCorner(factors, false, double.NaN, double.NaN, double.NaN);
        }
    }

    private static bool Matches(Complex pole, Complex named) =>
        Math.Abs(pole.Real - named.Real) <= 1e-6 * Math.Max(1.0, Math.Abs(named.Real));
}
