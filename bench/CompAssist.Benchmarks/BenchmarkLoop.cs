using System.Numerics;
using CompAssist.Core.Model;
using CompAssist.Core.Numerics;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;

namespace CompAssist.Benchmarks;

/// <summary>
/// The loop family of ../shared/bench/numpy_baseline.py: n − 2 real poles spread geometrically over
/// [−30, −0.5], a pair at −1 ± 3j, zeros at −2 and −8, with a target that needs lead.
/// </summary>
public sealed class BenchmarkLoop
{
    private BenchmarkLoop(Loop loop, TargetPole target, LeadOptions options)
    {
        Loop = loop;
        Target = target;
        Options = options;
    }

    public Loop Loop { get; }

    public TargetPole Target { get; }

    public LeadOptions Options { get; }

    public static BenchmarkLoop OfOrder(int order)
    {
        var poles = new List<Complex>();
        for (var i = 0; i < order - 2; i++)
        {
            var x = order - 2 == 1 ? 0.5 : 0.5 * Math.Pow(30.0 / 0.5, (double)i / (order - 3));
            poles.Add(new Complex(-x, 0));
        }

        poles.Add(new Complex(-1, 3));
        poles.Add(new Complex(-1, -3));
        Complex[] zeros = [new(-2, 0), new(-8, 0)];
        var kref = Math.Abs(poles.Aggregate(Complex.One, (p, q) => p * -q).Real) / 16.0;
        var plant = TransferFunction.FromFactors(kref, zeros, poles);
        var loop = Loop.Create(plant);

        // The target: the dominant root at twice the reference gain, moved left until a lead can reach it.
        var roots = RootFinder.Find(loop.Characteristic(TransferFunction.Constant(2.0))).Roots;
        var dominant = roots.Where(r => r.Imaginary > 0).OrderBy(r => -r.Real).First();
        var options = new LeadOptions { Placement = LeadPlacement.Bisector };
        for (var shift = 0.2; shift < 20; shift *= 1.3)
        {
            var target = TargetPole.At(dominant - shift);
            if (LeadDesigner.Design(loop, target, options).IsSuccess)
            {
                return new BenchmarkLoop(loop, target, options);
            }
        }

        throw new InvalidOperationException($"No reachable lead target for order {order}.");
    }
}
