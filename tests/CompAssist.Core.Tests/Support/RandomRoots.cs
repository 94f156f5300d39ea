using System.Numerics;

namespace CompAssist.Core.Tests.Support;

/// <summary>Random conjugate-closed root sets for numeric tests (seeded, reproducible).</summary>
internal static class RandomRoots
{
    /// <summary>
    /// A stable set of <paramref name="degree"/> roots with moduli in [minModulus, maxModulus], any two at least
    /// <paramref name="separation"/> (relative to the larger modulus) apart.
    /// </summary>
    public static List<Complex> Stable(Random rng, int degree, double minModulus = 0.5, double maxModulus = 30, double separation = 0.05)
    {
        var roots = new List<Complex>();
        var guard = 0;
        while (roots.Count < degree && guard++ < 100_000)
        {
            var modulus = minModulus * Math.Pow(maxModulus / minModulus, rng.NextDouble());
            Complex[] candidate;
            if (degree - roots.Count >= 2 && rng.NextDouble() < 0.6)
            {
                var angle = (Math.PI / 2) + (rng.NextDouble() * Math.PI / 2 * 0.95);
                var r = Complex.FromPolarCoordinates(modulus, angle);
                candidate = [r, Complex.Conjugate(r)];
            }
            else
            {
                candidate = [new Complex(-modulus, 0)];
            }

            var ok = candidate.All(c => roots.All(q => Complex.Abs(q - c) > separation * Math.Max(Complex.Abs(q), Complex.Abs(c))))
                     && (candidate.Length == 1 || Complex.Abs(candidate[0] - candidate[1]) > separation * modulus);
            if (ok)
            {
                roots.AddRange(candidate);
            }
        }

        return roots;
    }
}
