using System.Globalization;
using CompAssist.Core.Export;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Export;

/// <summary>
/// The fixed-point PID: the integer model against the compiled C (bit for bit, the strict warning set), against the
/// PID in double (the same controller within its resolution), and its scaling and rounding rules.
/// </summary>
public class FixedPointPidTests
{
    private static readonly PidForms Gains = PidForms.FromParallel(kp: 2.0, ki: 1.5, kd: 0.4, tf: 0.04);

    // A run that saturates both ways, leaves the input word at k in [250, 260) and has a noisy measurement.
    private static List<(double R, double Y)> Rows()
    {
        var random = new Random(5);
        return [.. Enumerable.Range(0, 400).Select(k => (R: k < 200 ? 5.0 : -3.0, Y: k is >= 250 and < 260 ? 1e6 : (k < 200 ? 5.0 : -3.0) - (0.8 * Math.Sin(0.05 * k)) + ((random.NextDouble() - 0.5) * 0.05)))];
    }

    [Theory]
    [InlineData(AntiWindup.Clamping, false, 16, 9, 12, 0.0, -1.0, 1.0, 1.0)]
    [InlineData(AntiWindup.BackCalculation, false, 16, 9, 12, 0.0, -1.0, 1.0, 1.0)]
    [InlineData(AntiWindup.None, true, 16, 9, 12, 0.0, -1.0, 1.0, 1.0)]
    [InlineData(AntiWindup.BackCalculation, true, 24, 17, 20, 0.35, 0.0, 1.0, 1.0)]
    [InlineData(AntiWindup.Clamping, false, 24, 0, 23, 0.35, 0.0, 1.0, 1.0)]
    [InlineData(AntiWindup.Clamping, true, 12, 6, 4, 20.0, 0.0, 100.0, 300.0)]
    [InlineData(AntiWindup.BackCalculation, false, 8, 3, 0, 20.0, 0.0, 100.0, 0.001)]
    public void Step_CompiledCodeIsBitExactWithTheModel(AntiWindup scheme, bool onError, int word, int inputBits, int outputBits, double u0, double low, double high, double gainScale)
    {
        // gainScale 300 makes Kp a left shift at 12 bits; 0.001 makes every coefficient a long right shift at 8 bits.
        var gains = PidForms.FromParallel(kp: 2.0 * gainScale, ki: 1.5 * gainScale, kd: 0.4 * gainScale, tf: 0.04);
        var pid = new PidImplementation(gains, 0.01, low, high, scheme, operatingPoint: u0, derivativeOnError: onError).InFixedPoint(word, inputBits, outputBits);
        var model = pid.FixedPoint!.Twin();
        var rows = Rows().Select(r => (R: model.ToInput(r.R), Y: model.ToInput(r.Y))).ToList();
        var expected = rows.Select(r => model.Step(r.R, r.Y)).ToList();
        Assert.Contains(expected, v => v > model.Low && v < model.High);
        if (gainScale >= 1)
        {
            Assert.Contains(model.High, expected);
            Assert.Contains(model.Low, expected);
        }

        var (header, source) = FixedPointPidCodeGenerator.Generate("fx_pid", pid, "test");
        var calls = string.Join("\n", rows.Select(r => $"    printf(\"%ld\\n\", (long)fx_pid_step(&s, {r.R}, {r.Y}));"));
        var main = "#include <stdio.h>\n#include \"fx_pid.h\"\nint main(void)\n{\n    fx_pid_state s;\n    fx_pid_init(&s);\n" + calls + "\n    return 0;\n}\n";
        var outputs = CCompiler.BuildAndRun(new Dictionary<string, string> { ["fx_pid.h"] = header, ["fx_pid.c"] = source, ["main.c"] = main })
            .Select(v => long.Parse(v, CultureInfo.InvariantCulture)).ToList();
        Assert.Equal(expected, outputs);
    }

