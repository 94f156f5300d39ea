using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Proof;

/// <summary>
/// The load-disturbance and closed-loop frequency figures against the second-order closed forms (common practice;
/// e.g. Ogata, Modern Control Engineering, 5th ed., on the resonant peak Mr = 1/(2ζ√(1 − ζ²)) at
/// ωr = ωn√(1 − 2ζ²), and the bandwidth ωB = ωn·√(1 − 2ζ² + √(4ζ⁴ − 4ζ² + 2))), and |S| against the margin analysis.
/// </summary>
public class DisturbanceAndFrequencyFiguresTests
{
    private static Loop LoopOf(string plant) => Loop.Create(ExpressionParser.Parse(plant, requireProper: true).Value!);

    [Fact]
    public void Frequency_SecondOrderLoop_MatchesTheResonancePeakAndBandwidthFormulas()
    {
        // ωn²/(s(s + 2ζωn)) under unity feedback: T = ωn²/(s² + 2ζωn s + ωn²), ζ = 0.3, ωn = 2.
        double zeta = 0.3, wn = 2.0;
        var loop = LoopOf($"{wn * wn}/(s(s+{2 * zeta * wn}))");
        var report = LoopCheck.Run(loop, TransferFunction.Constant(1.0), new CheckOptions());
        var f = report.Frequency!;
        Tolerance.Close(1 / (2 * zeta * Math.Sqrt(1 - (zeta * zeta))), f.ComplementaryPeak, 1e-9, what: "Mr");
        Tolerance.Close(wn * Math.Sqrt(1 - (2 * zeta * zeta)), f.ComplementaryPeakFrequency, 1e-5, what: "ωr");
        var z2 = zeta * zeta;
        Tolerance.Close(wn * Math.Sqrt(1 - (2 * z2) + Math.Sqrt((4 * z2 * z2) - (4 * z2) + 2)), f.Bandwidth, 1e-9, what: "ωB");
        // With C = 1, |C·S| is |S|: its peak is the margin analysis's Ms, found there by another route.
        Tolerance.Close(report.Margins!.SensitivityPeak, f.NoisePeak, 1e-7, what: "max |S| against Ms");
        Tolerance.Close(report.Margins.SensitivityPeakFrequency, f.NoisePeakFrequency, 1e-4, what: "where");
    }

    [Fact]
    public void LoadDisturbance_ProportionalControl_MatchesTheSecondOrderStep()
    {
        // 1/(s(s+1)) under K = 4: y/d = 1/(s² + s + 4), ωn = 2, ζ = 0.25: offset 1/4, peak (1/4)(1 + e^(−πζ/√(1 − ζ²)))
        // at π/ωd; the envelope (1/4)e^(−ζωn t)/√(1 − ζ²) is inside 2 % of the peak after about 7.15 s.
        var report = LoopCheck.Run(LoopOf("1/(s(s+1))"), TransferFunction.Constant(4.0), new CheckOptions());
        var d = report.LoadDisturbance!;
        var zeta = 0.25;
        var root = Math.Sqrt(1 - (zeta * zeta));
        Tolerance.Close(0.25, d.Offset, 1e-12, what: "offset 1/K");
        Tolerance.Close(0.25 * (1 + Math.Exp(-Math.PI * zeta / root)), d.Peak, 1e-4, what: "peak");
        Tolerance.Close(Math.PI / (2 * root), d.PeakTime, 0.01, what: "peak time");
        var envelope = Math.Log(0.25 / (0.02 * d.Peak * root)) / (zeta * 2);
        Assert.InRange(d.RecoveryTime, 0.75 * envelope, envelope + 0.05);
    }

    [Fact]
    public void LoadDisturbance_IntegralAction_LeavesNoOffset()
    {
        var report = LoopCheck.Run(LoopOf("1/(s(s+1))"), ExpressionParser.Parse("4(s+0.5)/s", requireProper: true).Value!, new CheckOptions());
        Assert.True(report.Stable);
        Assert.Equal(0.0, report.LoadDisturbance!.Offset, 12);
        Assert.True(report.LoadDisturbance.Peak > 0.1);
        Assert.True(double.IsFinite(report.LoadDisturbance.RecoveryTime));
    }

    [Fact]
    public void Frequency_ImproperCompensator_NoisePeakIsUnbounded()
    {
        // C = 4(s + 2): C·S → 4s as ω → ∞; a sweep's edge value is no peak.
        var report = LoopCheck.Run(LoopOf("1/(s(s+1))"), ExpressionParser.Parse("4(s+2)", requireProper: false).Value!, new CheckOptions());
        Assert.True(double.IsPositiveInfinity(report.Frequency!.NoisePeak));
    }
}
