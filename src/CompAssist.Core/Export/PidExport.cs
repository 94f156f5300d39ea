using System.Collections.Immutable;
using System.Globalization;
using System.Text;
using System.Text.Json;
using CompAssist.Core.Discrete;
using CompAssist.Core.Model;
using CompAssist.Core.Proof;
using CompAssist.Core.Reporting;
using CompAssist.Core.Simulation;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Export;

/// <summary>
/// The hand-off's PID part for PI, PD and PID designs: the controller as firmware runs it (double or float), its
/// C code, a closed-loop test vector, its proof in closed loop (<see cref="ExportedPidProof"/>) and the report's
/// section on it. In fixed point (words up to 24 bits) the controller is the integer model <see cref="FixedPointPid"/>.
/// </summary>
internal static class PidExport
{
    /// <summary>Samples in the closed-loop test vector.</summary>
    public const int VectorSamples = 400;

    /// <summary>What the PID part adds to a package.</summary>
    /// <param name="Files">File name → content.</param>
    /// <param name="Note">What the sample-time note says about the PID (empty when the design has none).</param>
    /// <param name="Proof">The PID as exported in closed loop; null when none was exported.</param>
    public sealed record Part(ImmutableDictionary<string, string> Files, string Note, ExportedPidProof? Proof);

    /// <summary>Builds the PID part of the package at sample time <paramref name="t"/>.</summary>
    public static Part Build(DesignReport report, HandoffOptions options, double t, string origin)
    {
        var files = ImmutableDictionary.CreateBuilder<string, string>();
        if (report.Design.Compensator.Pid is not { } forms)
        {
            var ignored = options.AntiWindup is { } scheme
                ? $"The anti-windup setting ({Name(scheme)}) has no effect: the design is not a PI, PD or PID, and the section cascade has no output limits."
                : string.Empty;
            return new Part(files.ToImmutable(), ignored, null);
        }

        var effort = report.Check.EffortFigures;
        var limits = effort.AbsoluteLimits;
        var single = options.Format.Kind == NumberFormatKind.Float;
        var room = effort.Room;
        // A reference large enough that the first command (Kp·r, derivative on the measurement) saturates.
        var saturating = Math.Max(3 * effort.ReferenceStep, room is { } r && forms.Kp != 0 ? 2 * Math.Max(r.High, -r.Low) / Math.Abs(forms.Kp) : 0);
        PidImplementation Real(bool onError) =>
            new(forms, t, limits?.Low ?? -1e9, limits?.High ?? 1e9, options.AntiWindup ?? AntiWindup.Clamping, operatingPoint: effort.OperatingPoint, singlePrecision: single, derivativeOnError: onError);
        Func<bool, PidImplementation> make = Real;
        var pid = Real(options.DerivativeOnError);
        if (options.Format.Kind == NumberFormatKind.Fixed)
        {
            var scaling = FixedScaling(options, pid, saturating, effort);
            if (scaling.Refusal is { } refusal)
            {
                return new Part(files.ToImmutable(), $"NO PID CODE for {options.Format}: {refusal}; the section cascade implements C(z) without output limits.", null);
            }

            make = onError => Real(onError).InFixedPoint(options.Format.WordBits, scaling.Input, scaling.Output);
            pid = make(options.DerivativeOnError);
        }

        var name = options.Name + "_pid";
        var (header, source) = pid.FixedPoint is null ? PidCodeGenerator.Generate(name, pid, origin) : FixedPointPidCodeGenerator.Generate(name, pid, origin);
        files.Add($"{name}.h", header);
        files.Add($"{name}.c", source);
        var proof = ExportedPidProof.Run(report.Design.Loop, report.Check, pid, options.ComputationDelay);
        if (!proof.Meets && forms.Kd != 0)
        {
            // The other place for the derivative: when it meets, that is the recommendation.
            var other = make(!options.DerivativeOnError);
            var alternative = ExportedPidProof.Run(report.Design.Loop, report.Check, other, options.ComputationDelay);
            proof = proof with { Alternative = alternative.Meets ? alternative : null };
        }

        files.Add($"{name}-vectors.csv", Vectors(pid, report.Design.Loop, options.ComputationDelay, saturating));
        var range = limits is null ? "±1e9 (no actuator limit was given, so anti-windup never acts: give the limits)" : $"{F(limits.Low)} … {F(limits.High)} absolute";
        var verdict = proof.Meets ? "as exported it meets the requirements the continuous loop meets" : $"as exported it FAILS: {Binding(proof)}{(proof.Alternative is { } alt ? $"; with the derivative on the {(alt.Controller.DerivativeOnError ? "error" : "measurement")} it meets (overshoot {F(alt.Reference.OvershootPercent)} %, 2 % settling {F(alt.Reference.SettlingTime2Percent)} s): choose that" : string.Empty)}";
        var note = $"PID form: {Arithmetic(pid)}, positional, derivative on the {(pid.DerivativeOnError ? "error" : "measurement")}, operating point u0 = {F(pid.OperatingPoint)}, output limits {range}, anti-windup {Name(pid.AntiWindup)}; {verdict}.";
        return new Part(files.ToImmutable(), note, proof);
    }

