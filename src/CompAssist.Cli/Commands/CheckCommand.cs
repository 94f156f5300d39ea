using System.CommandLine;
using CompAssist.Core.Reporting;
using CompAssist.Core.Workflow;

namespace CompAssist.Cli.Commands;

/// <summary><c>compassist check</c>: prove a compensator you already have on a loop (no synthesis).</summary>
internal static class CheckCommand
{
    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var loop = new LoopSettings();
        var compensator = new Option<string?>("--compensator") { Description = "Compensator C(s) to prove, e.g. \"4.7(s+2.93)/(s+5.46)\"." };
        var command = new Command("check", "Prove a given compensator on a loop: closed-loop poles, step, errors, margins, effort, robustness.");
        loop.AddTo(command);
        command.Options.Add(compensator);
        command.SetAction(parse =>
        {
            var input = loop.Apply(parse, stderr, out var code);
            if (input is null)
            {
                return code;
            }

            var text = parse.GetValue(compensator);
            if (text is null)
            {
                stderr.WriteLine("error: no compensator given. Pass --compensator \"EXPR\", e.g. --compensator \"4.7(s+2.93)/(s+5.46)\".");
                return CliApplication.InputError;
            }

            var run = CheckWorkflow.Run(input, text);
            if (Errors.Report(run.FieldError, run.Problem, input.Plant is null, stderr) is { } failure)
            {
                return failure;
            }

            stdout.Write(parse.GetValue(loop.Json) ? CheckReport.RenderJson(run.Result!) + Environment.NewLine : CheckReport.RenderText(run.Result!, input.Name));
            return run.Result!.Verdict.Meets ? CliApplication.Success : CliApplication.Fails;
        });
        return command;
    }
}
