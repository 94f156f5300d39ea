using CsCheck;
using System.Numerics;
using CompAssist.Core.Discrete;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Simulation;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Discrete;

/// <summary>
/// Discrete equivalents against the standard table entries (Franklin, Powell and Workman, Digital Control of
/// Dynamic Systems, 3rd ed., chapter 6 and its ZOH table; from memory) and against independent computations.
/// </summary>
public class DiscretizerTests
{
    private static TransferFunction FromText(string text) => ExpressionParser.Parse(text, requireProper: false).Value!;

    private static DiscreteTransferFunction Of(string c, double t, DiscretizationMethod m, double? w = null)
    {
        var r = Discretizer.Discretize(FromText(c), t, m, w);
        Assert.True(r.IsSuccess, r.Problem?.ToString());
        return r.Value.Discrete;
    }

    private static void SameCoefficients(double[] expected, IReadOnlyList<double> actual, double tolerance = 1e-12)
    {
        Assert.Equal(expected.Length, actual.Count);
        for (var i = 0; i < expected.Length; i++)
        {
            Tolerance.Close(expected[i], actual[i], tolerance, 1e-15, $"coefficient {i}");
        }
    }

    [Fact]
    public void Zoh_FirstOrderLag_MatchesTable()
    {
        // a/(s + a) → (1 − e^{−aT}) z⁻¹ / (1 − e^{−aT} z⁻¹).
        double a = 3, t = 0.1, e = Math.Exp(-a * t);
        var d = Of("3/(s+3)", t, DiscretizationMethod.Zoh);
        SameCoefficients([0, 1 - e], d.Numerator);
        SameCoefficients([1, -e], d.Denominator);
    }

    [Fact]
    public void Zoh_DoubleIntegrator_MatchesTable()
    {
        // 1/s² → T²(z + 1)/(2(z − 1)²) = (T²/2)(z⁻¹ + z⁻²)/(1 − 2z⁻¹ + z⁻²).
        var t = 0.05;
        var d = Of("1/s^2", t, DiscretizationMethod.Zoh);
        SameCoefficients([0, t * t / 2, t * t / 2], d.Numerator, 1e-9);
        SameCoefficients([1, -2, 1], d.Denominator, 1e-12);
    }

    [Fact]
    public void Zoh_IntegratorWithLag_MatchesTable()
    {
        // 1/(s(s + a)) → [(aT − 1 + e^{−aT}) z + (1 − e^{−aT} − aT e^{−aT})] / (a²(z − 1)(z − e^{−aT})).
        double a = 2, t = 0.2, e = Math.Exp(-a * t);
        var d = Of("1/(s(s+2))", t, DiscretizationMethod.Zoh);
        SameCoefficients([0, ((a * t) - 1 + e) / (a * a), (1 - e - (a * t * e)) / (a * a)], d.Numerator, 1e-10);
        SameCoefficients([1, -(1 + e), e], d.Denominator);
    }

    [Fact]
    public void Zoh_StepAtSamples_EqualsContinuousStep()
    {
        // Independent check: the ZOH equivalent reproduces the continuous step response at the samples.
        var g = FromText("10(s+2)/((s+1)(s^2+2s+10))");
        var t = 0.02;
        var d = Discretizer.ZeroOrderHold(g, t);
        var y = d.Filter(Enumerable.Repeat(1.0, 300).ToArray());
        var continuous = StepSimulator.Step(CascadeRealization.Of(g), t, 300);
        for (var k = 0; k < 300; k++)
        {
            // The sampled output at k responds to inputs up to k − 1 (one-sample delay of a strictly proper G).
            Tolerance.Close(continuous.Values[k], y[k], 0, 1e-10, $"k={k}");
        }
    }

    [Fact]
    public void Zoh_SlowHighOrderAtAFastRate_KeepsTheDcGain()
    {
        // The ZOH equivalent is step invariant, so C(z = 1) = C(s = 0) (common practice; Franklin, Powell and
        // Workman, Digital Control of Dynamic Systems, 3rd ed., ch. 6). Slow corners at a fast rate crowd poles and
        // zeros against z = 1, where roots of an expanded numerator lose them (a fifth-order lag at 0.5 ms gave 21.6
        // for 7.09); the factored result evaluated at z = 1 must keep the DC gain.
        Gen.Select(Gen.Double[0.05, 5].Array[3, 6], Gen.Double[0.05, 5].Array[0, 2], Gen.Double[1e-4, 1e-2]).Sample((poles, zeros, t) =>
        {
            var text = FormattableString.Invariant($"2 {string.Concat(zeros.Select(z => $"(s+{z})"))}/({string.Concat(poles.Select(p => $"(s+{p})"))})");
            var g = FromText(text);
            Tolerance.Close(g.DcGain, Discretizer.ZeroOrderHold(g, t).DcGain, 1e-6, what: $"{text} at T = {t}");
        }, iter: 300);
    }

