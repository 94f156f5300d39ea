using OxyPlot;

namespace CompAssist.Plotting;

/// <summary>Writes plot models as SVG (text measured with Skia, so labels fit) or PNG.</summary>
public static class PlotExporter
{
    /// <summary>Writes the model to <paramref name="path"/>; the format follows the extension (.svg or .png).</summary>
    /// <exception cref="ArgumentException">The extension is neither .svg nor .png.</exception>
    /// <exception cref="IOException">The file cannot be written (the old one is untouched).</exception>
    public static void Write(PlotModel model, string path, int width = 1000, int height = 700)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(path);
        var extension = Path.GetExtension(path).ToLowerInvariant();
        // Rendered to memory first, so that a failure inside the graphics library leaves no file at all, then
        // written through the one safe writer (random exclusive temporary, never through a planted link).
        using var stream = new MemoryStream();
        switch (extension)
        {
            case ".svg":
                new OxyPlot.SkiaSharp.SvgExporter { Width = width, Height = height }.Export(model, stream);
                break;
            case ".png":
                new OxyPlot.SkiaSharp.PngExporter { Width = width, Height = height }.Export(model, stream);
                break;
            default:
                throw new ArgumentException($"Unknown plot format '{extension}'; use .svg or .png.", nameof(path));
        }

        CompAssist.Core.Cases.AtomicFile.Write(path, stream.ToArray());
    }
}
