using System.Globalization;
using System.Numerics;
using System.Text;

namespace CompAssist.Core.Pictures;

/// <summary>
/// Draws the s-plane as text for a terminal: axes with tick labels, ζ rays and ωn arcs as guides, locus
/// branches, poles, zeros, closed-loop poles and the target, and a one-line legend.
/// </summary>
public static class SPlaneRenderer
{
    private const int LabelWidth = 8;

    /// <summary>Renders the scene in <paramref name="width"/>×<paramref name="height"/> characters (legend included).</summary>
    public static string Render(SPlaneScene scene, PlaneView view, int width, int height, PictureStyle style)
    {
        ArgumentNullException.ThrowIfNull(scene);
        ArgumentNullException.ThrowIfNull(view);
        var columns = Math.Max(width - LabelWidth, 10);
        var rows = Math.Max(height - 2, 5);
        var canvas = new Canvas(columns, rows, view);
        var unicode = style == PictureStyle.Unicode;

        canvas.Axes(unicode ? '─' : '-', unicode ? '│' : '|', unicode ? '┼' : '+');
        if (scene.ZetaGuide is { } zeta && zeta > 0 && zeta < 1)
        {
            var angle = Math.Acos(zeta);
            var reach = 2 * Math.Max(Math.Abs(view.Left), view.ImaginaryHalfHeight) + Math.Abs(view.Right);
            foreach (var sign in new[] { 1.0, -1.0 })
            {
                canvas.Line(Complex.Zero, Complex.FromPolarCoordinates(reach, Math.PI - (sign * angle)), unicode ? '∙' : ':', dotted: true);
            }
        }

        if (scene.NaturalFrequencyGuide is { } wn && wn > 0)
        {
            var previous = new Complex(0, wn);
            for (var k = 1; k <= 96; k++)
            {
                var point = Complex.FromPolarCoordinates(wn, (Math.PI / 2) + (Math.PI * k / 96));
                canvas.Line(previous, point, unicode ? '∙' : ':', dotted: true);
                previous = point;
            }
        }

        foreach (var branch in scene.Branches)
        {
            for (var i = 1; i < branch.Length; i++)
            {
                if (unicode)
                {
                    canvas.BrailleLine(branch[i - 1], branch[i]);
                }
                else
                {
                    canvas.Line(branch[i - 1], branch[i], '.', dotted: false, overAxes: true);
                }
            }
        }

        foreach (var z in scene.Zeros)
        {
            canvas.Mark(z, unicode ? '○' : 'o');
        }

        foreach (var p in scene.Poles)
        {
            canvas.Mark(p, unicode ? '×' : 'x');
        }

        foreach (var p in scene.ClosedLoopPoles)
        {
            canvas.Mark(p, unicode ? '■' : '#');
        }

        if (scene.Target is { } t)
        {
            canvas.Mark(t, unicode ? '◆' : '*');
            canvas.Mark(Complex.Conjugate(t), unicode ? '◆' : '*');
        }

        var sb = new StringBuilder();
        var text = canvas.Rows();
        for (var r = 0; r < rows; r++)
        {
            var label = string.Empty;
            if (r == 0)
            {
                label = Number(view.ImaginaryHalfHeight);
            }
            else if (r == rows - 1)
            {
                label = Number(-view.ImaginaryHalfHeight);
            }
            else if (r == canvas.RowOf(0.0))
            {
                label = "0";
            }

            sb.Append(label.PadLeft(LabelWidth - 2)).Append(' ').Append(unicode ? '┤' : '|').Append(text[r].TrimEnd()).Append('\n');
        }

        var axis = new char[columns];
        Array.Fill(axis, ' ');
        PlaceLabel(axis, 0, Number(view.Left), alignLeft: true);
        PlaceLabel(axis, columns - 1, Number(view.Right), alignLeft: false);
        var zeroColumn = canvas.ColumnOf(0.0);
        if (zeroColumn > 6 && zeroColumn < columns - 6)
        {
            PlaceLabel(axis, zeroColumn, "0", alignLeft: true);
        }

        sb.Append(new string(' ', LabelWidth)).Append(new string(axis).TrimEnd()).Append('\n');
        var legend = unicode
            ? "× pole  ○ zero  ■ closed-loop pole  ◆ target  ⠒ locus"
            : "x pole  o zero  # closed-loop pole  * target  . locus";
        var guides = new List<string>();
        if (scene.ZetaGuide is { } zg)
        {
            guides.Add($"{(unicode ? '∙' : ':')} ζ={Number(zg)}");
        }

        if (scene.NaturalFrequencyGuide is { } wg)
        {
            guides.Add($"arc ωn={Number(wg)}");
        }

        sb.Append(new string(' ', LabelWidth)).Append(legend);
        if (guides.Count > 0)
        {
            sb.Append("  ").Append(string.Join("  ", guides));
        }

        sb.Append('\n');
        return sb.ToString();
    }

    private static void PlaceLabel(char[] row, int column, string label, bool alignLeft)
    {
        var start = alignLeft ? column : column - label.Length + 1;
        start = Math.Clamp(start, 0, Math.Max(0, row.Length - label.Length));
        for (var i = 0; i < label.Length && start + i < row.Length; i++)
        {
            row[start + i] = label[i];
        }
    }

