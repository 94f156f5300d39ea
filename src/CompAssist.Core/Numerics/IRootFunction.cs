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
    /// judged (for a sum of products, the sum of the magnitudes of its terms).
    /// </summary>
    (Complex Value, Complex Derivative, double Scale) Evaluate(Complex s);
}
