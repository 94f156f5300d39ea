using System.Collections.Immutable;
using System.Numerics;

namespace CompAssist.Core.Numerics;

/// <summary>
/// A real polynomial function whose roots are wanted, evaluated in whatever form is most accurate
/// (usually products of factors) and offering expanded coefficients only as seeds.
/// </summary>
public interface IRootFunction
{
    /// <summary>Number of roots.</summary>
    int Degree { get; }

    /// <summary>Expanded coefficients for the companion-matrix seeds (may be inaccurate at high degree).</summary>
    Polynomial ExpandForSeeds();

    /// <summary>
    /// Value and derivative at <paramref name="s"/>, and the scale against which a rounding-level value is
    /// judged (for expanded coefficients Σ|cₖ|·|s|ᵏ; for products, what rounding the point and the factors' roots
    /// can change the value by).
    /// </summary>
    (Complex Value, Complex Derivative, double Scale) Evaluate(Complex s);

    /// <summary>
    /// Roots known exactly (factors shared by every term, such as a cancelled pole), and the function that is
    /// left once they are divided out; by default none, and this function.
    /// </summary>
    (ImmutableArray<Complex> Exact, IRootFunction Remainder) Deflate() => ([], this);
}