    internal static string Number(double x) => Math.Abs(x) >= 1e4 || (Math.Abs(x) < 1e-2 && x != 0)
        ? x.ToString("0.0e0", CultureInfo.InvariantCulture)
        : x.ToString("0.##", CultureInfo.InvariantCulture);

    /// <summary>A character grid with a braille layer for fine lines.</summary>
    private sealed class Canvas(int columns, int rows, PlaneView view)
    {
        private readonly char[,] _cells = Blank(columns, rows);
        private readonly int[,] _braille = new int[columns, rows];

        public int ColumnOf(double re) => (int)Math.Floor((re - view.Left) / (view.Right - view.Left) * columns);

        public int RowOf(double im) => (int)Math.Floor((view.ImaginaryHalfHeight - im) / (2 * view.ImaginaryHalfHeight) * rows);

        public void Axes(char horizontal, char vertical, char cross)
        {
            var zeroRow = RowOf(0.0);
            var zeroColumn = ColumnOf(0.0);
            for (var c = 0; c < columns; c++)
            {
                Set(c, zeroRow, horizontal);
            }

            for (var r = 0; r < rows; r++)
            {
                Set(zeroColumn, r, vertical);
            }

            Set(zeroColumn, zeroRow, cross);
        }

        public void Mark(Complex z, char symbol)
        {
            var c = ColumnOf(z.Real);
            var r = RowOf(z.Imaginary);
            if (Inside(c, r))
            {
                _braille[c, r] = 0;
                _cells[c, r] = symbol;
            }
        }

        public void Line(Complex a, Complex b, char symbol, bool dotted, bool overAxes = false)
        {
            var steps = (2 * Math.Max(Math.Abs(ColumnOf(b.Real) - ColumnOf(a.Real)), Math.Abs(RowOf(b.Imaginary) - RowOf(a.Imaginary)))) + 1;
            steps = Math.Min(steps, 4 * (columns + rows));
            for (var i = 0; i <= steps; i++)
            {
                if (dotted && i % 2 == 1)
                {
                    continue;
                }

                var z = a + ((b - a) * i / steps);
                var c = ColumnOf(z.Real);
                var r = RowOf(z.Imaginary);
                if (Inside(c, r) && (_cells[c, r] == ' ' || (overAxes && _cells[c, r] is '-' or '|' or ':')))
                {
                    _cells[c, r] = _cells[c, r] == '-' ? '=' : symbol;
                }
            }
        }

        public void BrailleLine(Complex a, Complex b)
        {
            double X(double re) => (re - view.Left) / (view.Right - view.Left) * columns * 2;
            double Y(double im) => (view.ImaginaryHalfHeight - im) / (2 * view.ImaginaryHalfHeight) * rows * 4;
            double ax = X(a.Real), ay = Y(a.Imaginary), bx = X(b.Real), by = Y(b.Imaginary);
            var steps = (int)Math.Ceiling(2 * Math.Max(Math.Abs(bx - ax), Math.Abs(by - ay))) + 1;
            steps = Math.Min(steps, 8 * (columns + rows));
            for (var i = 0; i <= steps; i++)
            {
                var x = ax + ((bx - ax) * i / steps);
                var y = ay + ((by - ay) * i / steps);
                var c = (int)Math.Floor(x / 2);
                var r = (int)Math.Floor(y / 4);
                if (!Inside(c, r) || (_cells[c, r] != ' ' && _braille[c, r] == 0 && !IsLine(_cells[c, r])))
                {
                    continue;
                }

                var dx = Math.Clamp((int)Math.Floor(x - (2 * c)), 0, 1);
                var dy = Math.Clamp((int)Math.Floor(y - (4 * r)), 0, 3);
                _braille[c, r] |= BrailleBit(dx, dy);
                _cells[c, r] = (char)(0x2800 + _braille[c, r]);
            }
        }

        public string[] Rows()
        {
            var result = new string[rows];
            for (var r = 0; r < rows; r++)
            {
                var line = new char[columns];
                for (var c = 0; c < columns; c++)
                {
                    line[c] = _cells[c, r];
                }

                result[r] = new string(line);
            }

            return result;
        }

        private static bool IsLine(char c) => c is '─' or '│' or '┼' or '∙';

        private static int BrailleBit(int dx, int dy) => (dx, dy) switch
        {
            (0, 0) => 0x01,
            (0, 1) => 0x02,
            (0, 2) => 0x04,
            (1, 0) => 0x08,
            (1, 1) => 0x10,
            (1, 2) => 0x20,
            (0, 3) => 0x40,
            _ => 0x80,
        };

        private bool Inside(int c, int r) => c >= 0 && c < columns && r >= 0 && r < rows;

        private void Set(int c, int r, char symbol)
        {
            if (Inside(c, r))
            {
                _cells[c, r] = symbol;
            }
        }

        private static char[,] Blank(int columns, int rows)
        {
            var cells = new char[columns, rows];
            for (var c = 0; c < columns; c++)
            {
                for (var r = 0; r < rows; r++)
                {
                    cells[c, r] = ' ';
                }
            }

            return cells;
        }
    }
}
