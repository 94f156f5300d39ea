using System.CommandLine;
using CompAssist.Core.Locus;
using CompAssist.Core.Numerics;
using CompAssist.Core.Reporting;
using CompAssist.Core.Workflow;

namespace CompAssist.Cli.Commands;

/// <summary><c>compassist locus</c>: the root locus of a loop, its exact features and a text picture.</summary>
internal static class LocusCommand
{
    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var loop = new LoopSettings();
        var compensator = new Option<string?>("--compensator") { Description = "Compensator C(s) in the loop (default 1); K multiplies C·G·H." };
        var command = new Command("locus", "Root locus of 1 + K·C·G·H = 0 for K from 0 to ∞: branches, asymptotes, break points, axis crossings.");
        loop.AddTo(command);
        command.Options.Add(compensator);
        command.SetAction(parse =>
        {
            var input = loop.Apply(parse, stderr, out var code);
            if (input is null)
            {
                return code;
            }

            var read = CompensatedLoop.Read(input, parse.GetValue(compensator) ?? "1");
            if (Errors.Report(read.FieldError, read.Problem, input.Plant is null, stderr) is { } failure)
            {
                return failure;
            }

            var built = read.Loop!;
            LocusResult result;
            try
            {
                result = LocusEngine.Compute(built, read.Compensator);
            }
            catch (RootFindingException e)
            {
                stderr.WriteLine($"error: The locus could not be verified: {e.Message}.");
                stderr.WriteLine("hint: Enter the loop in factored form or reduce its order.");
                return CliApplication.Refused;
            }

            stdout.Write(parse.GetValue(loop.Json) ? LocusReport.RenderJson(result) + Environment.NewLine : LocusReport.RenderText(result, built, read.Compensator, loop.Style(parse)));
            return CliApplication.Success;
        });
        return command;
    }
}
