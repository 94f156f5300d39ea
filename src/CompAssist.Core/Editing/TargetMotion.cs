using System.Numerics;

namespace CompAssist.Core.Editing;

/// <summary>
/// Moves a target pole by one key press. Steps are round numbers (1, 2 or 5 × 10ⁿ) so that repeated presses
/// land on values an engineer can write down. The step length comes from a fixed reference size (the
/// requirement corner's distance from the origin), not from the moving target, so that a move and its
/// opposite cancel and ten fine steps make one coarse step. The target stays in the closed upper half-plane
/// (ωd ≥ 0); the conjugate is implied.
/// </summary>
public static class TargetMotion
{
    /// <summary>Change of ζ per coarse step along a constant-ωn arc.</summary>
    public const double CoarseZetaStep = 0.05;

    /// <summary>Change of ζ per fine step.</summary>
    public const double FineZetaStep = 0.01;

    /// <summary>The length step (in σ, ωd or ωn) for a reference size <paramref name="scale"/> (rad/s, &gt; 0).</summary>
    public static double LengthStep(double scale, StepSize size)
    {
        var coarse = RoundDown(0.1 * Math.Max(scale, 1e-6));
        return size == StepSize.Coarse ? coarse : coarse / 10;
    }

    /// <summary>The target after one move, with steps sized for the reference size <paramref name="scale"/>.</summary>
    public static Complex Move(Complex target, MoveDirection direction, MotionMode mode, StepSize size, double scale)
    {
        if (!double.IsFinite(target.Real) || !double.IsFinite(target.Imaginary))
        {
            throw new ArgumentOutOfRangeException(nameof(target), target, "The target must be finite.");
        }

        target = new Complex(target.Real, Math.Abs(target.Imaginary));
        var step = LengthStep(scale, size);
        if (mode == MotionMode.RealImaginary)
        {
            // Only the coordinate that moves is put on the step's grid; the other keeps its value.
            return direction switch
            {
                MoveDirection.Left => new Complex(Snap(target.Real - step, step), target.Imaginary),
                MoveDirection.Right => new Complex(Snap(target.Real + step, step), target.Imaginary),
                MoveDirection.Up => new Complex(target.Real, Snap(target.Imaginary + step, step)),
                MoveDirection.Down => new Complex(target.Real, Math.Max(0.0, Snap(target.Imaginary - step, step))),
                _ => throw new ArgumentOutOfRangeException(nameof(direction), direction, null),
            };
        }

        var wn = target.Magnitude;
        var zeta = wn == 0 ? 1.0 : Math.Clamp(-target.Real / wn, -1.0, 1.0);
        var zetaStep = size == StepSize.Coarse ? CoarseZetaStep : FineZetaStep;
        switch (direction)
        {
            case MoveDirection.Left:
                wn = Snap(wn + step, step);
                break;
            case MoveDirection.Right:
                wn = Math.Max(step, Snap(wn - step, step));
                break;
            case MoveDirection.Up:
                // A target already in the right half-plane (ζ < 0) keeps its side.
                zeta = Math.Clamp(Snap(zeta - zetaStep, zetaStep), zeta < 0 ? -1.0 : 0.0, 1.0);
                break;
            case MoveDirection.Down:
                zeta = Math.Clamp(Snap(zeta + zetaStep, zetaStep), zeta < 0 ? -1.0 : 0.0, 1.0);
                break;
            default:
                throw new ArgumentOutOfRangeException(nameof(direction), direction, null);
        }

        return new Complex(-zeta * wn, wn * Math.Sqrt(Math.Max(0.0, 1 - (zeta * zeta))));
    }

    /// <summary>1, 2 or 5 × 10ⁿ, the largest not above <paramref name="x"/> (x &gt; 0).</summary>
    public static double RoundDown(double x)
    {
        var decade = Math.Pow(10, Math.Floor(Math.Log10(x)));
        var mantissa = x / decade;
        return decade * (mantissa >= 5 ? 5 : mantissa >= 2 ? 2 : 1);
    }

    // Rounds to the step's grid so that repeated presses stay on round numbers; keeps ten significant digits
    // of the step so that 0.1 + 0.2 does not print as 0.30000000000000004.
    private static double Snap(double value, double step)
    {
        var snapped = Math.Round(value / step) * step;
        return Math.Round(snapped, Math.Clamp(10 - (int)Math.Floor(Math.Log10(step)) - 1, 0, 15));
    }
}
