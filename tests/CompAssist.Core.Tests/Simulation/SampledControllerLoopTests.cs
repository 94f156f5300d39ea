using CompAssist.Core.Discrete;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Simulation;
using CompAssist.Core.Tests.Support;

namespace CompAssist.Core.Tests.Simulation;

/// <summary>
/// The held-input loop simulation (state space, matrix exponential, delays placed inside the period) against the
/// z-domain proof (polynomials of the ZOH transfer functions), two independent routes to the same sampled loop
/// (Franklin, Powell and Workman, Digital Control of Dynamic Systems, 3rd ed., chapter 6: the ZOH equivalent is exact
/// at the sampling instants).
/// </summary>
public class SampledControllerLoopTests
{
    private static TransferFunction Parse(string text) => ExpressionParser.Parse(text, requireProper: false).Value!;

    /// <summary>A direct-form filter of C(z) written here, fed the error r − m: the law of a linear sampled controller.</summary>
    private static SampledControllerLoop.Law Linear(DiscreteTransferFunction c)
    {
        var b = c.Numerator.ToArray();
        var a = c.Denominator.ToArray();
        var e = new double[b.Length];
        var u = new double[a.Length];
        return (r, m) =>
        {
            Array.Copy(e, 0, e, 1, e.Length - 1);
            Array.Copy(u, 0, u, 1, u.Length - 1);
            e[0] = r - m;
            var sum = 0.0;
            for (var i = 0; i < b.Length; i++)
            {
                sum += b[i] * e[i];
            }

            for (var i = 1; i < a.Length; i++)
            {
                sum -= a[i] * u[i];
            }

            u[0] = sum;
            return sum;
        };
    }

    [Theory]
    [InlineData("4/(s(s+2))", "1", "4(s+2)/(s+4)", 0.05, 0.0, false)]
    [InlineData("4/(s(s+2))", "1", "4(s+2)/(s+4)", 0.05, 0.0, true)]
    [InlineData("2/((s+1)(0.5s+1))", "1", "1.5(s+1)/s", 0.1, 0.3, false)]
    [InlineData("2/((s+1)(0.5s+1))", "10/(s+10)", "0.5(s+1)/s", 0.1, 0.2, true)]
    [InlineData("9/(s^2+0.6s+9)", "1", "0.8(s+3)/(s+6)", 0.02, 0.0, false)]
    public void Run_LinearController_MatchesTheZDomainProofAtTheSamplingInstants(string plant, string sensor, string compensator, double t, double delay, bool computationDelay)
    {
        var loop = Loop.Create(Parse(delay > 0 ? $"({plant}) exp(-{delay.ToString(System.Globalization.CultureInfo.InvariantCulture)}s)" : plant), Parse(sensor));
        var c = Discretizer.Discretize(Parse(compensator), t, DiscretizationMethod.Tustin).Value!.Discrete;
        var proof = SampledLoop.Prove(loop, c, computationDelay, samples: 400);
        Assert.True(proof.Stable);
        var run = SampledControllerLoop.Run(loop, Linear(c), t, periods: 400, subSteps: 5, computationDelay, reference: 1.0, loadDisturbance: 0.0);
        for (var k = 0; k < 400; k++)
        {
            Tolerance.Close(proof.Step.Values[k], run.Output.Values[k * 5], 1e-9, 1e-11, $"k = {k}");
        }
    }

    [Fact]
    public void Run_FractionalDelay_ShiftsTheOutputExactly()
    {
        // Open loop (a law that returns a constant command): the output is the plant's step delayed by 0.137 s,
        // read between the samples: y(t) = 1 − e^{−(t − 0.137)} after the delay.
        var loop = Loop.Create(Parse("exp(-0.137s)/(s+1)"));
        var run = SampledControllerLoop.Run(loop, (_, _) => 1.0, 0.1, periods: 30, subSteps: 4, computationDelay: false, reference: 0.0, loadDisturbance: 0.0);
        for (var k = 0; k < run.Output.Values.Length - 1; k++)
        {
            var time = run.Output.TimeAt(k);
            var exact = time < 0.137 ? 0.0 : 1 - Math.Exp(-(time - 0.137));
            Tolerance.Close(exact, run.Output.Values[k], 1e-12, 1e-13, $"t = {time}");
        }
    }

    [Fact]
    public void Run_LoadDisturbanceAndOperatingPoint_EnterAtThePlantInput()
    {
        // A law that holds the operating point: the plant sees only the load step, 2/(s+2) · 0.5/s → 0.5.
        var loop = Loop.Create(Parse("2/(s+2)"));
        var run = SampledControllerLoop.Run(loop, (_, _) => 40.0, 0.05, periods: 200, subSteps: 1, computationDelay: false, reference: 0.0, loadDisturbance: 0.5, operatingPoint: 40.0);
        Tolerance.Close(0.5 * (1 - Math.Exp(-2 * 0.05 * 7)), run.Output.Values[7], 1e-12);
        Tolerance.Close(0.5, run.Output.Values[^1], 1e-6);
    }

    [Fact]
    public void Run_UnstablePlantOverALongHorizon_OutputStaysWithTheStabilisedLoop()
    {
        // e^(−0.1s)/(s − 1) under the PI 3.8494 + 4.4674/s (the exact PI at −2 ± 2j, PiDesignerTests) sampled at
        // 10 ms, with forward integration: the loop is stable, so after 150 s the output must sit at the reference.
        // Two separate open-loop propagations of the unstable plant (output and measurement) drift apart by
        // e^(t)·1e-16 and the output read 5.8e22 % overshoot; the static sensor now reads the output itself.
        var loop = Loop.Create(ExpressionParser.Parse("exp(-0.1s)/(s-1)", requireProper: true).Value!);
        double integral = 0, t = 0.01;
        double Law(double r, double m)
        {
            var e = r - m;
            var u = (3.8494 * e) + integral;
            integral += 4.4674 * t * e;
            return u;
        }

        var run = SampledControllerLoop.Run(loop, Law, t, 15_000, 4, computationDelay: false, reference: 1.0, loadDisturbance: 0.0);
        Tolerance.Close(1.0, run.Output.Values[^1], 0, 1e-9, "y at 150 s");
        Assert.True(run.Output.Values.All(v => Math.Abs(v) < 3), "no divergence anywhere");
        // The measurement handed to the law is the output (its delay inside) at the sampling instant.
        Tolerance.Close(run.Output.Values[4 * 500], run.Measurements[500], 1e-12, what: "m(5 s) = y(5 s)");
    }
}