    /// <summary>The requirement the exported PID fails by the largest fraction of its bound, or "unstable".</summary>
    public static string Binding(ExportedPidProof proof) => ExportedPidProof.Describe(proof) ?? "nothing";

    /// <summary>The report's section on the PID as exported.</summary>
    public static void AppendMarkdown(StringBuilder sb, DesignReport report, ExportedPidProof proof, LadderRung cascade)
    {
        var c = report.Check.Step;
        var s = cascade.Proof.Metrics;
        var p = proof.Reference;
        var pid = proof.Controller;
        sb.AppendLine("## The PID as exported");
        sb.AppendLine();
        sb.AppendLine(CultureInfo.InvariantCulture, $"The exported PID run in closed loop with the continuous plant (zero-order hold, delays exact, output read between the samples): {Arithmetic(pid)} arithmetic, derivative on the {(pid.DerivativeOnError ? "error" : "measurement")}, output clamped to [{F(pid.UMin)}, {F(pid.UMax)}] about u0 = {F(pid.OperatingPoint)}, anti-windup {Name(pid.AntiWindup)}; a reference step of {F(proof.ReferenceStep)} and, apart, a load step of {F(proof.Disturbance)} at the plant input.");
        sb.AppendLine();
        sb.AppendLine("| | C(s) continuous | C(z) sections, sampled | PID as exported |");
        sb.AppendLine("|---|---|---|---|");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| overshoot % | {F(c.OvershootPercent)} | {F(s.OvershootPercent)} | {F(p.OvershootPercent)} |");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| 2 % settling (s) | {F(c.SettlingTime2Percent)} | {F(s.SettlingTime2Percent)} | {F(p.SettlingTime2Percent)} |");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| 10–90 % rise (s) | {F(c.RiseTime)} | {F(s.RiseTime)} | {F(p.RiseTime)} |");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| phase margin ° | {F(report.Check.Margins?.PhaseMarginDeg ?? double.NaN)} | {F(cascade.PhaseMarginDeg)} | {F(proof.PhaseMarginDeg)} |");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| command u − u0, highest | {F(report.Check.EffortFigures.Highest)} | | {F(proof.CommandHighest)} |");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| command u − u0, lowest | {F(report.Check.EffortFigures.Lowest)} | | {F(proof.CommandLowest)} |");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| samples on a limit | | | {F(100 * proof.SaturatedFraction)} % |");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| load step: peak \\|y\\|, at (s) | | | {F(proof.DisturbancePeak)}, {F(proof.DisturbancePeakTime)} |");
        sb.AppendLine(CultureInfo.InvariantCulture, $"| load step: back within ±2 % of the reference step (s) | | | {F(proof.DisturbanceRecoveryTime)} |");
        sb.AppendLine();
        foreach (var row in proof.Checks)
        {
            sb.AppendLine(CultureInfo.InvariantCulture, $"- {(row.Passes == false ? "✗" : "✓")} {row.Name}: {F(row.Measured)} against {row.BoundSymbol} {F(row.Required ?? double.NaN)}");
        }

        foreach (var remark in Remarks(proof, cascade))
        {
            sb.AppendLine();
            sb.AppendLine("> " + remark);
        }

        sb.AppendLine();
    }

    /// <summary>What a firmware engineer should know about the exported PID beside the C(z) that was proved.</summary>
    public static IEnumerable<string> Remarks(ExportedPidProof proof, LadderRung cascade)
    {
        var s = cascade.Proof.Metrics;
        var p = proof.Reference;
        if (proof.Controller.Forms.Kd != 0 && !proof.Controller.DerivativeOnError && (Math.Abs(p.OvershootPercent - s.OvershootPercent) > 2 || Differs(p.SettlingTime2Percent, s.SettlingTime2Percent) || Differs(p.RiseTime, s.RiseTime)))
        {
            yield return $"Derivative on the measurement changes the reference response (the loop and its margins stay the same): overshoot {F(s.OvershootPercent)} → {F(p.OvershootPercent)} %, rise {F(s.RiseTime)} → {F(p.RiseTime)} s, 2 % settling {F(s.SettlingTime2Percent)} → {F(p.SettlingTime2Percent)} s (C(z) on the error → the PID as exported).";
        }

        if (proof.Alternative is { } alt)
        {
            var f = alt.Controller.Forms;
            var kick = alt.Controller.DerivativeOnError ? $"; its first command on a reference step of {F(alt.ReferenceStep)} is {F(alt.ReferenceRun.Commands[0] - alt.Controller.OperatingPoint)} above u0 (the kick Kd/(Tf + T) = {F(f.Kd / (f.Tf + alt.Controller.SampleTime))} per unit)" : string.Empty;
            yield return $"**Recommendation:** export with the derivative on the {(alt.Controller.DerivativeOnError ? "error" : "measurement")}: it meets every requirement the continuous loop meets (overshoot {F(alt.Reference.OvershootPercent)} %, 2 % settling {F(alt.Reference.SettlingTime2Percent)} s, {F(100 * alt.SaturatedFraction)} % of samples on a limit){kick}.";
        }

        if (proof.SaturatedFraction > 0)
        {
            yield return $"The command sits on a limit for {F(100 * proof.SaturatedFraction)} % of the reference run: the figures of the PID as exported include the saturation and the anti-windup; the linear figures do not.";
        }

        if (!proof.Meets)
        {
            yield return $"**The PID as exported fails:** {Binding(proof)}.";
        }
    }

    /// <summary>The JSON block "pidAsExported".</summary>
    public static void WriteJson(Utf8JsonWriter w, ExportedPidProof proof)
    {
        var pid = proof.Controller;
        w.WriteStartObject("pidAsExported");
        w.WriteString("arithmetic", pid.FixedPoint is { } x ? $"fixed{x.WordBits}" : (pid.SinglePrecision ? "float" : "double"));
        if (pid.FixedPoint is { } fixedPoint)
        {
            w.WriteNumber("inputFractionBits", fixedPoint.InputFractionBits);
            w.WriteNumber("outputFractionBits", fixedPoint.OutputFractionBits);
        }

        w.WriteString("antiWindup", Name(pid.AntiWindup));
        w.WriteString("derivativeOn", pid.DerivativeOnError ? "error" : "measurement");
        JsonNumbers.Write(w, "operatingPoint", pid.OperatingPoint);
        JsonNumbers.Write(w, "outputLow", pid.UMin);
        JsonNumbers.Write(w, "outputHigh", pid.UMax);
        w.WriteBoolean("meets", proof.Meets);
        w.WriteBoolean("stable", proof.Linear.Stable);
        JsonNumbers.Write(w, "phaseMarginDeg", proof.PhaseMarginDeg);
        JsonNumbers.Write(w, "overshootPercent", proof.Reference.OvershootPercent);
        JsonNumbers.Write(w, "settlingTime2", proof.Reference.SettlingTime2Percent);
        JsonNumbers.Write(w, "riseTime", proof.Reference.RiseTime);
        JsonNumbers.Write(w, "commandHighest", proof.CommandHighest);
        JsonNumbers.Write(w, "commandLowest", proof.CommandLowest);
        JsonNumbers.Write(w, "saturatedFraction", proof.SaturatedFraction);
        JsonNumbers.Write(w, "loadStep", proof.Disturbance);
        JsonNumbers.Write(w, "loadPeak", proof.DisturbancePeak);
        JsonNumbers.Write(w, "loadRecoveryTime", proof.DisturbanceRecoveryTime);
        if (proof.Alternative is { } alt)
        {
            w.WriteStartObject("recommended");
            w.WriteString("derivativeOn", alt.Controller.DerivativeOnError ? "error" : "measurement");
            JsonNumbers.Write(w, "overshootPercent", alt.Reference.OvershootPercent);
            JsonNumbers.Write(w, "settlingTime2", alt.Reference.SettlingTime2Percent);
            w.WriteEndObject();
        }

        w.WriteEndObject();
    }

    /// <summary>The controller's arithmetic as the report writes it ("double", "float", "fixed16 (…)").</summary>
    public static string Arithmetic(PidImplementation pid)
    {
        ArgumentNullException.ThrowIfNull(pid);
        return pid.FixedPoint is { } x
            ? $"fixed{x.WordBits} (reference and measurement with {x.InputFractionBits} fractional bits, command with {x.OutputFractionBits}, states with {x.GuardBits} more)"
            : (pid.SinglePrecision ? "float" : "double");
    }

    /// <summary>The scheme's name as the report writes it.</summary>
    public static string Name(AntiWindup scheme) => scheme switch
    {
        AntiWindup.Clamping => "clamping",
        AntiWindup.BackCalculation => "back-calculation",
        _ => "none",
    };

    /// <summary>
    /// A saturating closed-loop run of the exported PID on the loop (plant and sensor with their delays), with one
    /// failed sensor read (NaN) at sample 200: reference, measurement as the PID receives it, expected command.
    /// </summary>
    private static string Vectors(PidImplementation pid, Loop loop, bool computationDelay, double reference)
    {
        var twin = pid.Twin();
        var k = 0;
        var engine = pid.FixedPoint;
        var faultRow = engine is null ? 200 : -1;
        double Law(double r, double m) => twin.Step(r, k++ == faultRow ? double.NaN : m);
        var run = SampledControllerLoop.Run(loop, Law, pid.SampleTime, VectorSamples, 1, computationDelay, reference, 0.0, pid.OperatingPoint);
        string V(double x) => double.IsNaN(x) ? "nan" : (pid.SinglePrecision ? ((float)x).ToString("R", CultureInfo.InvariantCulture) : x.ToString("R", CultureInfo.InvariantCulture));
        string In(double x) => engine is null ? V(x) : engine.ToInput(x).ToString(CultureInfo.InvariantCulture);
        string Out(double x) => engine is null ? V(x) : Math.Round(x * Math.Pow(2, engine.OutputFractionBits)).ToString(CultureInfo.InvariantCulture);
        var sb = new StringBuilder();
        sb.AppendLine(CultureInfo.InvariantCulture, $"# CompAssist PID test vector ({Arithmetic(pid)}, positional, derivative on the {(pid.DerivativeOnError ? "error" : "measurement")}, sample time {pid.SampleTime:R} s): a saturating closed-loop run on the plant.");
        sb.AppendLine("# Feed reference and measurement to <name>_pid_step from <name>_pid_init, one row per sample; 'expected' is the command, bit for bit.");
        sb.AppendLine(engine is null
            ? "# Row 200 is a failed sensor read (nan): the step returns the previous command and sets the fault flag, and the run goes on. Not a safety function."
            : "# Every value is the signal's integer (value = integer / 2^fractional bits, see the header). Not a safety function.");
        sb.AppendLine("k,reference,measurement,expected");
        for (var i = 0; i < run.Commands.Length; i++)
        {
            var measured = i == faultRow ? double.NaN : run.Measurements[i];
            sb.AppendLine(CultureInfo.InvariantCulture, $"{i},{In(reference)},{In(measured)},{Out(run.Commands[i])}");
        }

        return sb.ToString();
    }

    /// <summary>The fractional bits of the fixed-point PID's inputs and command, or why there is no fixed-point PID.</summary>
    private static (int Input, int Output, string? Refusal) FixedScaling(HandoffOptions options, PidImplementation pid, double saturating, EffortFigures effort)
    {
        var w = options.Format.WordBits;
        if (w > FixedPointPid.MaxWordBits)
        {
            return (0, 0, $"the fixed-point PID supports words up to {FixedPointPid.MaxWordBits} bits (64-bit states without overflow)");
        }

        // Inputs: twice the saturating test reference; the command: the limits, or (none given) four times the linear peak about u0.
        var inputRange = 2 * Math.Max(saturating, Math.Abs(effort.ReferenceStep));
        var outputRange = effort.AbsoluteLimits is { } l
            ? Math.Max(Math.Abs(l.Low), Math.Abs(l.High))
            : Math.Abs(pid.OperatingPoint) + (4 * (double.IsFinite(effort.Peak) && effort.Peak > 0 ? effort.Peak : 1.0));
        int Bits(double range) => Math.Clamp((int)Math.Floor(Math.Log2(((1L << (w - 1)) - 1) / range)), 0, w - 1);
        var input = options.SignalFractionBits ?? Bits(inputRange);
        var output = options.SignalFractionBits ?? Bits(outputRange);
        if (outputRange * Math.Pow(2, output) > (1L << (w - 1)) - 1)
        {
            return (0, 0, $"the command range ±{F(outputRange)} does not fit a {w}-bit word with {output} fractional bits (use a longer word{(options.SignalFractionBits is null ? string.Empty : " or fewer fractional bits")})");
        }

        try
        {
            _ = pid.InFixedPoint(w, input, output);
        }
        catch (ArgumentException e)
        {
            return (0, 0, e.Message.Split(" (Parameter", 2)[0]);
        }

        return (input, output, null);
    }

    private static bool Differs(double a, double b) =>
        double.IsFinite(a) != double.IsFinite(b) || (double.IsFinite(a) && Math.Abs(a - b) > 0.1 * Math.Max(Math.Abs(a), Math.Abs(b)));

    private static string F(double x) => TransferFunctionFormatter.Number(x, 4);
}