    [Theory]
    [InlineData(AntiWindup.Clamping, false)]
    [InlineData(AntiWindup.BackCalculation, true)]
    [InlineData(AntiWindup.None, false)]
    public void Step_TwentyFourBits_FollowsTheDoublePidWithinItsResolution(AntiWindup scheme, bool onError)
    {
        // The same controller in double is the reference (common practice: a fixed-point implementation is checked
        // against its floating-point model). Input LSB 2^-16 (range ±128), command LSB 2^-21 (range ±4).
        var real = new PidImplementation(Gains, 0.01, -1.0, 1.0, scheme, derivativeOnError: onError);
        var fixedPoint = real.InFixedPoint(24, 16, 21);
        var rows = Rows().Where((_, k) => k is < 250 or >= 260).ToList();
        var gap = rows.Max(r => Math.Abs(real.Step(r.R, r.Y) - fixedPoint.Step(r.R, r.Y)));
        // Input rounding (2^-17) through Kp + 2·Kd/(Tf + T) ≈ 18, plus the integral's share, within 1e-3 of the span.
        Assert.InRange(gap, 1e-9, 2e-3);
    }

    [Fact]
    public void Step_TinyIntegralStep_StillAccumulatesThroughTheGuardBits()
    {
        // Ki·T·e far below one command LSB per sample (16-bit command with 8 fractional bits: LSB 0.0039; Ki·T·e =
        // 1e-4): without guard bits the integral would never move (a known fixed-point pitfall, common practice).
        var gains = PidForms.FromParallel(kp: 0.0, ki: 0.01, kd: 0.0, tf: 0.0);
        var pid = new PidImplementation(gains, 0.01, -10, 10, AntiWindup.Clamping).InFixedPoint(16, 8, 8);
        var u = 0.0;
        for (var k = 0; k < 10_000; k++)
        {
            u = pid.Step(1.0, 0.0);
        }

        // ∫ Ki·e dt over 100 s = 1.0 (forward accumulation: 9,999 increments of 1e-4).
        Tolerance.Close(0.9999, u, 0.0, 2.0 / 256, "integral after 100 s");
    }

    [Fact]
    public void ScaleSaturate_RoundsHalvesAwayFromZeroAndSaturatesLeftShifts()
    {
        Assert.Equal(2, FixedPointPid.ScaleSaturate(3, 1, 100));
        Assert.Equal(-2, FixedPointPid.ScaleSaturate(-3, 1, 100));
        Assert.Equal(1, FixedPointPid.ScaleSaturate(5, 2, 100));
        Assert.Equal(48, FixedPointPid.ScaleSaturate(3, -4, 100));
        Assert.Equal(100, FixedPointPid.ScaleSaturate(7, -4, 100));
        Assert.Equal(-100, FixedPointPid.ScaleSaturate(-7, -4, 100));
        Assert.Equal(100, FixedPointPid.ScaleSaturate(1000, 2, 100));
    }

    [Fact]
    public void ScaledCoefficientOf_RandomValues_FitTheWordAndKeepItsPrecision()
    {
        var random = new Random(3);
        for (var i = 0; i < 5_000; i++)
        {
            var word = random.Next(8, 25);
            var c = (random.NextDouble() < 0.5 ? -1 : 1) * Math.Pow(10, (random.NextDouble() * 16) - 8);
            var q = ScaledCoefficient.Of(c, word);
            Assert.InRange(Math.Abs(q.Mantissa), 1L << (word - 2), (1L << (word - 1)) - 1);
            Assert.True(Math.Abs(q.Value - c) <= Math.Abs(c) * Math.Pow(2, 2 - word), $"{c:R} in {word} bits: {q.Value:R}");
        }
    }

    [Fact]
    public void Create_WordOverTwentyFourBitsOrIncremental_Throws()
    {
        var pid = new PidImplementation(Gains, 0.01, -1.0, 1.0, AntiWindup.Clamping);
        Assert.Throws<ArgumentException>(() => pid.InFixedPoint(25, 8, 8));
        Assert.Throws<ArgumentException>(() => pid.InFixedPoint(16, 16, 8));
        var incremental = new PidImplementation(Gains, 0.01, -1.0, 1.0, AntiWindup.Clamping, incremental: true);
        Assert.Throws<ArgumentException>(() => incremental.InFixedPoint(16, 8, 8));
    }
}
