using System.CommandLine;
using CompAssist.Core.Discrete;
using CompAssist.Core.Parsing;
using CompAssist.Core.Reporting;
using CompAssist.Core.Workflow;

namespace CompAssist.Cli.Commands;

/// <summary><c>compassist discretize</c>: the sampled form of a compensator by a chosen method.</summary>
internal static class DiscretizeCommand
{
    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var compensator = new Option<string?>("--compensator") { Description = "Compensator C(s), e.g. \"4.7(s+2.93)/(s+5.46)\"." };
        var sampleTime = new RealOption("--sample-time") { Description = "Sample time T in seconds." };
        var method = new Option<string>("--method") { Description = "tustin, prewarp, matched, zoh, backward (forward only with a warning).", DefaultValueFactory = _ => "tustin" };
        var prewarp = new RealOption("--prewarp-frequency") { Description = "Pre-warp frequency in rad/s (prewarp method)." };
        var sections = new Option<bool>("--sections") { Description = "Print the cascade of second-order sections (the form to implement) instead of the single difference equation." };
        var json = new Option<bool>("--json") { Description = "Machine-readable JSON on stdout (the direct form and the sections)." };
        var command = new Command("discretize", "Discretize a compensator: coefficients in ascending powers of z^-1 and the difference equation.");
        foreach (var option in new Option[] { compensator, sampleTime, method, prewarp, sections, json })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse =>
        {
            if (parse.GetValue(compensator) is not { } text)
            {
                stderr.WriteLine("error: no compensator given. Pass --compensator \"EXPR\".");
                return CliApplication.InputError;
            }

            if (parse.GetValue(sampleTime) is not { } t)
            {
                stderr.WriteLine("error: no sample time given. Pass --sample-time T (seconds).");
                return CliApplication.InputError;
            }

            if (!Enum.TryParse<DiscretizationMethod>(parse.GetValue(method), ignoreCase: true, out var m) || !Enum.IsDefined(m))
            {
                stderr.WriteLine($"error: --method '{parse.GetValue(method)}' is not a method. Use tustin, prewarp, matched, zoh, backward or forward.");
                return CliApplication.InputError;
            }

            var parsed = ExpressionParser.Parse(text, requireProper: false);
            if (!parsed.IsSuccess)
            {
                return Errors.Report(new FieldError("compensator", parsed.Error), null, false, stderr)!.Value;
            }

            var result = Discretizer.Discretize(parsed.Value, t, m, parse.GetValue(prewarp));
            if (Errors.Report(null, result.Problem, !(t > 0), stderr) is { } failure)
            {
                return failure;
            }

            var asSections = parse.GetValue(sections);
            stdout.Write(parse.GetValue(json) ? DiscreteReport.RenderJson(result.Value!) + Environment.NewLine : DiscreteReport.RenderText(parsed.Value, result.Value!, asSections));
            if (!asSections && !parse.GetValue(json) && DiscreteReport.DirectFormWarnings(result.Value!.Discrete).Any())
            {
                stdout.WriteLine("  (run again with --sections for the cascade to implement)");
            }

            return CliApplication.Success;
        });
        return command;
    }
}
