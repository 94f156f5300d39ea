using System.Numerics;
using CompAssist.Core.Common;
using CompAssist.Core.Model;

namespace CompAssist.Core.Analysis;

/// <summary>
/// The angle and magnitude conditions of a loop at one s-plane point, with delays exact.
/// </summary>
/// <param name="Point">The point s.</param>
/// <param name="Value">L(s) = C·G·H at s.</param>
/// <param name="Magnitude">|L(s)|.</param>
/// <param name="AngleDegrees">∠L(s), wrapped to (−180°, 180°].</param>
/// <param name="AngleSumDegrees">∠L(s) as the unwrapped sum of zero angles minus pole angles (delay included).</param>
/// <param name="RequiredAngleDegrees">180° for negative feedback, 0° for positive feedback.</param>
/// <param name="AngleResidualDegrees">∠L(s) − required, wrapped to (−180°, 180°]; 0 on the locus.</param>
/// <param name="Gain">
/// The real gain K ≥ 0 that puts a closed-loop root at s when the point is on the locus (1/|L|);
/// otherwise the magnitude-condition value 1/|L| of the nearest-angle interpretation.
/// </param>
public sealed record PointAnalysis(
    Complex Point,
    Complex Value,
    double Magnitude,
    double AngleDegrees,
    double AngleSumDegrees,
    double RequiredAngleDegrees,
    double AngleResidualDegrees,
    double Gain)
{
    /// <summary>Angle residual, in degrees, below which a point counts as on the locus.</summary>
    public const double OnLocusToleranceDegrees = 1e-6;

    /// <summary>True when the angle condition holds to <see cref="OnLocusToleranceDegrees"/>.</summary>
    public bool OnLocus => Math.Abs(AngleResidualDegrees) <= OnLocusToleranceDegrees;

    /// <summary>
    /// The angle a compensator must add at s for the point to be on the locus, wrapped to (−180°, 180°]:
    /// positive means lead (phase advance) is needed.
    /// </summary>
    public double AngleDeficiencyDegrees => Angles.WrapDegrees(-AngleResidualDegrees);

    /// <summary>Evaluates a loop (with an optional compensator, default 1) at s.</summary>
    /// <exception cref="ArgumentException">s is a pole or zero of the loop (the conditions are undefined).</exception>
    public static PointAnalysis At(Loop loop, Complex s, TransferFunction? compensator = null)
    {
        ArgumentNullException.ThrowIfNull(loop);
        var open = loop.OpenLoop(compensator ?? TransferFunction.Unity);
        var value = open.Evaluate(s);
        var magnitude = open.MagnitudeAt(s);
        if (!(magnitude > 0.0) || !double.IsFinite(magnitude))
        {
            throw new ArgumentException("The point is a pole or a zero of the loop; the angle is undefined there.", nameof(s));
        }

        var sum = Angles.ToDegrees(open.PhaseAt(s));
        var angle = Angles.WrapDegrees(sum);
        var required = loop.Sign == FeedbackSign.Negative ? 180.0 : 0.0;
        var residual = Angles.WrapDegrees(angle - required);
        return new PointAnalysis(s, value, magnitude, angle, sum, required, residual, 1.0 / magnitude);
    }
}
