using System.Buffers.Binary;
using System.Xml.Linq;
using CompAssist.Core.Cases;
using CompAssist.Core.Workflow;

namespace CompAssist.Plotting.Tests;

public class PlotExporterTests
{
    private static PlotInput Design()
    {
        var (c, error) = CaseFileReader.Read("""
            format = 1
            name = "test loop"
            [loop]
            plant = "4/(s(s+2))"
            [requirements]
            zeta = 0.5
            natural_frequency = 4
            [compensator]
            placement = "bisector"
            """, "test");
        Assert.Null(error);
        var run = DesignWorkflow.Run(c!);
        Assert.True(run.IsSuccess);
        return PlotInputs.FromDesign(run.Report!, "test loop");
    }

    [Theory]
    [InlineData(PlotKind.Locus, "Root locus", "real part σ")]
    [InlineData(PlotKind.Poles, "Closed-loop poles and zeros", "real part σ")]
    [InlineData(PlotKind.Step, "Unit step response", "time")]
    [InlineData(PlotKind.Frequency, "Loop frequency response", "frequency")]
    public void Write_Svg_IsXmlWithTitleAxesAndSeries(PlotKind kind, string title, string axisTitle)
    {
        var path = Path.Combine(Path.GetTempPath(), $"compassist-{kind}-{Guid.NewGuid():N}.svg");
        try
        {
            var model = PlotBuilder.Build(kind, Design());
            Assert.StartsWith(title, model.Title, StringComparison.Ordinal);
            PlotExporter.Write(model, path, 900, 600);
            var doc = XDocument.Load(path);
            Assert.Equal("svg", doc.Root!.Name.LocalName);

            // Skia writes some runs (the bold title) as glyph outlines, so only the axis titles are checked as text.
            var text = string.Concat(doc.Descendants().Where(e => e.Name.LocalName == "text").Select(e => e.Value));
            Assert.Contains(axisTitle, text, StringComparison.Ordinal);
            var drawn = doc.Descendants().Count(e => e.Name.LocalName is "path" or "polyline" or "line");
            Assert.True(drawn > 10, $"only {drawn} drawn elements");
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Fact]
    public void Write_Png_HasRequestedSize()
    {
        var path = Path.Combine(Path.GetTempPath(), $"compassist-{Guid.NewGuid():N}.png");
        try
        {
            PlotExporter.Write(PlotBuilder.Build(PlotKind.Step, Design()), path, 640, 480);
            var bytes = File.ReadAllBytes(path);
            Assert.Equal([0x89, (byte)'P', (byte)'N', (byte)'G'], bytes[..4]);
            Assert.Equal(640, BinaryPrimitives.ReadInt32BigEndian(bytes.AsSpan(16, 4)));
            Assert.Equal(480, BinaryPrimitives.ReadInt32BigEndian(bytes.AsSpan(20, 4)));
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Fact]
    public void Write_UnknownExtension_Throws()
    {
        Assert.Throws<ArgumentException>(() => PlotExporter.Write(PlotBuilder.Build(PlotKind.Step, Design()), Path.Combine(Path.GetTempPath(), "x.bmp")));
    }
}
