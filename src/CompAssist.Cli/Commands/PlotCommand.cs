using System.CommandLine;
using CompAssist.Core.Workflow;
using CompAssist.Plotting;

namespace CompAssist.Cli.Commands;

/// <summary><c>compassist plot</c>: export a locus, pole–zero map, step or frequency response as SVG or PNG.</summary>
internal static class PlotCommand
{
    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var settings = new DesignSettings();
        var compensator = new Option<string?>("--compensator") { Description = "Plot this compensator instead of designing one." };
        var kind = new Option<string>("--kind") { Description = "locus, poles, step or frequency.", DefaultValueFactory = _ => "locus" };
        var output = new PathOption("--out") { Description = "Output file, .svg or .png." };
        var width = new Option<int>("--width") { Description = "Width in pixels (default 1000).", DefaultValueFactory = _ => 1000 };
        var height = new Option<int>("--height") { Description = "Height in pixels (default 700).", DefaultValueFactory = _ => 700 };
        var command = new Command("plot", "Export a picture of the design or of a given compensator as SVG or PNG.");
        settings.AddTo(command);
        foreach (var option in new Option[] { compensator, kind, output, width, height })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse =>
        {
            var path = parse.GetValue(output);
            if (path is null || !(path.EndsWith(".svg", StringComparison.OrdinalIgnoreCase) || path.EndsWith(".png", StringComparison.OrdinalIgnoreCase)))
            {
                stderr.WriteLine("error: --out FILE.svg or --out FILE.png is required.");
                return CliApplication.InputError;
            }

            if (Enum.TryParse<PlotKind>(parse.GetValue(kind), ignoreCase: true, out var plotKind) is false || !Enum.IsDefined(plotKind))
            {
                stderr.WriteLine($"error: --kind '{parse.GetValue(kind)}' is not a plot. Use locus, poles, step or frequency.");
                return CliApplication.InputError;
            }

            var (w, h) = (parse.GetValue(width), parse.GetValue(height));
            if (w < 200 || w > 8000 || h < 150 || h > 8000)
            {
                stderr.WriteLine("error: --width must be 200…8000 and --height 150…8000 pixels.");
                return CliApplication.InputError;
            }

            var input = DesignCommand.Input(parse, settings, stderr, out var code);
            if (input is null)
            {
                return code;
            }

            PlotInput plot;
            if (parse.GetValue(compensator) is { } text)
            {
                var run = CheckWorkflow.Run(input, text);
                if (Errors.Report(run.FieldError, run.Problem, input.Plant is null, stderr) is { } failure)
                {
                    return failure;
                }

                plot = PlotInputs.FromCheck(run.Result!, input.Name);
            }
            else
            {
                var run = settings.Run(parse, input);
                if (Errors.Report(run.FieldError, run.Problem, input.Plant is null, stderr) is { } failure)
                {
                    return failure;
                }

                plot = PlotInputs.FromDesign(run.Report!, input.Name);
            }

            try
            {
                PlotExporter.Write(PlotBuilder.Build(plotKind, plot), path, w, h);
            }
            catch (IOException e)
            {
                stderr.WriteLine($"error: cannot write {path}: {e.Message}");
                return CliApplication.InputError;
            }
            catch (UnauthorizedAccessException e)
            {
                stderr.WriteLine($"error: cannot write {path}: {e.Message}");
                return CliApplication.InputError;
            }

            stdout.WriteLine($"wrote {path} ({plotKind.ToString().ToLowerInvariant()}, {w}×{h})");
            return CliApplication.Success;
        });
        return command;
    }
}
