using System.Globalization;
using CompAssist.Core.Cases;
using CompAssist.Core.Discrete;
using CompAssist.Core.Export;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Tests.Support;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Tests.Export;

/// <summary>
/// The hand-off's PID as a firmware engineer receives it: the C compiled under the strict warning set and run on
/// the package's closed-loop vector (bit for bit, double and float), and its closed-loop figures against a
/// continuous simulation written here (classical Runge–Kutta on the plant, sensor, integral and derivative filter).
/// </summary>
public class PidExportTests
{
    private static readonly Lazy<DesignReport> HeaterDesign = new(SearchHeater);

    private static DesignReport Heater() => HeaterDesign.Value;

    private static DesignReport SearchHeater()
    {
        var (input, error) = CaseFileReader.ReadFile(Path.Combine(Repository.Root(), "cases", "heater-stage.toml"));
        Assert.Null(error);
        var run = DesignWorkflow.Search(input!, new CompAssist.Core.Search.SearchOptions());
        Assert.True(run.IsSuccess, run.Problem?.ToString());
        return run.Report!;
    }

    [Theory]
    [InlineData("double", false)]
    [InlineData("float", false)]
    [InlineData("float", true)]
    [InlineData("fixed16", false)]
    [InlineData("fixed24", true)]
    public void Build_HeaterPid_CompiledCodeReproducesTheClosedLoopVectorBitForBit(string format, bool onError)
    {
        var options = new HandoffOptions { Name = "heat", Format = NumberFormat.TryParse(format)!, DerivativeOnError = onError, AntiWindup = AntiWindup.BackCalculation };
        var package = HandoffPackage.Build(Heater(), options, "heater").Value!;
        Assert.NotNull(package.Pid);
        var rows = package.Files["heat_pid-vectors.csv"].Split('\n', StringSplitOptions.RemoveEmptyEntries)
            .Where(l => char.IsAsciiDigit(l[0])).Select(l => l.Split(',')).ToList();
        Assert.Equal(PidExport.VectorSamples, rows.Count);
        var integers = package.Pid!.Controller.FixedPoint is { } engine;
        // A float vector prints each float's shortest round-trip text: read it back as a float.
        var expected = rows.Select(r => format == "float" ? float.Parse(r[3], CultureInfo.InvariantCulture) : double.Parse(r[3], CultureInfo.InvariantCulture)).ToList();
        Assert.Contains(integers ? package.Pid.Controller.FixedPoint!.High : 100.0, expected);
        if (!integers)
        {
            // Integers cannot carry a failed read: only the real-valued vectors have one.
            Assert.Equal("nan", rows[200][2]);
            Assert.Equal(expected[199], expected[200]);
        }

        var directory = Directory.CreateTempSubdirectory("compassist-pid-export-").FullName;
        try
        {
            File.WriteAllText(Path.Combine(directory, "heat_pid.h"), package.Files["heat_pid.h"]);
            File.WriteAllText(Path.Combine(directory, "heat_pid.c"), package.Files["heat_pid.c"]);
            var calls = string.Join("\n", rows.Select(r => $"    printf(\"%.17g\\n\", (double)heat_pid_step(&s, {r[1]}, {(r[2] == "nan" ? "NAN" : r[2])}));"));
            var fault = integers ? "1" : "s.fault";
            File.WriteAllText(Path.Combine(directory, "main.c"), "#include <math.h>\n#include <stdio.h>\n#include \"heat_pid.h\"\nint main(void)\n{\n    heat_pid_state s;\n    heat_pid_init(&s);\n" + calls + $"\n    printf(\"%d\\n\", {fault});\n    return 0;\n}}\n");
            CCompiler.Compile(directory, "-O2", "main.c heat_pid.c");
            var outputs = CCompiler.Run(Path.Combine(directory, "test"), string.Empty, directory).Output
                .Split('\n', StringSplitOptions.RemoveEmptyEntries).Select(v => double.Parse(v, CultureInfo.InvariantCulture)).ToList();
            Assert.Equal(1.0, outputs[^1]);
            for (var k = 0; k < expected.Count; k++)
            {
                Assert.True(expected[k] == outputs[k], $"k = {k}: vector {expected[k]:R}, compiled {outputs[k]:R}");
            }
        }
        finally
        {
            Directory.Delete(directory, recursive: true);
        }
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Run_HeaterGainsAtFastSampling_MatchesAContinuousRungeKuttaSimulation(bool onError)
    {
        // The demo's searched PID (parallel gains of its C(s)) on 0.1/((s+0.1)(s+0.5)) with the sensor 1/(s+1), sampled at
        // 5 ms: the exported PID's step figures must approach those of the continuous PID with the same derivative
        // placement, integrated here by RK4 at 1 ms.
        var report = Heater();
        var forms = report.Design.Compensator.Pid!;
        var pid = new PidImplementation(forms, 0.005, -1e6, 1e6, AntiWindup.Clamping, derivativeOnError: onError);
        var proof = ExportedPidProof.Run(report.Design.Loop, report.Check, pid, computationDelay: false);
        var (overshoot, settling) = ContinuousPid(forms, onError);
        Tolerance.Close(overshoot, proof.Reference.OvershootPercent, 0.05, 0.1, "overshoot %");
        Tolerance.Close(settling, proof.Reference.SettlingTime2Percent, 0.03, 0.0, "2 % settling");
    }

    [Fact]
    public void Build_FixedPointPidBeyondTwentyFourBits_RefusedWithItsReasonAndNoPidFiles()
    {
        var package = HandoffPackage.Build(Heater(), new HandoffOptions { Name = "heat", Format = NumberFormat.TryParse("fixed32")! }, "heater").Value!;
        Assert.Null(package.Pid);
        Assert.DoesNotContain(package.Files.Keys, k => k.Contains("_pid", StringComparison.Ordinal));
        Assert.Contains("NO PID CODE for fixed32: the fixed-point PID supports words up to 24 bits", package.SampleTimeNote, StringComparison.Ordinal);
    }

    [Fact]
    public void Build_HeaterPidInSixteenBits_ProvedAsTheIntegerModelAndCloseToDouble()
    {
        // The 0…100 % heater command fits 16 bits with 8 fractional bits; the fixed-point PID as exported must give
        // nearly the figures of the double one (its input LSB 2^-7 of a unit reference step is the difference).
        var fixedPoint = HandoffPackage.Build(Heater(), new HandoffOptions { Name = "heat", Format = NumberFormat.TryParse("fixed16")!, DerivativeOnError = true, SampleTime = 0.05 }, "heater").Value!.Pid!;
        var real = HandoffPackage.Build(Heater(), new HandoffOptions { Name = "heat", DerivativeOnError = true, SampleTime = 0.05 }, "heater").Value!.Pid!;
        var engine = fixedPoint.Controller.FixedPoint!;
        Assert.Equal(8, engine.OutputFractionBits);
        Assert.Equal(100 * 256, engine.High);
        Assert.Equal(0, engine.Low);
        Assert.True(fixedPoint.Meets, ExportedPidProof.Describe(fixedPoint));
        Tolerance.Close(real.Reference.SettlingTime2Percent, fixedPoint.Reference.SettlingTime2Percent, 0.15, 0.0, "2 % settling");
        Tolerance.Close(real.Reference.OvershootPercent, fixedPoint.Reference.OvershootPercent, 0.0, 1.0, "overshoot %");
    }

    [Fact]
    public void Build_LeadDesignWithAntiWindupChosen_SaysItHasNoEffect()
    {
        var (input, _) = CaseFileReader.ReadFile(Path.Combine(Repository.Root(), "cases", "belt-axis.toml"));
        var report = DesignWorkflow.Run(input!).Report!;
        var package = HandoffPackage.Build(report, new HandoffOptions { Name = "belt", AntiWindup = AntiWindup.BackCalculation }, "belt").Value!;
        Assert.Contains("anti-windup setting (back-calculation) has no effect", package.SampleTimeNote, StringComparison.Ordinal);
        var quiet = HandoffPackage.Build(report, new HandoffOptions { Name = "belt" }, "belt").Value!;
        Assert.DoesNotContain("anti-windup", quiet.SampleTimeNote, StringComparison.Ordinal);
    }

    /// <summary>
    /// y = 0.1/((s+0.1)(s+0.5)) u, m = y/(s+1), u = Kp·e + Ki·∫e + D with D = Kd·s/(Tf·s + 1) of e or of −m; a step of 1.
    /// </summary>
    private static (double Overshoot, double Settling) ContinuousPid(PidForms f, bool onError)
    {
        const double h = 1e-3;
        double[] Derivative(double[] x)
        {
            var (x1, x2, m, integral, filter) = (x[0], x[1], x[2], x[3], x[4]);
            var e = 1.0 - m;
            var signal = onError ? e : -m;
            var u = (f.Kp * e) + (f.Ki * integral) + (f.Kd / f.Tf * (signal - filter));
            return [(-0.1 * x1) + u, (-0.5 * x2) + x1, -m + (0.1 * x2), e, (signal - filter) / f.Tf];
        }

        // The filter state starts at the signal's value before the step (0): on the error the step then kicks.
        var state = new double[5];
        var peak = 0.0;
        var lastOutside = 0.0;
        for (var k = 1; k <= 100_000; k++)
        {
            var k1 = Derivative(state);
            var k2 = Derivative([.. state.Select((v, i) => v + (h / 2 * k1[i]))]);
            var k3 = Derivative([.. state.Select((v, i) => v + (h / 2 * k2[i]))]);
            var k4 = Derivative([.. state.Select((v, i) => v + (h * k3[i]))]);
            state = [.. state.Select((v, i) => v + (h / 6 * (k1[i] + (2 * k2[i]) + (2 * k3[i]) + k4[i])))];
            var y = 0.1 * state[1];
            peak = Math.Max(peak, y);
            if (Math.Abs(y - 1) > 0.02)
            {
                lastOutside = k * h;
            }
        }

        return (Math.Max(0, 100 * (peak - 1)), lastOutside);
    }
}
