using CompAssist.Core.Common;
using CompAssist.Core.Numerics;

namespace CompAssist.Core.Model;

/// <summary>
/// The feedback loop around which a compensator C(s) is designed: plant G(s), feedback (sensor) H(s) and
/// the feedback sign. The compensator sits in the forward path: u = C·e, y = G·u, e = r ∓ H·y.
/// </summary>
/// <remarks>
/// Delays inside G or H are exact wherever the loop is evaluated at a point (angle and magnitude
/// conditions); where polynomials are needed (closed-loop roots) they are replaced by a Padé approximant of
/// order <see cref="PadeOrder"/>, and results say so.
/// </remarks>
public sealed class Loop
{
    private Loop(TransferFunction plant, TransferFunction feedback, FeedbackSign sign, int padeOrder)
    {
        Plant = plant;
        Feedback = feedback;
        Sign = sign;
        PadeOrder = padeOrder;
    }

    /// <summary>Plant G(s).</summary>
    public TransferFunction Plant { get; }

    /// <summary>Feedback path H(s); 1 for unity feedback.</summary>
    public TransferFunction Feedback { get; }

    /// <summary>Feedback sign.</summary>
    public FeedbackSign Sign { get; }

    /// <summary>Padé order used for delays in root finding.</summary>
    public int PadeOrder { get; }

    /// <summary>Total loop delay in seconds (G and H together).</summary>
    public double Delay => Plant.Delay + Feedback.Delay;

    /// <summary>G·H, the loop without compensator (delays exact).</summary>
    public TransferFunction PlantTimesFeedback => Plant * Feedback;

    /// <summary>+1 for negative feedback (1 + L = 0), −1 for positive feedback (1 − L = 0).</summary>
    public double SignFactor => Sign == FeedbackSign.Negative ? 1.0 : -1.0;

    /// <summary>Creates a loop.</summary>
    /// <exception cref="ArgumentException">G or H is improper, or the Padé order is outside 1…10.</exception>
    public static Loop Create(TransferFunction plant, TransferFunction? feedback = null, FeedbackSign sign = FeedbackSign.Negative, int padeOrder = 3)
    {
        ArgumentNullException.ThrowIfNull(plant);
        feedback ??= TransferFunction.Unity;
        if (!plant.IsProper)
        {
            throw new ArgumentException("The plant must be proper.", nameof(plant));
        }

        if (!feedback.IsProper)
        {
            throw new ArgumentException("The feedback path must be proper.", nameof(feedback));
        }

        if (padeOrder < 1 || padeOrder > PadeApproximation.MaxOrder)
        {
            throw new ArgumentException($"The Padé order must be 1…{PadeApproximation.MaxOrder}.", nameof(padeOrder));
        }

        return new Loop(plant, feedback, sign, padeOrder);
    }

    /// <summary>The open loop C·G·H with delays exact.</summary>
    public TransferFunction OpenLoop(TransferFunction compensator)
    {
        ArgumentNullException.ThrowIfNull(compensator);
        return compensator * PlantTimesFeedback;
    }

    /// <summary>The open loop C·G·H with any delay replaced by its Padé approximant (rational).</summary>
    public TransferFunction RationalOpenLoop(TransferFunction compensator) => Rational(OpenLoop(compensator));

    /// <summary>A transfer function with its delay replaced by this loop's Padé approximant.</summary>
    public TransferFunction Rational(TransferFunction transferFunction)
    {
        ArgumentNullException.ThrowIfNull(transferFunction);
        return transferFunction.Delay == 0.0
            ? transferFunction
            : transferFunction.WithoutDelay() * PadeApproximation.Of(transferFunction.Delay, PadeOrder);
    }

    /// <summary>
    /// The closed-loop characteristic function Den(CGH) ± k·Num(CGH) in factored form (delay by Padé).
    /// </summary>
    /// <exception cref="ArgumentException">The compensated loop is improper.</exception>
    public CharacteristicFunction Characteristic(TransferFunction compensator)
    {
        var open = RationalOpenLoop(compensator);
        if (!open.IsProper)
        {
            throw new ArgumentException("The compensated loop C·G·H is improper; its closed loop has poles at infinity.", nameof(compensator));
        }

        return new CharacteristicFunction(open.PoleFactors, SignFactor * open.Gain, open.ZeroFactors);
    }

    /// <summary>
    /// L(∞) of C·G·H without its delay, with the feedback sign applied (so the closed loop is 1 + L = 0):
    /// 0 when the loop is strictly proper, the high-frequency gain when it is biproper.
    /// </summary>
    public double SignedGainAtInfinity(TransferFunction compensator)
    {
        var open = OpenLoop(compensator);
        return open.RelativeDegree == 0 ? SignFactor * open.Gain : 0.0;
    }

    /// <summary>
    /// Why this compensator gives no usable finite closed loop although C·G·H is proper, or null. Without a
    /// delay: 1 + L(∞) = 0, so the characteristic polynomial loses its leading term and a closed-loop pole sits
    /// at infinity (the loop is not well posed: an algebraic loop with unit gain). With a delay: |L(∞)| = 1,
    /// so a chain of infinitely many closed-loop roots approaches the imaginary axis (a neutral loop that never
    /// settles). Both are decided on L(∞) to a relative 1e-9.
    /// </summary>
    public Problem? WellPosednessProblem(TransferFunction compensator)
    {
        ArgumentNullException.ThrowIfNull(compensator);
        if (OpenLoop(compensator).RelativeDegree != 0)
        {
            return null;
        }

        var atInfinity = SignedGainAtInfinity(compensator);
        const double tolerance = 1e-9;
        if (Delay == 0 && Math.Abs(1.0 + atInfinity) <= tolerance * Math.Max(1.0, Math.Abs(atInfinity)))
        {
            return new Problem(
                "The loop is not well posed: C·G·H tends to −1 at high frequency (1 + L(∞) = 0), so the closed loop has a pole at infinity and no finite response",
                "Change the compensator gain or the feedback sign, or add a pole to the compensator so that C·G·H falls off at high frequency.",
                Setting.Compensator);
        }

        if (Delay > 0 && Math.Abs(Math.Abs(atInfinity) - 1.0) <= tolerance)
        {
            return new Problem(
                "With the loop delay and |C·G·H| = 1 at high frequency, infinitely many closed-loop roots approach the imaginary axis: the loop never settles",
                "Lower the compensator's high-frequency gain below 1/|G·H(∞)|, or add a pole to the compensator so that C·G·H falls off at high frequency.",
                Setting.Compensator);
        }

        return null;
    }

    /// <summary>A copy with another plant.</summary>
    public Loop WithPlant(TransferFunction plant) => Create(plant, Feedback, Sign, PadeOrder);
}
