using System.Globalization;
using CompAssist.Core.Discrete;
using CompAssist.Core.Export;
using CompAssist.Core.Parsing;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Export;

public class PidImplementationTests
{
    private static readonly PidForms Gains = PidForms.FromParallel(kp: 2.0, ki: 1.5, kd: 0.4, tf: 0.04);

    /// <summary>Closed loop with the plant 1/(s(s+1))·(s+1)… here 1/((s+1)(0.5s+1)) sampled by ZOH and a saturating actuator.</summary>
    private static (double Overshoot, double[] U) Closed(PidImplementation pid, double reference, int samples = 3000)
    {
        var plant = Discretizer.ZeroOrderHold(ExpressionParser.ParseProper("2/((s+1)(s+2))").Value!, pid.SampleTime);
        var u = new double[samples];
        var y = new double[samples];
        var peak = 0.0;
        for (var k = 0; k < samples; k++)
        {
            var measured = k == 0 ? 0.0 : y[k - 1];
            u[k] = pid.Step(reference, measured);
            y[k] = plant.Filter(u.Take(k + 1).ToArray())[k];
            peak = Math.Max(peak, y[k]);
        }

        return (100 * (peak - reference) / reference, u);
    }

    [Fact]
    public void AntiWindup_Clamping_CutsOvershootOfASaturatingStep()
    {
        // With the actuator saturating for a large step, an unprotected integral winds up and overshoots;
        // conditional integration and back-calculation both keep the overshoot lower (common practice).
        var none = Closed(new PidImplementation(Gains, 0.01, -1.2, 1.2, AntiWindup.None), 1.0, 1500);
        var clamping = Closed(new PidImplementation(Gains, 0.01, -1.2, 1.2, AntiWindup.Clamping), 1.0, 1500);
        var back = Closed(new PidImplementation(Gains, 0.01, -1.2, 1.2, AntiWindup.BackCalculation), 1.0, 1500);
        Assert.True(none.U.Max() <= 1.2 && none.U.Contains(1.2), "the actuator saturates");
        Assert.True(clamping.Overshoot < none.Overshoot - 1, $"clamping {clamping.Overshoot} vs none {none.Overshoot}");
        Assert.True(back.Overshoot < none.Overshoot - 1, $"back-calculation {back.Overshoot} vs none {none.Overshoot}");
    }

    [Fact]
    public void Step_DerivativeOnMeasurement_NoKickOnReferenceStep()
    {
        var pid = new PidImplementation(Gains, 0.01, -100, 100, AntiWindup.Clamping);
        var u0 = pid.Step(1.0, 0.0);
        Tolerance.Close(Gains.Kp * 1.0, u0, 1e-15, what: "first output is Kp·e (no derivative of the reference)");
    }

    [Fact]
    public void Step_DerivativeOnError_KicksByTheFilteredDerivativeGain()
    {
        // Running at rest, then a unit reference step: on the error the first output is Kp + Kd/(Tf + T) (the
        // backward-difference derivative through the filter), on the measurement Kp alone.
        var onError = new PidImplementation(Gains, 0.01, -100, 100, AntiWindup.Clamping, derivativeOnError: true);
        var onMeasurement = new PidImplementation(Gains, 0.01, -100, 100, AntiWindup.Clamping);
        onError.Step(0.0, 0.0);
        onMeasurement.Step(0.0, 0.0);
        Tolerance.Close(Gains.Kp + (Gains.Kd / (Gains.Tf + 0.01)), onError.Step(1.0, 0.0), 1e-14);
        Tolerance.Close(Gains.Kp, onMeasurement.Step(1.0, 0.0), 1e-15);
    }

    [Fact]
    public void Incremental_UnsaturatedMatchesPositional()
    {
        var positional = new PidImplementation(Gains, 0.01, -1e9, 1e9, AntiWindup.None);
        var incremental = new PidImplementation(Gains, 0.01, -1e9, 1e9, AntiWindup.None, incremental: true);
        var random = new Random(3);
        for (var k = 0; k < 500; k++)
        {
            var r = Math.Sin(0.01 * k);
            var y = (random.NextDouble() - 0.5) * 0.1;
            var a = positional.Step(r, y);
            var b = incremental.Step(r, y);
            Tolerance.Close(a, b, 1e-9, 1e-9, $"k={k}");
        }
    }

