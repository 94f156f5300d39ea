using System.Numerics;

namespace CompAssist.Core.Targets;

/// <summary>
/// A desired dominant closed-loop pole s = −σ + jωd (held in the upper half-plane; its conjugate is implied).
/// </summary>
public sealed class TargetPole
{
    private TargetPole(Complex point) => Point = point;

    /// <summary>The pole, Im ≥ 0.</summary>
    public Complex Point { get; }

    /// <summary>Decay rate σ = −Re(s), 1/s.</summary>
    public double Sigma => -Point.Real;

    /// <summary>Damped frequency ωd = Im(s), rad/s.</summary>
    public double DampedFrequency => Point.Imaginary;

    /// <summary>Natural frequency ωn = |s|, rad/s.</summary>
    public double NaturalFrequency => Complex.Abs(Point);

    /// <summary>Damping ratio ζ = σ/ωn (negative for a right-half-plane point).</summary>
    public double Zeta => NaturalFrequency == 0 ? 1.0 : Sigma / NaturalFrequency;

    /// <summary>Creates a target at a point; a lower-half-plane point is replaced by its conjugate.</summary>
    /// <exception cref="ArgumentException">A part is not finite.</exception>
    public static TargetPole At(Complex point)
    {
        if (!double.IsFinite(point.Real) || !double.IsFinite(point.Imaginary))
        {
            throw new ArgumentException("The target must be finite.", nameof(point));
        }

        return new TargetPole(point.Imaginary < 0 ? Complex.Conjugate(point) : point);
    }

    /// <summary>Creates the target with damping ratio ζ (0 ≤ ζ ≤ 1) and natural frequency ωn &gt; 0.</summary>
    /// <exception cref="ArgumentOutOfRangeException">ζ or ωn out of range.</exception>
    public static TargetPole FromDamping(double zeta, double naturalFrequency)
    {
        if (!(zeta >= 0.0 && zeta <= 1.0))
        {
            throw new ArgumentOutOfRangeException(nameof(zeta), zeta, "ζ must be between 0 and 1.");
        }

        if (!(naturalFrequency > 0.0) || !double.IsFinite(naturalFrequency))
        {
            throw new ArgumentOutOfRangeException(nameof(naturalFrequency), naturalFrequency, "ωn must be positive.");
        }

        return new TargetPole(new Complex(-zeta * naturalFrequency, naturalFrequency * Math.Sqrt(1.0 - (zeta * zeta))));
    }

    /// <summary>
    /// Predicted overshoot below this (percent) is no visible peak: the pair is all but critically damped, and
    /// a "peak time" or a 0–100 % rise at the far end of an invisible crossing would mislead.
    /// </summary>
    public const double NoVisiblePeakPercent = 1e-3;

    /// <summary>
    /// The second-order predictions for this pole (valid only if it really dominates). Without a visible peak
    /// (overshoot below <see cref="NoVisiblePeakPercent"/>) the overshoot is 0 and the peak time and the
    /// 0–100 % rise time are +∞ (never).
    /// </summary>
    public SecondOrderPrediction Predict()
    {
        var overshoot = SecondOrder.OvershootPercent(Zeta);
        var peak = overshoot >= NoVisiblePeakPercent && DampedFrequency > 0;
        return new(
            OvershootPercent: peak ? overshoot : 0.0,
            PeakTime: peak ? SecondOrder.PeakTime(DampedFrequency) : double.PositiveInfinity,
            SettlingTime2Percent: Sigma > 0 ? SecondOrder.SettlingTime(Sigma, SettlingBand.TwoPercent) : double.PositiveInfinity,
            SettlingTime5Percent: Sigma > 0 ? SecondOrder.SettlingTime(Sigma, SettlingBand.FivePercent) : double.PositiveInfinity,
            RiseTimeZeroToHundred: peak && Zeta < 1 ? SecondOrder.RiseTimeZeroToHundred(Zeta, DampedFrequency) : double.PositiveInfinity);
    }
}
