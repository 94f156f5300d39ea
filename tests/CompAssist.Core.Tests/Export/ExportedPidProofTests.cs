using CompAssist.Core.Discrete;
using CompAssist.Core.Export;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Tests.Support;
using CsCheck;

namespace CompAssist.Core.Tests.Export;

/// <summary>
/// The PID as exported, run in closed loop. Derivative on the measurement and the forward integral follow
/// Åström and Murray, Feedback Systems (2008), section 10.5 (common practice); the linear feedback path is checked
/// against the implementation itself, and the closed-loop run against the z-domain proof of the same loop.
/// </summary>
public class ExportedPidProofTests
{
    private static readonly Loop Plant = Loop.Create(ExpressionParser.Parse("2/((s+1)(0.5s+1))", false).Value!);

    private static TransferFunction Parallel(PidForms f) => ExpressionParser.Parse(
        FormattableString.Invariant($"{f.Kp} + {f.Ki}/s + {f.Kd}s/({f.Tf}s + 1)"), false).Value!;

    private static LoopCheckReport Continuous(PidForms forms, double referenceStep = 1.0, double? limit = null) =>
        LoopCheck.Run(Plant, Parallel(forms), new CheckOptions { ReferenceStep = referenceStep, ActuatorLimit = limit });

    [Fact]
    public void FeedbackPathOf_AnyGains_MatchesTheImplementationDrivenByTheMeasurement()
    {
        Gen.Select(Gen.Double[0.1, 10], Gen.Double[0, 5], Gen.Double[0, 2], Gen.Double[0, 0.5], Gen.Double[0.001, 0.1]).Sample((kp, ki, kd, tf, t) =>
        {
            var forms = PidForms.FromParallel(kp, ki, kd, tf);
            var pid = new PidImplementation(forms, t, -1e12, 1e12, AntiWindup.None);
            var random = new Random(5);
            var y = Enumerable.Range(0, 60).Select(k => k == 0 ? 0.0 : random.NextDouble() - 0.5).ToArray();
            var commands = y.Select(v => pid.Step(0.0, v)).ToArray();
            var path = ExportedPidProof.FeedbackPathOf(pid).Filter(y);
            for (var k = 0; k < y.Length; k++)
            {
                Tolerance.Close(-path[k], commands[k], 1e-9, 1e-9, $"k = {k}");
            }
        });
    }

    [Fact]
    public void Run_PiUnsaturated_ReferenceRunEqualsTheZDomainStepAtTheSamples()
    {
        // Without a derivative the PI acts on the error alone, so the exported reference response is the sampled
        // loop with C_y(z) on the error: the simulation and the z-domain proof must agree at every sample.
        var forms = PidForms.FromParallel(1.2, 0.9, 0.0);
        var pid = new PidImplementation(forms, 0.05, -1e6, 1e6, AntiWindup.Clamping);
        var proof = ExportedPidProof.Run(Plant, Continuous(forms, 2.0), pid, computationDelay: false);
        Assert.True(proof.Linear.Stable);
        var s = (proof.ReferenceRun.Output.Values.Length - 1) / proof.ReferenceRun.Commands.Length;
        for (var k = 0; k < 300; k++)
        {
            Tolerance.Close(proof.Linear.Step.Values[k], proof.ReferenceRun.Output.Values[k * s] / 2.0, 1e-9, 1e-11, $"k = {k}");
        }

        Assert.Equal(0.0, proof.SaturatedFraction);
    }

    [Fact]
    public void Run_PidWithDerivativeOnTheMeasurement_NoKickAndASlowerRise()
    {
        // With the derivative on the error the first command carries the derivative's kick Kd/(Tf + T); on the
        // measurement it is Kp·r alone, and the reference response, without the derivative's zero, rises more slowly
        // (common practice; Åström and Murray, section 10.5).
        var forms = PidForms.FromParallel(6.0, 4.0, 1.5, 0.02);
        var pid = new PidImplementation(forms, 0.01, -1e6, 1e6, AntiWindup.Clamping);
        var proof = ExportedPidProof.Run(Plant, Continuous(forms), pid, computationDelay: false);
        var onError = SampledLoop.Prove(Plant, proof.FeedbackPath, computationDelay: false);
        Assert.True(proof.Linear.Stable);
        Assert.Equal(6.0, proof.ReferenceRun.Commands[0]);
        Tolerance.Close(6.0 + (1.5 / 0.03), proof.FeedbackPath.Numerator[0], 1e-12, what: "the kick on the error");
        Assert.True(proof.Reference.RiseTime > 1.2 * onError.Metrics.RiseTime, $"rise {proof.Reference.RiseTime} s on the measurement against {onError.Metrics.RiseTime} s on the error");
        Tolerance.Close(1.0, proof.Reference.FinalValue, 1e-9, what: "the integral removes the step error");
    }

    [Fact]
    public void Run_AsymmetricLimitsAroundAnOperatingPoint_CommandStaysWithinAndSaturates()
    {
        // A heater-like actuator: 0 … 1.2 absolute, operating point 0.3; the plant sees u − u0.
        var forms = PidForms.FromParallel(6.0, 4.0, 1.5, 0.02);
        var pid = new PidImplementation(forms, 0.01, 0.0, 1.2, AntiWindup.BackCalculation, operatingPoint: 0.3);
        var proof = ExportedPidProof.Run(Plant, Continuous(forms, 1.0, 0.9), pid, computationDelay: true);
        Assert.True(proof.CommandHighest <= 0.9 + 1e-12 && proof.CommandLowest >= -0.3 - 1e-12, $"{proof.CommandLowest} … {proof.CommandHighest}");
        Assert.True(proof.SaturatedFraction > 0, "the step saturates the actuator");
        // A tenth of half the span, pulling the output down: the actuator has more room above u0 (0.9) than below
        // (0.3), so that is the load it can oppose (a heater at its floor cannot reject a heating load).
        Assert.True(proof.DisturbancePeak > 0 && double.IsFinite(proof.DisturbanceRecoveryTime));
        Tolerance.Close(-0.06, proof.Disturbance, 1e-12, what: "a tenth of half the span, downward");
    }
}
