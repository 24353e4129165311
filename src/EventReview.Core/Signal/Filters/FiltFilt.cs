namespace EventReview.Core.Signal.Filters;

/// <summary>Zero-phase filtering: the sections are applied forward, then backward, so the phase cancels and |H|² results.</summary>
public static class FiltFilt
{
    /// <summary>
    /// Default padding length for a cascade: 3 · (2 · sections + 1 − min(#sections with B2 = 0, #sections with A2 = 0)),
    /// the default of the usual reference implementation of forward-backward second-order-section filtering.
    /// </summary>
    public static int DefaultPadLength(IReadOnlyList<SosSection> sections)
    {
        ArgumentNullException.ThrowIfNull(sections);
        int zb = sections.Count(s => s.B2 == 0), za = sections.Count(s => s.A2 == 0);
        return 3 * ((2 * sections.Count) + 1 - Math.Min(zb, za));
    }

    /// <summary>
    /// Forward-backward filtering with odd-extension padding (2 x[0] − x[pad..1] before, 2 x[N−1] − x[N−2..] after) and
    /// step-steady-state initial conditions scaled by the first sample of each pass, as the usual reference library does
    /// by default. The padding is shortened to N − 1 samples when the input is shorter than the default padding.
    /// </summary>
    /// <param name="sections">Filter sections (from <see cref="SecondOrderSections.FromZpk"/>).</param>
    /// <param name="input">Input samples; at least 2.</param>
    /// <param name="padLength">Samples of odd extension at each end; null for <see cref="DefaultPadLength"/>.</param>
    /// <returns>A new array of the same length as the input.</returns>
    /// <exception cref="ArgumentException">When the input has fewer than 2 samples.</exception>
    // Gustafsson, "Determining the initial states in forward-backward filtering", IEEE Trans. Signal Process. 44 (1996) 988.
    public static double[] Apply(IReadOnlyList<SosSection> sections, ReadOnlySpan<double> input, int? padLength = null)
    {
        ArgumentNullException.ThrowIfNull(sections);
        int n = input.Length;
        if (n < 2)
        {
            throw new ArgumentException("Forward-backward filtering needs at least 2 samples.", nameof(input));
        }

        int pad = Math.Min(padLength ?? DefaultPadLength(sections), n - 1);
        if (pad < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(padLength), padLength, "Padding length must not be negative.");
        }

        var ext = new double[n + (2 * pad)];
        double first = input[0], last = input[n - 1];
        for (int i = 0; i < pad; i++)
        {
            ext[i] = (2 * first) - input[pad - i];
            ext[pad + n + i] = (2 * last) - input[n - 2 - i];
        }

        input.CopyTo(ext.AsSpan(pad, n));
        var zi = SosFilter.StepInitialState(sections);
        var state = Scaled(zi, ext[0]);
        SosFilter.ApplyInPlace(sections, ext, state);
        state = Scaled(zi, ext[^1]);
        SosFilter.ApplyBackwardInPlace(sections, ext, state);
        return ext.AsSpan(pad, n).ToArray();
    }

    private static double[] Scaled(double[] zi, double factor)
    {
        var s = new double[zi.Length];
        for (int i = 0; i < zi.Length; i++)
        {
            s[i] = zi[i] * factor;
        }

        return s;
    }
}
