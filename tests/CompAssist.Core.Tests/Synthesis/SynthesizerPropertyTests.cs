using System.Numerics;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;
using CsCheck;

namespace CompAssist.Core.Tests.Synthesis;

/// <summary>Over random loops every compensator kind places its target as a closed-loop root or is refused with a reason.</summary>
public class SynthesizerPropertyTests
{
    private const int Iterations = 2000;

    /// <summary>A type-1 plant k/(s·Π(s − p)) with 1–3 stable real poles.</summary>
    private static readonly Gen<TransferFunction> TypeOnePlant =
        Gen.Select(Gen.Double[-15, -0.3].Array[1, 3], Gen.Double[0.5, 50])
            .Select((poles, gain) => TransferFunction.FromFactors(gain, [], poles.Select(p => new Complex(p, 0)).Append(Complex.Zero)));

    /// <summary>A point on the uncompensated locus: the least-damped complex closed-loop root at some gain.</summary>
    private static Complex? OnLocus(Loop loop, double gain)
    {
        var roots = RootFinder.Find(loop.Characteristic(TransferFunction.Constant(gain))).Roots;
        var complex = roots.Where(r => r.Imaginary > 1e-3 && r.Real < -1e-3).OrderBy(r => -r.Real).ToList();
        return complex.Count == 0 ? null : complex[0];
    }

    private static void AssertPlacedOrRefused(Outcome<Design> outcome, Loop loop)
    {
        if (!outcome.IsSuccess)
        {
            Assert.False(string.IsNullOrWhiteSpace(outcome.Problem!.Message));
            Assert.False(string.IsNullOrWhiteSpace(outcome.Problem.Hint));
            return;
        }

        var proof = LoopProver.Prove(loop, outcome.Value.Compensator.TransferFunction, outcome.Value.Target);
        Assert.True(proof.TargetResidual <= 1e-9, $"residual {proof.TargetResidual:G3}");
    }

    [Fact]
    public void Lag_TargetOnLocus_RaisesKvByTheAskedFactorWithinMargin()
    {
        var designed = 0;
        Gen.Select(TypeOnePlant, Gen.Double[0.05, 1.0], Gen.Double[2, 20]).Sample(
            (plant, gainFraction, factor) =>
            {
                var loop = Loop.Create(plant);
                if (OnLocus(loop, gainFraction) is not { } point)
                {
                    return;
                }

                var before = ErrorConstants.Of(loop, TransferFunction.Constant(CompAssist.Core.Analysis.PointAnalysis.At(loop, point).Gain)).Kv;
                var requirement = new ErrorRequirement(ErrorConstantKind.Velocity, factor * before);
                var outcome = Synthesizer.Design(loop, TargetPole.At(point), CompensatorKind.Lag, new LeadOptions(), new SlowPoleOptions(), requirement);
                AssertPlacedOrRefused(outcome, loop);
                if (outcome.IsSuccess)
                {
                    Interlocked.Increment(ref designed);
                    var steady = outcome.Value.SteadyState!;
                    Assert.True(steady.Met, $"Kv {steady.After} < {requirement.Value}");
                    Assert.True(steady.After <= requirement.Value * 1.5, $"Kv {steady.After} overshoots {requirement.Value} by more than the margin allows");
                    var lag = outcome.Value.Compensator.Stages.Single();
                    Assert.True(Math.Abs(lag.AngleAtTargetDegrees) <= 5.0 + 1e-9);
                }
            },
            iter: Iterations);
        Assert.True(designed > Iterations / 4, $"only {designed} lag designs succeeded");
    }

    [Fact]
    public void Pi_TargetOnLocus_PlacedOrRefused()
    {
        Gen.Select(TypeOnePlant, Gen.Double[0.05, 1.0]).Sample(
            (plant, gainFraction) =>
            {
                var typeZero = TransferFunction.FromFactors(plant.Gain, [], plant.Poles.Where(p => p != Complex.Zero).Append(new Complex(-0.5, 0)));
                var loop = Loop.Create(typeZero);
                if (OnLocus(loop, gainFraction * 10) is not { } point)
                {
                    return;
                }

                var outcome = Synthesizer.Design(loop, TargetPole.At(point), CompensatorKind.PI, new LeadOptions(), new SlowPoleOptions(), null);
                AssertPlacedOrRefused(outcome, loop);
                if (outcome.IsSuccess)
                {
                    Assert.Equal(1, ErrorConstants.Of(loop, outcome.Value.Compensator.TransferFunction).SystemType);
                }
            },
            iter: Iterations);
    }

