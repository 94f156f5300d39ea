using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Proof;

/// <summary>Margins against hand-derivable loops (common practice).</summary>
public class MarginAnalyzerTests
{
    private static StabilityMargins Of(string plant, string compensator = "1") =>
        MarginAnalyzer.Analyze(Loop.Create(ExpressionParser.ParseProper(plant).Value!), ExpressionParser.Parse(compensator, false).Value!);

    [Fact]
    public void Analyze_ThreePoles_GainMarginFromRouthBoundary()
    {
        // K/(s(s+1)(s+2)) crosses −180° at ω = √2 where |L| = K/6, so GM = 20·log10(6/K) (Routh).
        var m = Of("1/(s(s+1)(s+2))");
        Tolerance.Close(Math.Sqrt(2), m.PhaseCrossover, 1e-10);
        Tolerance.Close(20 * Math.Log10(6), m.GainMarginDb, 1e-10);
    }

    [Fact]
    public void Analyze_FirstOrder_PhaseAndDelayMargin()
    {
        // 2/(s+1): |L| = 1 at ω = √3, ∠L = −60°, PM = 120°, delay margin (2π/3)/√3; no phase crossover.
        var m = Of("2/(s+1)");
        Tolerance.Close(Math.Sqrt(3), m.GainCrossover, 1e-10);
        Tolerance.Close(120.0, m.PhaseMarginDeg, 1e-9);
        Tolerance.Close(2 * Math.PI / 3 / Math.Sqrt(3), m.DelayMargin, 1e-9);
        Assert.True(double.IsPositiveInfinity(m.GainMarginDb));
    }

    [Fact]
    public void Analyze_IntegratorWithDelay_ExactDelayPhase()
    {
        // e^{−0.3s}/s: crossover at ω = 1, PM = 90° − 0.3 rad, delay margin π/2 − 0.3 s; the phase reaches
        // −180° at ω = (π/2)/0.3 where |L| = 0.6/π, so GM = 20·log10(π/0.6).
        var m = Of("exp(-0.3s)/s");
        Tolerance.Close(1.0, m.GainCrossover, 1e-10);
        Tolerance.Close(90 - (0.3 * 180 / Math.PI), m.PhaseMarginDeg, 1e-8);
        Tolerance.Close((Math.PI / 2) - 0.3, m.DelayMargin, 1e-9);
        Tolerance.Close(Math.PI / 2 / 0.3, m.PhaseCrossover, 1e-9);
        Tolerance.Close(20 * Math.Log10(Math.PI / 0.6), m.GainMarginDb, 1e-8);
    }

    [Fact]
    public void Analyze_SecondOrderLoop_SensitivityPeakMatchesDenseScan()
    {
        // K/(s(s+1)) with K = 4: PM = 90° − atan(ωc), ωc² √(1+ωc²)... solved as ωc⁴ + ωc² − 16 = 0.
        var m = Of("4/(s(s+1))");
        var wc = Math.Sqrt((-1 + Math.Sqrt(1 + 64)) / 2);
        Tolerance.Close(wc, m.GainCrossover, 1e-10);
        Tolerance.Close(90 - (Math.Atan(wc) * 180 / Math.PI), m.PhaseMarginDeg, 1e-8);
        var best = 0.0;
        for (var w = 0.01; w < 20; w += 1e-4)
        {
            var l = 4 / (new System.Numerics.Complex(0, w) * new System.Numerics.Complex(1, w));
            best = Math.Max(best, 1 / System.Numerics.Complex.Abs(1 + l));
        }

        Tolerance.Close(best, m.SensitivityPeak, 1e-6);
    }
}
