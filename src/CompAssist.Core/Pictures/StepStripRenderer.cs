using System.Text;
using CompAssist.Core.Simulation;

namespace CompAssist.Core.Pictures;

/// <summary>A text strip of a step response: the curve, the final value and its ±2 % band, time along the bottom.</summary>
public static class StepStripRenderer
{
    private const int MinLabelWidth = 8;

    /// <summary>Renders <paramref name="response"/> in <paramref name="width"/>×<paramref name="height"/> characters.</summary>
    public static string Render(SampledResponse response, double finalValue, int width, int height, PictureStyle style)
    {
        ArgumentNullException.ThrowIfNull(response);
        var rows = Math.Max(height - 1, 3);
        var values = response.Values;
        var top = Math.Max(values.Max(), finalValue * 1.02);
        var bottom = Math.Min(values.Min(), 0.0);
        if (top - bottom <= 0)
        {
            top = bottom + 1;
        }

        // Every row's axis stays in one column, however long the widest value label is.
        var labelWidth = Math.Max(MinLabelWidth, new[] { top, bottom, finalValue }.Max(v => SPlaneRenderer.Number(v).Length) + 2);
        var columns = Math.Max(width - labelWidth, 10);

        var unicode = style == PictureStyle.Unicode;
        var sub = unicode ? 4 : 1;
        var cells = new char[rows, columns];
        var dots = new int[rows, columns];
        for (var r = 0; r < rows; r++)
        {
            for (var c = 0; c < columns; c++)
            {
                cells[r, c] = ' ';
            }
        }

        int RowOf(double v, int resolution) => (int)Math.Floor((top - v) / (top - bottom) * ((rows * resolution) - 1e-9));

        foreach (var level in new[] { finalValue * 1.02, finalValue * 0.98 })
        {
            var r = RowOf(level, 1);
            for (var c = 0; c < columns; c += 2)
            {
                if (r >= 0 && r < rows)
                {
                    cells[r, c] = unicode ? '┈' : '-';
                }
            }
        }

        for (var c = 0; c < columns * (unicode ? 2 : 1); c++)
        {
            var index = (int)Math.Round((double)c / ((columns * (unicode ? 2 : 1)) - 1) * (values.Length - 1));
            var y = values[Math.Clamp(index, 0, values.Length - 1)];
            var fine = RowOf(y, sub);
            var column = unicode ? c / 2 : c;
            var row = fine / sub;
            if (row < 0 || row >= rows || column >= columns)
            {
                continue;
            }

            if (unicode)
            {
                var dx = c % 2;
                var dy = fine % sub;
                dots[row, column] |= dx == 0 ? (dy switch { 0 => 0x01, 1 => 0x02, 2 => 0x04, _ => 0x40 }) : (dy switch { 0 => 0x08, 1 => 0x10, 2 => 0x20, _ => 0x80 });
                cells[row, column] = (char)(0x2800 + dots[row, column]);
            }
            else
            {
                cells[row, column] = '*';
            }
        }

        var sb = new StringBuilder();
        for (var r = 0; r < rows; r++)
        {
            var label = r == 0 ? SPlaneRenderer.Number(top) : (r == rows - 1 ? SPlaneRenderer.Number(bottom) : (r == RowOf(finalValue, 1) ? SPlaneRenderer.Number(finalValue) : string.Empty));
            var line = new char[columns];
            for (var c = 0; c < columns; c++)
            {
                line[c] = cells[r, c];
            }

            sb.Append(label.PadLeft(labelWidth - 2)).Append(' ').Append(unicode ? '┤' : '|').Append(new string(line).TrimEnd()).Append('\n');
        }

        var horizon = $"{SPlaneRenderer.Number(response.Horizon)} s";
        sb.Append(new string(' ', labelWidth)).Append('0').Append(horizon.PadLeft(columns - 1)).Append('\n');
        return sb.ToString();
    }
}
