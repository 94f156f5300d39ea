using CompAssist.Core.Cases;
using CompAssist.Core.Common;
using CompAssist.Core.Export;
using CompAssist.Core.Workflow;
using CompAssist.Plotting;

namespace CompAssist.Cli.Commands;

/// <summary>Writes a hand-off package and its two plots into a folder (shared by `handoff` and the editor).</summary>
internal static class HandoffFiles
{
    /// <summary>Writes every file atomically; returns a problem when the folder cannot be written.</summary>
    public static Problem? Write(DesignReport report, HandoffPackage package, HandoffOptions options, string folder, string caseName)
    {
        try
        {
            Directory.CreateDirectory(folder);
            foreach (var (file, content) in package.Files)
            {
                AtomicFile.Write(Path.Combine(folder, file), content);
            }

            var plot = PlotBuilder.SampledStep(caseName, report.Check.Output, package.Proof.Step);
            PlotExporter.Write(plot, Path.Combine(folder, $"{options.Name}-step.svg"));
            var poles = PlotBuilder.ZPlanePoles(caseName, package.Proof.ClosedLoopPoles, package.Quantization.Quantized.Zeros, package.Discretization.Discrete.SampleTime);
            PlotExporter.Write(poles, Path.Combine(folder, $"{options.Name}-poles.svg"));
            return null;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            return new Problem($"cannot write into {folder}: {e.Message}", "Choose a folder you can write to.");
        }
    }
}
