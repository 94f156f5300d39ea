using System.CommandLine;
using CompAssist.Core.Cases;
using CompAssist.Core.Model;
using CompAssist.Core.Reporting;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;
using CompAssist.Core.Workflow;

namespace CompAssist.Cli.Commands;

/// <summary><c>compassist design</c>: synthesize a compensator and prove the closed loop.</summary>
internal static class DesignCommand
{
    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var settings = new DesignSettings();
        var command = new Command("design", "Design a compensator for a target pole and prove the closed loop.");
        command.Arguments.Add(settings.Case);
        foreach (var option in settings.Options)
        {
            command.Options.Add(option);
        }

        command.SetAction(parse => Execute(parse, settings, stdout, stderr));
        return command;
    }

    private static int Execute(ParseResult parse, DesignSettings s, TextWriter stdout, TextWriter stderr)
    {
        var casePath = parse.GetValue(s.Case);
        if (casePath is not null && casePath.StartsWith('-'))
        {
            stderr.WriteLine($"error: unknown option '{casePath}'. Run 'compassist design --help' for the options.");
            return CliApplication.UsageError;
        }

        var baseCase = new CaseFile();
        if (casePath is not null)
        {
            var (loaded, error) = CaseFileReader.ReadFile(casePath);
            if (error is not null)
            {
                stderr.WriteLine($"error: {error}");
                return CliApplication.InputError;
            }

            baseCase = loaded!;
        }

        var plant = parse.GetValue(s.Plant) ?? baseCase.Plant;

        var requirements = OverlayRequirements(parse, s, baseCase.Requirements, stderr, out var bad);
        if (bad)
        {
            return CliApplication.InputError;
        }

        var placementName = parse.GetValue(s.Placement);
        var lead = baseCase.Lead;
        if (placementName is not null)
        {
            if (PlacementNames.TryParse(placementName) is not { } placement)
            {
                stderr.WriteLine($"error: --placement '{placementName}' is not a placement. Use one of: {string.Join(", ", PlacementNames.All)}.");
                return CliApplication.InputError;
            }

            lead = lead with { Placement = placement };
        }

        lead = lead with
        {
            Zero = parse.GetValue(s.Zero) ?? lead.Zero,
            Pole = parse.GetValue(s.Pole) ?? lead.Pole,
            Ratio = parse.GetValue(s.Ratio) ?? lead.Ratio,
            MaxStageAngleDegrees = parse.GetValue(s.MaxStageAngle) ?? lead.MaxStageAngleDegrees,
        };

        var input = baseCase with
        {
            Plant = plant,
            Feedback = parse.GetValue(s.Feedback) ?? baseCase.Feedback,
            Sign = parse.GetValue(s.PositiveFeedback) ? FeedbackSign.Positive : baseCase.Sign,
            PadeOrder = parse.GetValue(s.PadeOrder) ?? baseCase.PadeOrder,
            Requirements = requirements,
            CompensatorType = parse.GetValue(s.Type) ?? baseCase.CompensatorType,
            Lead = lead,
        };

        var run = DesignWorkflow.Run(input);
        if (run.FieldError is { } fe)
        {
            stderr.WriteLine($"error: cannot read the {fe.Field} expression:");
            stderr.WriteLine(fe.Error.Render());
            return CliApplication.InputError;
        }

        if (run.Problem is { } problem)
        {
            if (plant is null)
            {
                stderr.WriteLine($"error: {problem.Message}. {problem.Hint}");
                return CliApplication.InputError;
            }

            stderr.WriteLine($"error: {problem.Message}.");
            stderr.WriteLine($"hint: {problem.Hint}");
            return CliApplication.Refused;
        }

        var report = run.Report!;
        stdout.Write(parse.GetValue(s.Json) ? DesignJsonReport.Render(report) + Environment.NewLine : DesignTextReport.Render(report, baseCase.Name));
        return CliApplication.Success;
    }

    private static Requirements OverlayRequirements(ParseResult parse, DesignSettings s, Requirements baseline, TextWriter stderr, out bool bad)
    {
        bad = false;
        var result = baseline;
        var band = parse.GetValue(s.Band);
        if (band is not null && band is not (2 or 5))
        {
            stderr.WriteLine($"error: --band {band} is not supported. Use 2 or 5 (percent).");
            bad = true;
            return result;
        }

        if (band is { } b)
        {
            result = result with { Band = b == 5 ? SettlingBand.FivePercent : SettlingBand.TwoPercent };
        }

        var overshoot = parse.GetValue(s.Overshoot);
        var settling = parse.GetValue(s.Settling);
        var peak = parse.GetValue(s.PeakTime);
        if (overshoot is not null || settling is not null || peak is not null)
        {
            result = result with
            {
                Point = null,
                Zeta = null,
                NaturalFrequency = null,
                MaxOvershootPercent = overshoot ?? result.MaxOvershootPercent,
                MaxSettlingTime = settling ?? result.MaxSettlingTime,
                MaxPeakTime = peak ?? result.MaxPeakTime,
            };
        }

        var zeta = parse.GetValue(s.Zeta);
        var wn = parse.GetValue(s.Wn);
        if (zeta is not null || wn is not null)
        {
            result = result with { Point = null, Zeta = zeta ?? result.Zeta, NaturalFrequency = wn ?? result.NaturalFrequency };
        }

        if (parse.GetValue(s.Target) is { } targetText)
        {
            if (DesignSettings.ParsePoint(targetText) is not { } point)
            {
                stderr.WriteLine($"error: --target '{targetText}' is not a point. Write RE,IM, for example --target=-2,3.46.");
                bad = true;
                return result;
            }

            result = result with { Point = point };
        }

        return result;
    }
}
