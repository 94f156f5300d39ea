using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Simulation;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Proof;

/// <summary>Re-proves the loop at every corner of a box of plant variations.</summary>
public static class RobustnessSweep
{
    /// <summary>Largest number of variations (2¹⁰ = 1024 corners).</summary>
    public const int MaxVariations = 10;

    /// <summary>Number of corners a sweep of <paramref name="variationCount"/> variations visits.</summary>
    public static int CornerCount(int variationCount) => 1 << variationCount;

    /// <summary>
    /// Runs the sweep and judges every corner by <paramref name="requirements"/> (the same rows and rule as the
    /// nominal loop); refuses variations that name no plant pole.
    /// </summary>
    /// <exception cref="OperationCanceledException">The sweep was cancelled.</exception>
    public static Outcome<RobustnessReport> Run(
        Loop loop,
        TransferFunction compensator,
        IReadOnlyList<PlantVariation> variations,
        Requirements? requirements = null,
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
            corners.Add(Corner(loop, compensator, variations, factors, requirements));
            progress?.Report(mask + 1);
        }

        return Outcome<RobustnessReport>.Success(new RobustnessReport([.. variations], corners.MoveToImmutable()));
    }

    private static RobustnessCorner Corner(Loop loop, TransferFunction compensator, IReadOnlyList<PlantVariation> variations, ImmutableArray<double> factors, Requirements? requirements)
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
        if (varied.WellPosednessProblem(compensator) is not null)
        {
            return Unstable(factors, double.NaN, requirements);
        }

        try
        {
            var roots = RootFinder.Find(varied.Characteristic(compensator)).Roots;
            var leastDamping = roots.Min(r => r.Magnitude == 0 ? 0.0 : -r.Real / r.Magnitude);
            if (!ClosedLoopStability.Judge(varied, compensator, roots).Stable)
            {
                return Unstable(factors, leastDamping, requirements);
            }

            var output = ClosedLoopTransfers.Of(varied, compensator, roots).Output;
            var m = StepAnalysis.Measure(CascadeRealization.Of(output), roots, output.DcGain, LoopCheck.Horizon(roots));
            if (varied.Delay + compensator.Delay > 0 && DelayLoopStep.Simulate(varied, compensator, m.Horizon) is { } exact)
            {
                m = StepMetrics.Measure(exact.Output, output.DcGain); // the corner's verdict on the exact delay, as the nominal one
            }

            var constants = ErrorConstants.Of(varied, compensator);
            var margins = requirements is { NeedsMargins: true } ? MarginAnalyzer.Analyze(varied, compensator) : null;
            return new RobustnessCorner(factors, true, m, RequirementChecks.Of(m, true, requirements, constants: constants, margins: margins), leastDamping);
        }
        catch (RootFindingException)
        {
            return Unstable(factors, double.NaN, requirements);
        }
    }

    private static RobustnessCorner Unstable(ImmutableArray<double> factors, double leastDamping, Requirements? requirements)
    {
        var nothing = new StepMetrics
        {
            FinalValue = double.NaN,
            PeakValue = double.NaN,
            OvershootPercent = double.NaN,
            PeakTime = double.NaN,
            UndershootPercent = double.NaN,
            UndershootTime = double.NaN,
            RiseTime = double.NaN,
            SettlingTime2Percent = double.NaN,
            SettlingTime5Percent = double.NaN,
            Horizon = double.NaN,
            SampleTime = double.NaN,
        };
        return new RobustnessCorner(factors, false, null, RequirementChecks.Of(nothing, false, requirements), leastDamping);
    }

    private static bool Matches(Complex pole, Complex named) =>
        Math.Abs(pole.Real - named.Real) <= 1e-6 * Math.Max(1.0, Math.Abs(named.Real));
}
