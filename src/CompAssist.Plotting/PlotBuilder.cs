using System.Numerics;
using CompAssist.Core.Analysis;
using CompAssist.Core.Model;
using CompAssist.Core.Pictures;
using CompAssist.Core.Reporting;
using CompAssist.Core.Simulation;
using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.Legends;
using OxyPlot.Series;

namespace CompAssist.Plotting;

/// <summary>
/// Builds OxyPlot models. Colours are paired with distinct line styles and markers so the pictures still
/// read in greyscale.
/// </summary>
public static class PlotBuilder
{
    private static readonly OxyColor Branch = OxyColor.FromRgb(0x1f, 0x4e, 0x9a);
    private static readonly OxyColor Guide = OxyColor.FromRgb(0x99, 0x99, 0x99);
    private static readonly OxyColor Designed = OxyColor.FromRgb(0xc0, 0x1c, 0x28);
    private static readonly OxyColor TargetColour = OxyColor.FromRgb(0xe6, 0x7e, 0x00);

    /// <summary>The model of one plot kind.</summary>
    public static PlotModel Build(PlotKind kind, PlotInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        return kind switch
        {
            PlotKind.Locus => Locus(input),
            PlotKind.Poles => PoleZeroMap(input),
            PlotKind.Step => Step(input),
            PlotKind.Frequency => Frequency(input),
            _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "Unknown plot kind."),
        };
    }

    /// <summary>The continuous step beside the sampled loop's step at the sampling instants.</summary>
    public static PlotModel SampledStep(string title, SampledResponse continuous, SampledResponse sampled)
    {
        ArgumentNullException.ThrowIfNull(continuous);
        ArgumentNullException.ThrowIfNull(sampled);
        var model = NewModel(title.Length > 0 ? $"Continuous and sampled step — {title}" : "Continuous and sampled step", $"sample time {TransferFunctionFormatter.Number(sampled.SampleTime, 4)} s, plant by zero-order hold");
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Bottom, Title = "time", Unit = "s", MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromAColor(40, OxyColors.Black) });
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Left, Title = "output y", MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromAColor(40, OxyColors.Black) });
        var line = new LineSeries { Title = "continuous", Color = Branch, StrokeThickness = 1.8 };
        for (var k = 0; k < continuous.Values.Length; k++)
        {
            line.Points.Add(new DataPoint(continuous.TimeAt(k), continuous.Values[k]));
        }

        var stairs = new StairStepSeries { Title = "sampled (held between samples)", Color = Designed, LineStyle = LineStyle.Dash, StrokeThickness = 1.2 };
        var end = Math.Min(sampled.Values.Length, (int)Math.Ceiling(continuous.Horizon / sampled.SampleTime) + 1);

        // A fast sample time over a long tail gives more steps than a picture can show: draw at most about
        // 4,000 of them (every k-th sample, held), which a reader cannot tell from all of them at plot width.
        var stride = Math.Max(1, end / 4000);
        for (var k = 0; k < end; k += stride)
        {
            stairs.Points.Add(new DataPoint(sampled.TimeAt(k), sampled.Values[k]));
        }

        model.Series.Add(line);
        model.Series.Add(stairs);
        Legend(model);
        return model;
    }

    /// <summary>
    /// The sampled loop's closed-loop poles in the z-plane, zoomed where they are (near z = 1 for fast sampling) with
    /// the unit-circle arc, constant-ζ curves (ζ = 0.2 … 0.8) and constant-ωn·T curves, so the margin to the circle
    /// can be read.
    /// </summary>
    public static PlotModel ZPlanePoles(string title, IEnumerable<Complex> closedLoopPoles, IEnumerable<Complex> controllerZeros, double sampleTime)
    {
        ArgumentNullException.ThrowIfNull(closedLoopPoles);
        ArgumentNullException.ThrowIfNull(controllerZeros);
        var poles = closedLoopPoles.ToList();
        var zeros = controllerZeros.ToList();
        var view = ZPlaneView(poles, zeros);
        var zoomed = view.Width < 2.0;
        var model = NewModel(title.Length > 0 ? $"Sampled closed-loop poles — {title}" : "Sampled closed-loop poles", $"z-plane, T = {TransferFunctionFormatter.Number(sampleTime, 4)} s; stable inside the unit circle{(zoomed ? "; zoomed on the poles" : string.Empty)}");
        model.PlotType = PlotType.Cartesian;
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Bottom, Title = "Re z", Minimum = view.Left, Maximum = view.Left + view.Width, MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromAColor(30, OxyColors.Black) });
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Left, Title = "Im z", Minimum = view.Bottom, Maximum = view.Bottom + view.Width, MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromAColor(30, OxyColors.Black) });
        var circle = new LineSeries { Title = "unit circle", Color = Guide, LineStyle = LineStyle.Dash, StrokeThickness = 1 };
        for (var k = 0; k <= 3600; k++)
        {
            circle.Points.Add(new DataPoint(Math.Cos(k * Math.PI / 1800), Math.Sin(k * Math.PI / 1800)));
        }

        model.Series.Add(circle);
        foreach (var zeta in new[] { 0.2, 0.4, 0.6, 0.8 })
        {
            model.Series.Add(Curve(zeta == 0.2 ? "constant ζ (0.2, 0.4, 0.6, 0.8)" : null, 400, k => k / 400.0 * Math.PI / Math.Sqrt(1 - (zeta * zeta)), w => Complex.Exp(w * new Complex(-zeta, Math.Sqrt(1 - (zeta * zeta))))));
        }

        var first = true;
        foreach (var wnT in GuideFrequencies(view))
        {
            model.Series.Add(Curve(first ? "constant ωn·T" : null, 100, k => k / 100.0, zeta => Complex.Exp(wnT * new Complex(-zeta, Math.Sqrt(1 - (zeta * zeta))))));
            first = false;
        }

        Markers(model, poles, MarkerType.Cross, Designed, "closed-loop pole");
        Markers(model, zeros, MarkerType.Circle, Branch, "controller zero", hollow: true);
        Legend(model);
        return model;
    }

    /// <summary>
    /// The square window of the z-plane the pole plot shows: the whole unit circle (−1.3 … 1.3) unless the poles and
    /// the zeros near them, with z = 1, fit in a box less than half as wide, which is then shown with a fifth of its
    /// width as margin on each side.
    /// </summary>
    public static (double Left, double Bottom, double Width) ZPlaneView(IReadOnlyCollection<Complex> poles, IReadOnlyCollection<Complex> zeros)
    {
        ArgumentNullException.ThrowIfNull(poles);
        ArgumentNullException.ThrowIfNull(zeros);
        var points = poles.Concat(zeros.Where(z => z.Magnitude <= 1.5)).Where(z => double.IsFinite(z.Real) && double.IsFinite(z.Imaginary)).Append(Complex.One).ToList();
        var (left, right) = (points.Min(z => z.Real), points.Max(z => z.Real));
        var (bottom, top) = (points.Min(z => z.Imaginary), points.Max(z => z.Imaginary));
        var size = Math.Max(Math.Max(right - left, top - bottom), 1e-6);
        if (size > 1.3 || poles.Count == 0)
        {
            return (-1.3, -1.3, 2.6);
        }

        var width = size * 1.4;
        return (((left + right) / 2) - (width / 2), ((bottom + top) / 2) - (width / 2), width);
    }

    // ωn·T values on a 1-2-5 ladder whose curves pass through the window (at most six).
    private static IEnumerable<double> GuideFrequencies((double Left, double Bottom, double Width) view)
    {
        var reach = Math.Min(Math.PI, Math.Max(1e-6, 1.5 * view.Width));
        var values = new List<double>();
        for (var decade = Math.Pow(10, Math.Floor(Math.Log10(reach)) - 1); values.Count < 6 && decade <= Math.PI; decade *= 10)
        {
            foreach (var m in new[] { 1.0, 2.0, 5.0 })
            {
                var v = m * decade;
                if (v <= reach && v <= Math.PI && v >= reach / 20)
                {
                    values.Add(v);
                }
            }
        }

        return values.Take(6);
    }

    private static LineSeries Curve(string? title, int steps, Func<int, double> parameter, Func<double, Complex> point)
    {
        // The upper half, a break, then the lower half (its mirror image).
        var line = new LineSeries { Title = title, Color = OxyColor.FromAColor(160, Guide), LineStyle = LineStyle.Dot, StrokeThickness = 1 };
        for (var k = 0; k <= steps; k++)
        {
            var z = point(parameter(k));
            line.Points.Add(new DataPoint(z.Real, z.Imaginary));
        }

        line.Points.Add(DataPoint.Undefined);
        for (var k = 0; k <= steps; k++)
        {
            var z = point(parameter(k));
            line.Points.Add(new DataPoint(z.Real, -z.Imaginary));
        }

        return line;
    }

    private static PlotModel NewModel(string title, string subtitle) => new()
    {
        Title = title,
        Subtitle = subtitle,
        DefaultFont = "DejaVu Sans",
        DefaultFontSize = 12,
        Background = OxyColors.White,
        PlotAreaBorderColor = OxyColors.Gray,
    };

    private static string Title(PlotInput input, string what) => input.Title.Length > 0 ? $"{what} — {input.Title}" : what;

    private static PlotModel Locus(PlotInput input)
    {
        var model = NewModel(Title(input, "Root locus"), $"C·G·H = {input.Loop.OpenLoop(input.Compensator)}" + (input.Locus.Approximate ? "  (delay by Padé)" : string.Empty));
        var focus = input.Target is { } t ? PlaneView.MustShow(t, input.ClosedLoopPoles).ToArray() : input.ClosedLoopPoles.ToArray();
        var view = PlaneView.Frame(focus, input.Locus.Poles.Concat(input.Locus.Zeros).Concat(input.ClosedLoopPoles));
        PlaneAxes(model, view);
        var first = true;
        foreach (var branch in LocusReport.Polylines(input.Locus))
        {
            var line = new LineSeries { Color = Branch, StrokeThickness = 1.6, Title = first ? "locus, K from 0 to ∞" : null };
            foreach (var p in branch)
            {
                line.Points.Add(new DataPoint(p.Real, p.Imaginary));
            }

            model.Series.Add(line);
            first = false;
        }

        Guides(model, input, view);
        Markers(model, input.Locus.Poles, MarkerType.Cross, OxyColors.Black, "open-loop pole");
        Markers(model, input.Locus.Zeros, MarkerType.Circle, OxyColors.Black, "open-loop zero", hollow: true);
        Markers(model, input.ClosedLoopPoles, MarkerType.Square, Designed, "closed-loop pole (design)");
        if (input.Target is { } target)
        {
            Markers(model, [target, Complex.Conjugate(target)], MarkerType.Diamond, TargetColour, "target");
        }

        Legend(model);
        return model;
    }

    private static PlotModel PoleZeroMap(PlotInput input)
    {
        var model = NewModel(Title(input, "Closed-loop poles and zeros"), $"C(s) = {input.Compensator}");
        var view = PlaneView.Frame(input.ClosedLoopPoles, input.ClosedLoopZeros);
        PlaneAxes(model, view);
        Guides(model, input, view);
        Markers(model, input.ClosedLoopPoles, MarkerType.Cross, Designed, "closed-loop pole");
        Markers(model, input.ClosedLoopZeros, MarkerType.Circle, Branch, "closed-loop zero", hollow: true);
        Legend(model);
        return model;
    }

    private static PlotModel Step(PlotInput input)
    {
        var check = input.Check;
        var model = NewModel(Title(input, "Unit step response"), $"exact at the samples (h = {TransferFunctionFormatter.Number(check.Step.SampleTime, 3)} s); overshoot {TransferFunctionFormatter.Number(check.Step.OvershootPercent, 3)} %, 2 % settling {TransferFunctionFormatter.Number(check.Step.SettlingTime2Percent, 3)} s");
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Bottom, Title = "time", Unit = "s", MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromAColor(40, OxyColors.Black) });
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Left, Title = "output y", Key = "y", MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromAColor(40, OxyColors.Black) });
        var y = new LineSeries { Title = "output y", Color = Branch, StrokeThickness = 1.8, YAxisKey = "y" };
        for (var k = 0; k < check.Output.Values.Length; k++)
        {
            y.Points.Add(new DataPoint(check.Output.TimeAt(k), check.Output.Values[k]));
        }

        model.Series.Add(y);
        if (check.Effort is { } u)
        {
            model.Axes.Add(new LinearAxis { Position = AxisPosition.Right, Title = "actuator command u", Key = "u" });
            var series = new LineSeries { Title = "actuator command u (right axis)", Color = Designed, LineStyle = LineStyle.Dash, StrokeThickness = 1.4, YAxisKey = "u" };
            for (var k = 0; k < u.Values.Length; k++)
            {
                series.Points.Add(new DataPoint(u.TimeAt(k), u.Values[k]));
            }

            model.Series.Add(series);
        }

        foreach (var level in new[] { 0.98, 1.02 })
        {
            model.Annotations.Add(new LineAnnotation { Type = LineAnnotationType.Horizontal, Y = level * check.Step.FinalValue, YAxisKey = "y", Color = Guide, LineStyle = LineStyle.Dot, Text = level > 1 ? "±2 % band" : string.Empty });
        }

        Legend(model);
        return model;
    }

    private static PlotModel Frequency(PlotInput input)
    {
        var open = input.Loop.OpenLoop(input.Compensator).Scaled(input.Loop.SignFactor);
        var corners = open.Zeros.Concat(open.Poles).Select(r => r.Magnitude).Where(m => m > 0).DefaultIfEmpty(1.0).ToList();
        var response = FrequencyResponse.Of(open, corners.Min() / 100, corners.Max() * 100, 800);
        var margins = input.Check.Margins;
        var subtitle = margins is null ? "closed loop unstable: no margins claimed"
            : $"gain margin {(double.IsPositiveInfinity(margins.GainMarginDb) ? "∞" : TransferFunctionFormatter.Number(margins.GainMarginDb, 3) + " dB")}, phase margin {TransferFunctionFormatter.Number(margins.PhaseMarginDeg, 3)}° at {TransferFunctionFormatter.Number(margins.GainCrossover, 3)} rad/s";
        var model = NewModel(Title(input, "Loop frequency response C·G·H"), subtitle);
        model.Axes.Add(new LogarithmicAxis { Position = AxisPosition.Bottom, Title = "frequency", Unit = "rad/s", MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromAColor(40, OxyColors.Black) });
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Left, Title = "magnitude", Unit = "dB", Key = "mag", StartPosition = 0.52, EndPosition = 1.0, MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromAColor(40, OxyColors.Black) });
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Left, Title = "phase", Unit = "°", Key = "phase", StartPosition = 0.0, EndPosition = 0.48, MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromAColor(40, OxyColors.Black) });
        var mag = new LineSeries { Title = "|L(jω)|", Color = Branch, StrokeThickness = 1.6, YAxisKey = "mag" };
        var phase = new LineSeries { Title = "∠L(jω)", Color = Designed, LineStyle = LineStyle.Dash, StrokeThickness = 1.6, YAxisKey = "phase" };
        for (var i = 0; i < response.Frequencies.Length; i++)
        {
            mag.Points.Add(new DataPoint(response.Frequencies[i], response.MagnitudeDb[i]));
            phase.Points.Add(new DataPoint(response.Frequencies[i], response.PhaseDegrees[i]));
        }

        model.Series.Add(mag);
        model.Series.Add(phase);
        model.Annotations.Add(new LineAnnotation { Type = LineAnnotationType.Horizontal, Y = 0, YAxisKey = "mag", Color = Guide, LineStyle = LineStyle.Dot, Text = "0 dB" });
        var unwrappedAtCrossing = -180.0;
        if (margins is not null && double.IsFinite(margins.GainCrossover))
        {
            model.Annotations.Add(new LineAnnotation { Type = LineAnnotationType.Vertical, X = margins.GainCrossover, YAxisKey = "mag", Color = Guide, LineStyle = LineStyle.Dash, Text = "gain crossover" });
            var index = response.Frequencies.ToList().FindIndex(w => w >= margins.GainCrossover);
            if (index >= 0)
            {
                unwrappedAtCrossing = response.PhaseDegrees[index] - margins.PhaseMarginDeg;
            }
        }

        model.Annotations.Add(new LineAnnotation { Type = LineAnnotationType.Horizontal, Y = unwrappedAtCrossing, YAxisKey = "phase", Color = Guide, LineStyle = LineStyle.Dot, Text = "−180°" });
        if (margins is not null && double.IsFinite(margins.PhaseCrossover))
        {
            model.Annotations.Add(new LineAnnotation { Type = LineAnnotationType.Vertical, X = margins.PhaseCrossover, YAxisKey = "phase", Color = Guide, LineStyle = LineStyle.Dash, Text = "phase crossover" });
        }

        Legend(model);
        return model;
    }

    private static void PlaneAxes(PlotModel model, PlaneView view)
    {
        model.PlotType = PlotType.Cartesian;
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Bottom, Title = "real part σ", Unit = "1/s", Minimum = view.Left, Maximum = view.Right, MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromAColor(30, OxyColors.Black) });
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Left, Title = "imaginary part ω", Unit = "rad/s", Minimum = -view.ImaginaryHalfHeight, Maximum = view.ImaginaryHalfHeight, MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromAColor(30, OxyColors.Black) });
        model.Annotations.Add(new LineAnnotation { Type = LineAnnotationType.Vertical, X = 0, Color = OxyColors.Gray });
        model.Annotations.Add(new LineAnnotation { Type = LineAnnotationType.Horizontal, Y = 0, Color = OxyColors.Gray });
    }

    private static void Guides(PlotModel model, PlotInput input, PlaneView view)
    {
        if (input.Target is not { } t)
        {
            return;
        }

        var wn = t.Magnitude;
        var zeta = -t.Real / wn;
        var reach = 3 * Math.Max(Math.Abs(view.Left), view.ImaginaryHalfHeight);
        foreach (var sign in new[] { 1.0, -1.0 })
        {
            var ray = new LineSeries { Color = Guide, LineStyle = LineStyle.Dash, StrokeThickness = 1, Title = sign > 0 ? $"ζ = {TransferFunctionFormatter.Number(zeta, 3)}" : null };
            ray.Points.Add(new DataPoint(0, 0));
            var end = Complex.FromPolarCoordinates(reach, Math.PI - (sign * Math.Acos(Math.Clamp(zeta, 0, 1))));
            ray.Points.Add(new DataPoint(end.Real, end.Imaginary));
            model.Series.Add(ray);
        }

        var arc = new LineSeries { Color = Guide, LineStyle = LineStyle.Dot, StrokeThickness = 1, Title = $"ωn = {TransferFunctionFormatter.Number(wn, 3)} rad/s" };
        for (var k = 0; k <= 120; k++)
        {
            var z = Complex.FromPolarCoordinates(wn, (Math.PI / 2) + (Math.PI * k / 120));
            arc.Points.Add(new DataPoint(z.Real, z.Imaginary));
        }

        model.Series.Add(arc);
    }

    private static void Markers(PlotModel model, IEnumerable<Complex> points, MarkerType marker, OxyColor colour, string title, bool hollow = false)
    {
        var series = new ScatterSeries
        {
            Title = title,
            MarkerType = marker,
            MarkerSize = 6,
            MarkerStroke = colour,
            MarkerStrokeThickness = 2,
            MarkerFill = hollow ? OxyColors.White : colour,
        };
        foreach (var p in points)
        {
            series.Points.Add(new ScatterPoint(p.Real, p.Imaginary));
        }

        if (series.Points.Count > 0)
        {
            model.Series.Add(series);
        }
    }

    private static void Legend(PlotModel model) => model.Legends.Add(new Legend
    {
        LegendPosition = LegendPosition.RightTop,
        LegendPlacement = LegendPlacement.Outside,
        LegendOrientation = LegendOrientation.Vertical,
        LegendBackground = OxyColor.FromAColor(220, OxyColors.White),
        LegendBorder = OxyColors.LightGray,
    });
}