    [Theory]
    [InlineData(CompensatorKind.PD, null)]
    [InlineData(CompensatorKind.PD, 10.0)]
    [InlineData(CompensatorKind.PID, null)]
    [InlineData(CompensatorKind.PID, 10.0)]
    public void Derivative_RandomTargets_PlacedOrRefused(CompensatorKind kind, double? filter)
    {
        Gen.Select(TypeOnePlant, Gen.Double[-8, -0.3], Gen.Double[0.3, 8]).Sample(
            (plant, re, im) =>
            {
                var loop = Loop.Create(plant);
                var outcome = Synthesizer.Design(loop, TargetPole.At(new Complex(re, im)), kind, new LeadOptions(), new SlowPoleOptions { FilterRatio = filter }, null);
                AssertPlacedOrRefused(outcome, loop);
            },
            iter: Iterations);
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void LeadLag_RandomTargets_PlacedOrRefused(bool equalFactor)
    {
        var designed = 0;
        Gen.Select(TypeOnePlant, Gen.Double[-6, -0.5], Gen.Double[0.5, 6], Gen.Double[2, 30]).Sample(
            (plant, re, im, factor) =>
            {
                var loop = Loop.Create(plant);
                var kv = ErrorConstants.Of(loop, TransferFunction.Unity).Kv * factor;
                var outcome = Synthesizer.Design(loop, TargetPole.At(new Complex(re, im)), CompensatorKind.LeadLag, new LeadOptions(), new SlowPoleOptions { EqualFactor = equalFactor }, new ErrorRequirement(ErrorConstantKind.Velocity, kv));
                if (!outcome.IsSuccess)
                {
                    Assert.False(string.IsNullOrWhiteSpace(outcome.Problem!.Hint));
                    return;
                }

                // The design places its target as a verified closed-loop root: exactly where it was asked for
                // (the independent lead makes up the lag's angle), or (equal factor) moved only a little.
                var proof = LoopProver.Prove(loop, outcome.Value.Compensator.TransferFunction, outcome.Value.Target);
                Assert.True(proof.TargetResidual <= 1e-9, $"residual {proof.TargetResidual:G3}");
                var asked = new Complex(re, im);
                if (equalFactor)
                {
                    Assert.True(Complex.Abs(outcome.Value.Target.Point - asked) <= 0.15 * asked.Magnitude, $"moved from {asked} to {outcome.Value.Target.Point}");
                }
                else
                {
                    Assert.Equal(asked, outcome.Value.Target.Point);
                }
                Assert.True(outcome.Value.SteadyState!.Met || equalFactor, "independent lead-lag meets Kv");
                Interlocked.Increment(ref designed);
            },
            iter: Iterations);
        Assert.True(designed > Iterations / 20, $"only {designed} lead-lag designs succeeded");
    }

    [Theory]
    [InlineData(LeadPlacement.FixedZero)]
    [InlineData(LeadPlacement.FixedPole)]
    public void Lead_FixedPlacements_PlacedOrRefused(LeadPlacement placement)
    {
        Gen.Select(TypeOnePlant, Gen.Double[-6, -0.5], Gen.Double[0.5, 6], Gen.Double[0.05, 3]).Sample(
            (plant, re, im, scale) =>
            {
                var loop = Loop.Create(plant);
                var options = new LeadOptions { Placement = placement, Zero = re * scale, Pole = re * (2 + (5 * scale)) };
                var outcome = Synthesizer.Design(loop, TargetPole.At(new Complex(re, im)), CompensatorKind.Lead, options, new SlowPoleOptions(), null);
                AssertPlacedOrRefused(outcome, loop);
            },
            iter: Iterations);
    }
}
