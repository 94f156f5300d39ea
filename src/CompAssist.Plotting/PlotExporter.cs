using OxyPlot;

namespace CompAssist.Plotting;

/// <summary>Writes plot models as SVG (text measured with Skia, so labels fit) or PNG.</summary>
public static class PlotExporter
{
    /// <summary>Writes the model to <paramref name="path"/>; the format follows the extension (.svg or .png).</summary>
    /// <exception cref="ArgumentException">The extension is neither .svg nor .png.</exception>
    public static void Write(PlotModel model, string path, int width = 1000, int height = 700)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(path);
        var extension = Path.GetExtension(path).ToLowerInvariant();
        var temporary = path + ".tmp";
        using (var stream = File.Create(temporary))
        {
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
        }

        File.Move(temporary, path, overwrite: true);
    }
}