    [Theory]
    [InlineData(AntiWindup.Clamping, false, false, 0.0, -1.0, 1.0, false)]
    [InlineData(AntiWindup.BackCalculation, false, false, 0.0, -1.0, 1.0, false)]
    [InlineData(AntiWindup.None, true, false, 0.0, -1.0, 1.0, false)]
    [InlineData(AntiWindup.Clamping, false, true, 0.0, -1.0, 1.0, false)]
    [InlineData(AntiWindup.BackCalculation, false, true, 0.0, -1.0, 1.0, false)]
    [InlineData(AntiWindup.None, true, true, 0.0, -1.0, 1.0, false)]
    [InlineData(AntiWindup.Clamping, false, false, 0.35, 0.0, 1.0, false)]
    [InlineData(AntiWindup.BackCalculation, false, true, 0.35, 0.0, 1.0, false)]
    [InlineData(AntiWindup.None, true, true, 0.35, 0.0, 1.0, false)]
    [InlineData(AntiWindup.Clamping, false, false, 0.0, -1.0, 1.0, true)]
    [InlineData(AntiWindup.BackCalculation, false, true, 0.35, 0.0, 1.0, true)]
    [InlineData(AntiWindup.None, true, true, 0.0, -1.0, 1.0, true)]
    public void Generate_CompilesAndMatchesReferenceBitForBitOnASaturatingRun(AntiWindup scheme, bool incremental, bool single, double u0, double low, double high, bool onError)
    {
        var reference = new PidImplementation(Gains, 0.01, low, high, scheme, incremental: incremental, operatingPoint: u0, singlePrecision: single, derivativeOnError: onError);
        var random = new Random(11);
        // A failed sensor read (NaN) at k = 150 and an infinite reference at k = 300: the output is held and the
        // fault flag set, and the loop goes on from the states as they were.
        var rows = Enumerable.Range(0, 400).Select(k => (R: k == 300 ? double.PositiveInfinity : k < 200 ? 5.0 : -3.0, Y: k == 150 ? double.NaN : (k < 200 ? 5.0 : -3.0) - (0.8 * Math.Sin(0.05 * k)) + ((random.NextDouble() - 0.5) * 0.05))).ToList();
        var expected = rows.Select(row => reference.Step(row.R, row.Y)).ToList();
        Assert.Contains(high, expected);
        Assert.Contains(low, expected);
        Assert.Equal(expected[149], expected[150]);
        Assert.Equal(expected[299], expected[300]);
        Assert.True(reference.Fault);
        Assert.Contains(expected, v => v > low && v < high);
        Assert.Equal(single, expected.All(v => (float)v == v));

        var directory = Directory.CreateTempSubdirectory("compassist-pid-").FullName;
        try
        {
            var (header, source) = PidCodeGenerator.Generate("pid_ctrl", reference, "test");
            File.WriteAllText(Path.Combine(directory, "pid_ctrl.h"), header);
            File.WriteAllText(Path.Combine(directory, "pid_ctrl.c"), source);
            static string C(double v) => double.IsNaN(v) ? "NAN" : double.IsPositiveInfinity(v) ? "INFINITY" : v.ToString("R", CultureInfo.InvariantCulture);
            var calls = string.Join("\n", rows.Select(r => $"    printf(\"%.17g\\n\", (double)pid_ctrl_step(&s, {C(r.R)}, {C(r.Y)}));"));
            File.WriteAllText(Path.Combine(directory, "main.c"), "#include <math.h>\n#include <stdio.h>\n#include \"pid_ctrl.h\"\nint main(void)\n{\n    pid_ctrl_state s;\n    pid_ctrl_init(&s);\n" + calls + "\n    printf(\"%d\\n\", s.fault);\n    return 0;\n}\n");
            CCompiler.Compile(directory, "-O2", "main.c pid_ctrl.c");
            var outputs = CCompiler.Run(Path.Combine(directory, "test"), string.Empty, directory).Output
                .Split('\n', StringSplitOptions.RemoveEmptyEntries).Select(v => double.Parse(v, CultureInfo.InvariantCulture)).ToList();
            Assert.Equal(1.0, outputs[^1]); // the fault flag
            outputs.RemoveAt(outputs.Count - 1);
            Assert.Equal(expected.Count, outputs.Count);
            for (var k = 0; k < expected.Count; k++)
            {
                Assert.True(expected[k] == outputs[k], $"k={k}: the reference gives {expected[k]:R}, the compiled code {outputs[k]:R}");
            }
        }
        finally
        {
            Directory.Delete(directory, recursive: true);
        }
    }
}
