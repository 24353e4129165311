using System.Numerics;

namespace EventReview.Core.Signal.Filters;

/// <summary>Converts a digital ZPK into cascaded second-order sections.</summary>
public static class SecondOrderSections
{
    /// <summary>
    /// Splits a digital ZPK (z-plane) into second-order sections. Poles are taken in conjugate pairs, starting with
    /// those closest to the unit circle, and each pair is given the nearest remaining zeros (a simplified form of the
    /// usual "nearest" pairing). Missing zeros are placed at the origin; an odd real pole gets a first-order section.
    /// The overall gain is applied in the first section. The product of the sections equals the ZPK exactly
    /// (up to rounding); pairing only affects numerical behaviour.
    /// </summary>
    /// <exception cref="ArgumentException">When the filter has more zeros than poles or unpaired complex roots.</exception>
    public static SosSection[] FromZpk(Zpk digital)
    {
        ArgumentNullException.ThrowIfNull(digital);
        if (digital.Zeros.Count > digital.Poles.Count)
        {
            throw new ArgumentException("A causal digital filter needs at least as many poles as zeros.", nameof(digital));
        }

        var poles = digital.Poles.ToList();
        var zeros = digital.Zeros.ToList();
        while (zeros.Count < poles.Count)
        {
            zeros.Add(Complex.Zero);
        }

        var sections = new List<SosSection>();
        while (poles.Count > 0)
        {
            var pGroup = TakeGroup(poles, poles.OrderByDescending(p => p.Magnitude).First());
            var zGroup = new List<Complex>();
            while (zGroup.Count < pGroup.Count && zeros.Count > 0)
            {
                var target = pGroup[0];
                var nearest = zeros.OrderBy(z => (z - target).Magnitude).First();
                if (Math.Abs(nearest.Imaginary) > 0 && zGroup.Count == 0 && pGroup.Count == 2)
                {
                    zGroup.AddRange(TakeGroup(zeros, nearest));
                }
                else
                {
                    var real = zeros.Where(z => z.Imaginary == 0).OrderBy(z => (z - target).Magnitude).FirstOrDefault(double.NaN);
                    var pick = double.IsNaN(real.Real) ? nearest : real;
                    if (Math.Abs(pick.Imaginary) > 0)
                    {
                        if (zGroup.Count + 2 > pGroup.Count)
                        {
                            throw new ArgumentException("Zeros cannot be paired with the poles in second-order sections.", nameof(digital));
                        }

                        zGroup.AddRange(TakeGroup(zeros, pick));
                    }
                    else
                    {
                        zeros.Remove(pick);
                        zGroup.Add(pick);
                    }
                }
            }

            sections.Add(MakeSection(zGroup, pGroup));
        }

        if (sections.Count == 0)
        {
            sections.Add(new SosSection(1, 0, 0, 0, 0));
        }

        var first = sections[0];
        double g = digital.Gain;
        sections[0] = first with { B0 = first.B0 * g, B1 = first.B1 * g, B2 = first.B2 * g };
        return sections.ToArray();
    }

    private static List<Complex> TakeGroup(List<Complex> roots, Complex seed)
    {
        roots.Remove(seed);
        if (Math.Abs(seed.Imaginary) > 1e-14 * Math.Max(1, seed.Magnitude))
        {
            var conj = roots.OrderBy(r => (r - Complex.Conjugate(seed)).Magnitude).FirstOrDefault(Complex.NaN);
            if (Complex.IsNaN(conj) || (conj - Complex.Conjugate(seed)).Magnitude > 1e-8 * Math.Max(1, seed.Magnitude))
            {
                throw new ArgumentException("Complex zeros and poles must come in conjugate pairs.", nameof(roots));
            }

            roots.Remove(conj);
            return [seed, conj];
        }

        var group = new List<Complex> { new(seed.Real, 0) };
        var other = roots.Where(r => Math.Abs(r.Imaginary) <= 1e-14 * Math.Max(1, r.Magnitude))
            .OrderByDescending(r => r.Magnitude).FirstOrDefault(Complex.NaN);
        if (!Complex.IsNaN(other))
        {
            roots.Remove(other);
            group.Add(new Complex(other.Real, 0));
        }

        return group;
    }

    private static SosSection MakeSection(List<Complex> z, List<Complex> p)
    {
        (double b1, double b2) = Poly(z);
        (double a1, double a2) = Poly(p);
        return new SosSection(1, b1, b2, a1, a2);
    }

    // (1 - r1 x)(1 - r2 x) = 1 - (r1 + r2) x + r1 r2 x^2, with a missing root meaning 0.
    private static (double C1, double C2) Poly(List<Complex> roots) => roots.Count switch
    {
        0 => (0, 0),
        1 => (-roots[0].Real, 0),
        _ => (-(roots[0] + roots[1]).Real, (roots[0] * roots[1]).Real),
    };
}
