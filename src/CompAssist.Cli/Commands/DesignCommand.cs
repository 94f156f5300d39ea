using System.CommandLine;
using CompAssist.Core.Reporting;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Workflow;

namespace CompAssist.Cli.Commands;

/// <summary><c>compassist design</c>: synthesize a compensator and prove the closed loop.</summary>
internal static class DesignCommand
{
    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var settings = new DesignSettings();
        var command = new Command("design", "Design a compensator for a target pole and prove the closed loop.");
        settings.AddTo(command);
        command.SetAction(parse => Execute(parse, settings, stdout, stderr));
        return command;
    }

    private static int Execute(ParseResult parse, DesignSettings s, TextWriter stdout, TextWriter stderr)
    {
        var input = Input(parse, s, stderr, out var code);
        if (input is null)
        {
            return code;
        }

        var run = s.Run(parse, input);
        if (Errors.Report(run.FieldError, run.Problem, input.Plant is null, stderr) is { } failure)
        {
            return failure;
        }

        if (parse.GetValue(s.Save) is { } savePath)
        {
            try
            {
                Core.Cases.CaseFileWriter.Save(input, savePath);
            }
            catch (IOException e)
            {
                stderr.WriteLine($"error: cannot save the case to {savePath}: {e.Message}");
                return CliApplication.InputError;
            }
            catch (UnauthorizedAccessException e)
            {
                stderr.WriteLine($"error: cannot save the case to {savePath}: {e.Message}");
                return CliApplication.InputError;
            }
        }

        var report = run.Report!;
        stdout.Write(parse.GetValue(s.Loop.Json) ? DesignJsonReport.Render(report) + Environment.NewLine : DesignTextReport.Render(report, input.Name, s.Loop.Style(parse)));
        return report.Verdict.Meets ? CliApplication.Success : CliApplication.Fails;
    }

    /// <summary>The case with every design flag laid over it, or null (error written) on bad input.</summary>
    internal static Core.Cases.CaseFile? Input(ParseResult parse, DesignSettings s, TextWriter stderr, out int code)
    {
        var input = s.Loop.Apply(parse, stderr, out code);
        if (input is null)
        {
            return null;
        }

        if (parse.GetValue(s.Type) is { } typeName && DesignWorkflow.KindOf(typeName) is null)
        {
            stderr.WriteLine($"error: --type '{typeName}' is not a compensator type. Use one of: {string.Join(", ", DesignWorkflow.SupportedTypes)}.");
            code = CliApplication.InputError;
            return null;
        }

        if (parse.GetValue(s.Kinds) is { } kindsText && DesignSettings.ParseKinds(kindsText) is null)
        {
            stderr.WriteLine($"error: --kinds '{kindsText}' is not a list of compensator types. Write them with commas, e.g. --kinds lead,lead-lag,pid; the types are: {string.Join(", ", DesignWorkflow.SupportedTypes)}.");
            code = CliApplication.InputError;
            return null;
        }

        if (parse.GetValue(s.Objective) is { } objectiveName && Core.Search.SearchObjectiveNames.TryParse(objectiveName) is null)
        {
            stderr.WriteLine($"error: --objective '{objectiveName}' is not an objective. Use one of: {string.Join(", ", Core.Search.SearchObjectiveNames.All)}.");
            code = CliApplication.InputError;
            return null;
        }

        var lead = input.Lead;
        if (parse.GetValue(s.Placement) is { } placementName)
        {
            if (PlacementNames.TryParse(placementName) is not { } placement)
            {
                stderr.WriteLine($"error: --placement '{placementName}' is not a placement. Use one of: {string.Join(", ", PlacementNames.All)}.");
                code = CliApplication.InputError;
                return null;
            }

            lead = lead with { Placement = placement };
        }

        var type = parse.GetValue(s.Type) ?? input.CompensatorType;
        if (parse.GetValue(s.Kinds) is null && DesignWorkflow.KindOf(type) is { } kind && s.StrayFlags(parse, kind, lead.Placement) is { } stray)
        {
            stderr.WriteLine(stray);
            code = CliApplication.InputError;
            return null;
        }

        return input with
        {
            CompensatorType = type,
            Prefilter = parse.GetValue(s.Prefilter) || input.Prefilter,
            Slow = input.Slow with
            {
                ZeroFraction = parse.GetValue(s.ZeroFraction) ?? input.Slow.ZeroFraction,
                AngleBudgetDegrees = parse.GetValue(s.AngleBudget) ?? input.Slow.AngleBudgetDegrees,
                Margin = parse.GetValue(s.Margin) ?? input.Slow.Margin,
                FilterRatio = parse.GetValue(s.FilterRatio) ?? input.Slow.FilterRatio,
                EqualFactor = parse.GetValue(s.EqualFactor) || input.Slow.EqualFactor,
            },
            Lead = lead with
            {
                Zero = parse.GetValue(s.Zero) ?? lead.Zero,
                Pole = parse.GetValue(s.Pole) ?? lead.Pole,
                Ratio = parse.GetValue(s.Ratio) ?? lead.Ratio,
                MaxStageAngleDegrees = parse.GetValue(s.MaxStageAngle) ?? lead.MaxStageAngleDegrees,
            },
        };
    }
}