    [Fact]
    public void Backward_IdealPd_TheCausalDifferenceByHand()
    {
        // s → (1 − z⁻¹)/T (backward rectangular rule; common practice): 2 + 0.5s at T = 0.01 becomes
        // (2 + 0.5/T) − (0.5/T) z⁻¹ = 52 − 50 z⁻¹.
        var d = Of("2+0.5s", 0.01, DiscretizationMethod.Backward);
        SameCoefficients([52.0, -50.0], d.Numerator, 1e-12);
        SameCoefficients([1.0, 0.0], d.Denominator);
    }

    [Fact]
    public void Backward_IdealPid_EqualsTheRuleTermByTerm()
    {
        // Kp + Ki/s + Kd·s with s → (z − 1)/(Tz): Kp + Ki·T·z/(z − 1) + Kd·(z − 1)/(T·z), at any z.
        const double kp = 3, ki = 2, kd = 0.25, t = 0.02;
        var d = Of($"{kp}+{ki}/s+{kd}s", t, DiscretizationMethod.Backward);
        foreach (var z in new[] { new Complex(0.3, 0.4), new Complex(-0.7, 0.1), new Complex(2, -1) })
        {
            var expected = kp + (ki * t * z / (z - 1)) + (kd * (z - 1) / (t * z));
            var actual = d.Evaluate(z);
            Assert.True(Complex.Abs(actual - expected) <= 1e-10 * Complex.Abs(expected), $"z = {z}: {actual} vs {expected}");
        }
    }

    [Theory]
    [InlineData(DiscretizationMethod.Tustin, "z = −1")]
    [InlineData(DiscretizationMethod.Zoh, "no causal sampled form")]
    [InlineData(DiscretizationMethod.Matched, "no causal sampled form")]
    public void Discretize_IdealDerivativeByAnotherMethod_RefusedPointingToBackwardEuler(DiscretizationMethod method, string reason)
    {
        var r = Discretizer.Discretize(FromText("2+0.5s"), 0.01, method);
        Assert.False(r.IsSuccess);
        Assert.Contains(reason, r.Problem!.Message, StringComparison.Ordinal);
        Assert.Contains("backward Euler", r.Problem.Hint, StringComparison.Ordinal);
    }

    [Fact]
    public void Tustin_FirstOrder_MatchesBilinearByHand()
    {
        // a/(s + a) with s = (2/T)(z − 1)/(z + 1): aT(1 + z⁻¹)/((2 + aT) − (2 − aT) z⁻¹).
        double a = 5, t = 0.01;
        var d = Of("5/(s+5)", t, DiscretizationMethod.Tustin);
        SameCoefficients([a * t / (2 + (a * t)), a * t / (2 + (a * t))], d.Numerator);
        SameCoefficients([1, -(2 - (a * t)) / (2 + (a * t))], d.Denominator);
    }

    [Fact]
    public void Prewarp_IsExactAtItsFrequency()
    {
        var c = FromText("4.7(s+2.93)/(s+5.46)");
        double t = 0.05, w = 8;
        var d = Of("4.7(s+2.93)/(s+5.46)", t, DiscretizationMethod.Prewarp, w);
        Tolerance.Close(c.Evaluate(new Complex(0, w)), d.Evaluate(Complex.FromPolarCoordinates(1, w * t)), 1e-12);
    }

    [Fact]
    public void Matched_MapsPolesAndKeepsDcGain()
    {
        double t = 0.1;
        var d = Of("2(s+3)/((s+1)(s+10))", t, DiscretizationMethod.Matched);
        Tolerance.SameRoots([new Complex(Math.Exp(-t), 0), new Complex(Math.Exp(-10 * t), 0)], d.Poles, 1e-14);
        Tolerance.SameRoots([new Complex(Math.Exp(-3 * t), 0), new Complex(-1, 0)], d.Zeros, 1e-14);
        Tolerance.Close(2.0 * 3 / 10, d.DcGain, 1e-12);
    }

    [Fact]
    public void Backward_FirstOrder_MatchesByHand()
    {
        // 1/(s + 1), s = (z − 1)/(zT): T/((1 + T) − z⁻¹).
        var t = 0.1;
        var d = Of("1/(s+1)", t, DiscretizationMethod.Backward);
        SameCoefficients([t / (1 + t), 0], d.Numerator);
        SameCoefficients([1, -1 / (1 + t)], d.Denominator);
    }

    [Fact]
    public void Forward_SlowRateOnFastPole_WarnsUnstable()
    {
        var r = Discretizer.Discretize(FromText("1/(s+50)"), 0.05, DiscretizationMethod.Forward);
        Assert.True(r.IsSuccess);
        Assert.Contains(r.Value.Warnings, w => w.Contains("outside the unit circle", StringComparison.Ordinal));
        Assert.True(r.Value.Discrete.Poles[0].Magnitude > 1);
    }

    [Fact]
    public void Discretize_ImproperPid_RefusedWithFix()
    {
        var r = Discretizer.Discretize(FromText("2(s+1)(s+3)/s"), 0.01, DiscretizationMethod.Tustin);
        Assert.False(r.IsSuccess);
        Assert.Contains("filter", r.Problem!.Hint, StringComparison.Ordinal);
    }
}
