using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Tests.Support;
using CsCheck;

namespace CompAssist.Core.Tests.Synthesis;

/// <summary>PID gain-form conversions (common practice), by hand and as round trips.</summary>
public class PidFormsTests
{
    [Fact]
    public void FromTransferFunction_TwoRealZeros_AllFormsByHand()
    {
        // 2(s+1)(s+3)/s = 2s + 8 + 6/s: Kp = 8, Ki = 6, Kd = 2; Ti = 4/3, Td = 1/4;
        // series 6(1 + 1/s)(1 + s/3) = 2(s+1)(s+3)/s, so Kc′ = 6, Ti′ = 1, Td′ = 1/3.
        var c = TransferFunction.FromFactors(2, [new Complex(-1, 0), new Complex(-3, 0)], [Complex.Zero]);
        var f = PidForms.FromTransferFunction(c);
        Tolerance.Close(8.0, f.Kp, 1e-14);
        Tolerance.Close(6.0, f.Ki, 1e-14);
        Tolerance.Close(2.0, f.Kd, 1e-14);
        Tolerance.Close(4.0 / 3, f.Ti, 1e-14);
        Tolerance.Close(0.25, f.Td, 1e-14);
        Tolerance.Close(6.0, f.SeriesKc, 1e-13);
        Tolerance.Close(1.0, f.SeriesTi, 1e-13);
        Tolerance.Close(1.0 / 3, f.SeriesTd, 1e-13);
        Assert.True(double.IsPositiveInfinity(f.N));
    }

    [Fact]
    public void FromTransferFunction_ComplexZeros_HasNoSeriesForm()
    {
        var c = TransferFunction.FromFactors(1, [new Complex(-1, 2), new Complex(-1, -2)], [Complex.Zero]);
        var f = PidForms.FromTransferFunction(c);
        Assert.Null(f.SeriesKc);
        Assert.True(f.Ti < 4 * f.Td, "complex zeros ⇔ Ti < 4Td");
    }

    [Fact]
    public void FromTransferFunction_Filtered_MatchesParallelWithFilter()
    {
        // Kp + Ki/s + Kd s/(Tf s + 1) with Kp = 3, Ki = 2, Kd = 0.5, Tf = 0.05.
        var parallel = PidForms.FromParallel(3, 2, 0.5, 0.05);
        var back = PidForms.FromTransferFunction(parallel.ToTransferFunction());
        Tolerance.Close(3.0, back.Kp, 1e-12);
        Tolerance.Close(2.0, back.Ki, 1e-12);
        Tolerance.Close(0.5, back.Kd, 1e-12);
        Tolerance.Close(0.05, back.Tf, 1e-12);
        Tolerance.Close(0.5 / 3 / 0.05, back.N, 1e-12);
    }

    [Fact]
    public void Conversions_RoundTrip_Property()
    {
        Gen.Select(Gen.Double[0.1, 50], Gen.Double[0.01, 20], Gen.Double[0.001, 5], Gen.Double[0, 0.1]).Sample(
            (kp, ki, kd, tf) =>
            {
                var forms = PidForms.FromParallel(kp, ki, kd, tf);
                var standard = PidForms.FromStandard(forms.Kc, forms.Ti, forms.Td, forms.N);
                Tolerance.Close(kp, standard.Kp, 1e-12);
                Tolerance.Close(ki, standard.Ki, 1e-12);
                Tolerance.Close(kd, standard.Kd, 1e-12);
                var viaFactors = PidForms.FromTransferFunction(forms.ToTransferFunction());
                Tolerance.Close(kp, viaFactors.Kp, 1e-8);
                Tolerance.Close(ki, viaFactors.Ki, 1e-8);
                Tolerance.Close(kd, viaFactors.Kd, 1e-8);
                if (forms.SeriesKc is { } sk)
                {
                    // Kc′(1 + 1/(Ti′s))(1 + Td′s) must equal the parallel form at any s.
                    var s = new Complex(0.7, 1.3);
                    var series = sk * (1 + (1 / (forms.SeriesTi!.Value * s))) * (1 + (forms.SeriesTd!.Value * s));
                    Tolerance.Close(kp + (ki / s) + (kd * s), series, 1e-10);
                }
            },
            iter: 2000);
    }
}
