using System.Collections.Immutable;
using System.Numerics;

namespace CompAssist.Core.Numerics;

/// <summary>Roots with the evidence that they are roots.</summary>
/// <param name="Roots">Roots in canonical order (see <see cref="ConjugateSymmetry"/>), repeated by multiplicity.</param>
/// <param name="MaxRelativeResidual">Largest |f(r)| / scale(r) over the roots (a backward error).</param>
/// <param name="MaxRelativeStep">
/// Largest last Newton correction |f/f′| / |r| (a first-order forward-error estimate for simple roots).
/// </param>
public sealed record RootReport(ImmutableArray<Complex> Roots, double MaxRelativeResidual, double MaxRelativeStep);
