using System.Collections.Immutable;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Search;

/// <summary>
/// When nothing meets: how far the closest candidate is off on each requirement, and the physical limits of
/// the plant that explain it, each with its figure and its rule — a right-half-plane zero z bounds the
/// crossover to about z/2 and forces an undershoot of at least (1 − δ)/(e^(z·ts) − 1) to settle within δ by ts
/// (Goodwin, Graebe and Salgado, Control System Design, ch. 8); an unstable pole p needs a crossover of at
/// least about 2p; a delay θ bounds the crossover to about 1/θ; a zero z and a pole p in the right half-plane
/// together force Ms ≥ |z + p|/|z − p| (Skogestad and Postlethwaite, Multivariable Feedback Control, 2nd ed.,
/// ch. 5); two or more integrators force overshoot; an actuator limit caps how fast the output can move.
/// </summary>
internal static class PhysicalLimits
{
    public static ImmutableArray<string> Explain(Loop loop, Requirements requirements, CheckOptions check, SearchCandidate closest)
    {
        var notes = ImmutableArray.CreateBuilder<string>();
        foreach (var row in closest.Checks.Where(r => r.Passes == false))
        {
            var off = row.Required is { } b && b != 0 ? Math.Abs(row.Measured - b) / Math.Abs(b) * 100 : double.NaN;
            notes.Add($"closest candidate: {row.Name} is {F(row.Measured)} against {row.BoundSymbol} {F(row.Required!.Value)} ({F(off)} % off)");
        }

        if (!closest.Stable)
        {
            notes.Add("closest candidate: the closed loop is unstable; no candidate of this kind in the region gave a stable loop");
        }

        var gh = loop.PlantTimesFeedback;
        var rhpZeros = gh.Zeros.Where(z => z.Real > 0 && z.Imaginary == 0).Select(z => z.Real).Order().ToList();
        var rhpPoles = gh.Poles.Where(p => p.Real > 0).Select(p => p.Magnitude).Order().ToList();
        foreach (var z in rhpZeros.Take(1))
        {
            var text = $"a right-half-plane zero at {F(z)} bounds the crossover to about z/2 = {F(z / 2)} rad/s (Goodwin–Graebe–Salgado, ch. 8)";
            if (requirements.MaxSettlingTime is { } ts)
            {
                var delta = requirements.Band == SettlingBand.FivePercent ? 0.05 : 0.02;
                var under = (1 - delta) / (Math.Exp(z * ts) - 1) * 100;
                text += $"; settling within ±{F(delta * 100)} % by {F(ts)} s forces an undershoot of at least (1 − δ)/(e^(z·ts) − 1) = {F(under)} %";
            }

            notes.Add(text);
        }

        foreach (var p in rhpPoles.Take(1))
        {
            notes.Add($"an unstable pole at {F(p)} needs a crossover of at least about 2p = {F(2 * p)} rad/s, with the actuator effort that takes");
        }

        if (loop.Delay > 0)
        {
            notes.Add($"the loop delay of {F(loop.Delay)} s bounds the crossover to about 1/θ = {F(1 / loop.Delay)} rad/s");
        }

        if (rhpZeros.Count > 0 && rhpPoles.Count > 0)
        {
            var (z, p) = (rhpZeros[0], rhpPoles[0]);
            notes.Add($"the right-half-plane zero {F(z)} and pole {F(p)} together force Ms ≥ |z + p|/|z − p| = {F(Math.Abs(z + p) / Math.Abs(z - p))} (Skogestad–Postlethwaite, 2nd ed., ch. 5)");
        }

        var integrators = gh.Poles.Count(p => p == System.Numerics.Complex.Zero) + closest.Design.Compensator.TransferFunction.Poles.Count(p => p == System.Numerics.Complex.Zero);
        if (integrators >= 2 && closest.Checks.Any(r => r.Name == RequirementChecks.Overshoot && r.Passes == false))
        {
            notes.Add($"the loop has {integrators} integrators: with two or more the error of a unit-feedback step integrates to zero, so the step must overshoot (common practice); a reference prefilter, not the loop, removes that overshoot");
        }

        if (check.CommandRoom is { } room)
        {
            var limits = room.IsSymmetric ? $"the actuator limit {F(room.High)}" : $"the room {F(room.Low)} … {F(room.High)} the output limits leave about the operating point";
            notes.Add($"{limits} caps how fast the output can move: a faster target needs a larger command");
        }

        notes.Add("what to change: relax the requirement that fails most, try another compensator kind (lead-lag or PID for more phase, lag or PI for steady state), or a stronger actuator");
        return notes.ToImmutable();
    }

    private static string F(double x) => TransferFunctionFormatter.Number(x, 4);
}
