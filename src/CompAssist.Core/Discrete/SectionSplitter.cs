using System.Collections.Immutable;
using System.Numerics;

namespace CompAssist.Core.Discrete;

/// <summary>
/// Factors a sampled compensator into first- and second-order sections (common practice: pair each pole pair
/// with the nearest zeros, order the sections with the poles nearest the unit circle last, and put the gain in
/// the first section), which keeps coefficient sensitivity low where slow corners meet fast sampling.
/// </summary>
public static class SectionSplitter
{
    /// <summary>The sections whose product is <paramref name="d"/>.</summary>
    public static ImmutableArray<Section> Split(DiscreteTransferFunction d)
    {
        ArgumentNullException.ThrowIfNull(d);
        var poleGroups = new List<List<Complex>>();
        foreach (var p in d.Poles.Where(p => p.Imaginary > 0))
        {
            poleGroups.Add([p, Complex.Conjugate(p)]);
        }

        var reals = d.Poles.Where(p => p.Imaginary == 0).OrderByDescending(p => p.Magnitude).ToList();
        for (var i = 0; i < reals.Count; i += 2)
        {
            poleGroups.Add(i + 1 < reals.Count ? [reals[i], reals[i + 1]] : [reals[i]]);
        }

        if (poleGroups.Count == 0)
        {
            poleGroups.Add([]);
        }

        // Poles nearest the unit circle last.
        poleGroups = [.. poleGroups.OrderBy(g => g.Count == 0 ? 0 : g.Max(p => p.Magnitude))];
        var zeroGroups = poleGroups.Select(_ => new List<Complex>()).ToList();
        foreach (var z in d.Zeros.Where(z => z.Imaginary > 0))
        {
            var target = Enumerable.Range(0, poleGroups.Count).Where(i => poleGroups[i].Count - zeroGroups[i].Count >= 2)
                .OrderBy(i => poleGroups[i].Min(p => Complex.Abs(p - z))).First();
            zeroGroups[target].AddRange([z, Complex.Conjugate(z)]);
        }

        foreach (var z in d.Zeros.Where(z => z.Imaginary == 0))
        {
            var target = Enumerable.Range(0, poleGroups.Count).Where(i => poleGroups[i].Count - zeroGroups[i].Count >= 1)
                .OrderBy(i => poleGroups[i].Min(p => Complex.Abs(p - z))).First();
            zeroGroups[target].Add(z);
        }

        var sections = ImmutableArray.CreateBuilder<Section>(poleGroups.Count);
        for (var i = 0; i < poleGroups.Count; i++)
        {
            // Π(z − zᵢ)/Π(z − pⱼ) over z^n: the numerator lags by n − m samples when it has fewer zeros.
            var a = Coefficients(poleGroups[i]);
            var unshifted = Coefficients(zeroGroups[i]);
            var lag = poleGroups[i].Count - zeroGroups[i].Count;
            var b = new double[3];
            for (var k = 0; k + lag < 3; k++)
            {
                b[k + lag] = unshifted[k];
            }

            var gain = i == 0 ? d.Gain : 1.0;
            sections.Add(new Section(gain * b[0], gain * b[1], gain * b[2], a[1], a[2]));
        }

        return sections.ToImmutable();
    }

    /// <summary>Runs the cascade on an input sequence from rest (the reference the exported code must match).</summary>
    public static double[] Filter(IReadOnlyList<Section> sections, IReadOnlyList<double> input)
    {
        ArgumentNullException.ThrowIfNull(sections);
        ArgumentNullException.ThrowIfNull(input);
        var s1 = new double[sections.Count];
        var s2 = new double[sections.Count];
        var output = new double[input.Count];
        var last = 0.0;
        for (var k = 0; k < input.Count; k++)
        {
            var x = input[k];
            if (!double.IsFinite(x))
            {
                // As the exported code: a non-finite input is not fed to the sections; the last output is held.
                output[k] = last;
                continue;
            }

            for (var i = 0; i < sections.Count; i++)
            {
                var q = sections[i];
                var y = (q.B0 * x) + s1[i];
                s1[i] = (q.B1 * x) - (q.A1 * y) + s2[i];
                s2[i] = (q.B2 * x) - (q.A2 * y);
                x = y;
            }

            output[k] = last = x;
        }

        return output;
    }

    /// <summary>The cascade run in single precision with the same operation order as the exported float code.</summary>
    public static double[] FilterSingle(IReadOnlyList<Section> sections, IReadOnlyList<double> input)
    {
        ArgumentNullException.ThrowIfNull(sections);
        ArgumentNullException.ThrowIfNull(input);
        var s1 = new float[sections.Count];
        var s2 = new float[sections.Count];
        var output = new double[input.Count];
        var last = 0.0f;
        for (var k = 0; k < input.Count; k++)
        {
            var x = (float)input[k];
            if (!float.IsFinite(x))
            {
                output[k] = last;
                continue;
            }

            for (var i = 0; i < sections.Count; i++)
            {
                var q = sections[i];
                float b0 = (float)q.B0, b1 = (float)q.B1, b2 = (float)q.B2, a1 = (float)q.A1, a2 = (float)q.A2;
                var y = (b0 * x) + s1[i];
                s1[i] = (b1 * x) - (a1 * y) + s2[i];
                s2[i] = (b2 * x) - (a2 * y);
                x = y;
            }

            last = x;
            output[k] = x;
        }

        return output;
    }

    /// <summary>Π(1 − rᵢ z⁻¹) as [c0, c1, c2] in ascending powers of z⁻¹ (at most two roots).</summary>
    private static double[] Coefficients(List<Complex> roots)
    {
        var c = new Complex[3];
        c[0] = 1;
        var degree = 0;
        foreach (var r in roots)
        {
            for (var k = degree + 1; k >= 1; k--)
            {
                c[k] -= r * c[k - 1];
            }

            degree++;
        }

        return [c[0].Real, c[1].Real, c[2].Real];
    }
}
