using System.CommandLine;
using CompAssist.Core.Discrete;
using CompAssist.Core.Export;
using CompAssist.Core.Workflow;

namespace CompAssist.Cli.Commands;

/// <summary><c>compassist handoff</c>: discretize, re-prove sampled, and export code, coefficients, vectors and a report.</summary>
internal static class HandoffCommand
{
    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var settings = new DesignSettings();
        var output = new PathOption("--out") { Description = "Folder to write the files into (created if missing)." };
        var sampleTime = new RealOption("--sample-time") { Description = "Sample time in seconds (default: recommended from the crossover)." };
        var method = new Option<string>("--method") { Description = "tustin, prewarp, matched, zoh, backward.", DefaultValueFactory = _ => "tustin" };
        var prewarp = new RealOption("--prewarp-frequency") { Description = "Pre-warp frequency in rad/s." };
        var delay = new Option<bool>("--computation-delay") { Description = "The command is applied one sample after the measurement is read." };
        var format = new Option<string>("--format") { Description = "Coefficient storage: double, float, or fixedN (N-bit words; code up to 24 bits).", DefaultValueFactory = _ => "double" };
        var signalBits = new WholeOption("--signal-fraction-bits") { Description = "Fixed point: fractional bits of the signals (default: half the word for the section cascade; a PID sizes its inputs from the test reference and its command from the output limits)." };
        var antiWindup = new Option<string>("--anti-windup") { Description = "PID anti-windup: clamping (the default) or back-calculation." };
        var derivativeOn = new Option<string>("--derivative-on") { Description = "PID derivative on the measurement (the default: no kick on reference steps) or on the error (as designed)." };
        var name = new Option<string>("--name") { Description = "C identifier of the controller.", DefaultValueFactory = _ => "compassist_ctrl" };
        var command = new Command("handoff", "Hand a design to firmware: C code, coefficients, test vectors and a report, with the sampled loop re-proved.");
        settings.AddTo(command);
        foreach (var option in new Option[] { output, sampleTime, method, prewarp, delay, format, signalBits, antiWindup, derivativeOn, name })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse =>
        {
            if (parse.GetValue(output) is not { } folder)
            {
                stderr.WriteLine("error: --out DIR is required.");
                return CliApplication.InputError;
            }

            if (!Enum.TryParse<DiscretizationMethod>(parse.GetValue(method), ignoreCase: true, out var m) || !Enum.IsDefined(m))
            {
                stderr.WriteLine($"error: --method '{parse.GetValue(method)}' is not a method. Use tustin, prewarp, matched, zoh or backward.");
                return CliApplication.InputError;
            }

            if (NumberFormat.TryParse(parse.GetValue(format)!) is not { } numberFormat)
            {
                stderr.WriteLine($"error: --format '{parse.GetValue(format)}' is not a number format. Use double, float or fixed8…fixed32.");
                return CliApplication.InputError;
            }

            var schemeText = parse.GetValue(antiWindup);
            var scheme = schemeText?.ToLowerInvariant() switch
            {
                null => null,
                "clamping" => AntiWindup.Clamping,
                "back-calculation" => AntiWindup.BackCalculation,
                _ => (AntiWindup?)null,
            };
            if (schemeText is not null && scheme is null)
            {
                stderr.WriteLine($"error: --anti-windup '{parse.GetValue(antiWindup)}' is not a scheme. Use clamping or back-calculation.");
                return CliApplication.InputError;
            }

            var derivativeText = parse.GetValue(derivativeOn);
            if (derivativeText is not null && derivativeText.ToLowerInvariant() is not ("measurement" or "error"))
            {
                stderr.WriteLine($"error: --derivative-on '{derivativeText}' is not a signal. Use measurement or error.");
                return CliApplication.InputError;
            }

            var input = DesignCommand.Input(parse, settings, stderr, out var code);
            if (input is null)
            {
                return code;
            }

            var run = settings.Run(parse, input);
            if (Errors.Report(run.FieldError, run.Problem, input.Plant is null, stderr) is { } failure)
            {
                return failure;
            }

            var options = new HandoffOptions
            {
                SampleTime = parse.GetValue(sampleTime),
                Method = m,
                PrewarpFrequency = parse.GetValue(prewarp),
                ComputationDelay = parse.GetValue(delay),
                Format = numberFormat,
                SignalFractionBits = parse.GetValue(signalBits),
                AntiWindup = scheme,
                DerivativeOnError = derivativeText?.ToLowerInvariant() == "error",
                Name = parse.GetValue(name)!,
            };
            var package = HandoffPackage.Build(run.Report!, options, input.Name);
            if (Errors.Report(null, package.Problem, false, stderr) is { } refused)
            {
                return refused;
            }

            if (HandoffFiles.Write(run.Report!, package.Value!, options, folder, input.Name) is { } writeProblem)
            {
                stderr.WriteLine($"error: {writeProblem.Message}");
                return CliApplication.InputError;
            }

            var proof = package.Value!.Proof;
            stdout.WriteLine($"wrote {package.Value.Files.Count + 2} files into {folder}");
            stdout.WriteLine($"  sample time: {package.Value.SampleTimeNote}");
            stdout.WriteLine($"  sampled loop: {(proof.Stable ? "stable" : "UNSTABLE")}, largest |z| = {proof.LargestPoleMagnitude:G6}, overshoot {proof.Metrics.OvershootPercent:G4} %, 2 % settling {proof.Metrics.SettlingTime2Percent:G4} s");
            stdout.WriteLine("  sample-time ladder (each value re-proved sampled; ▶ this package):");
            var ladderText = new System.Text.StringBuilder();
            Core.Reporting.LadderTable.AppendText(ladderText, package.Value.Ladder, package.Value.Sampled.SampleTime, "    ");
            stdout.Write(ladderText.ToString());
            if (numberFormat.Kind == NumberFormatKind.Fixed)
            {
                stdout.WriteLine($"  {numberFormat}: quantization analysed and the loop re-proved with the rounded coefficients{(numberFormat.WordBits <= FixedPointCascade.MaxWordBits ? "; bit-exact fixed-point C and integer vectors written" : $"; no C code above {FixedPointCascade.MaxWordBits}-bit words")}.");
            }

            foreach (var w in package.Value.Discretization.Warnings.Concat(package.Value.Quantization.Warnings).Concat(proof.Warnings))
            {
                stdout.WriteLine($"  ! {w}");
            }

            var verdict = run.Report!.Verdict;
            stdout.WriteLine($"  continuous loop: {verdict.Status(run.Report.Robustness?.Corners.Length ?? 0)}");
            foreach (var reason in verdict.Reasons)
            {
                stdout.WriteLine($"    ✗ {reason}");
            }

            stdout.WriteLine("  CAUTION: the controller is not a safety function; read the caution in the report before running hardware.");
            if (!package.Value.SampledMeets)
            {
                stdout.WriteLine($"    ✗ sampled at T = {package.Value.Sampled.SampleTime:G4} s: {package.Value.Sampled.Binds}{(package.Value.Ladder.Recommended is { } ok && ok != package.Value.Sampled.SampleTime ? $"; T = {ok:G4} s meets" : string.Empty)}");
            }

            if (package.Value.Pid is { } pid)
            {
                stdout.WriteLine($"  PID as exported: {pid.Verdict} — overshoot {pid.Reference.OvershootPercent:G4} %, 2 % settling {pid.Reference.SettlingTime2Percent:G4} s, command u − u0 {pid.CommandLowest:G4} … {pid.CommandHighest:G4}, {100 * pid.SaturatedFraction:G3} % of samples on a limit");
                if (!pid.Meets)
                {
                    stdout.WriteLine($"    ✗ PID as exported: {Core.Export.ExportedPidProof.Describe(pid)}");
                }

                if (pid.Alternative is { } alt)
                {
                    var signal = alt.Controller.DerivativeOnError ? "error" : "measurement";
                    stdout.WriteLine($"    → with the derivative on the {signal} it meets (overshoot {alt.Reference.OvershootPercent:G4} %, 2 % settling {alt.Reference.SettlingTime2Percent:G4} s): hand off again with --derivative-on {signal}");
                }
            }

            return proof.Stable && verdict.Meets && package.Value.SampledMeets && package.Value.PidMeets ? CliApplication.Success : CliApplication.Fails;
        });
        return command;
    }
}
