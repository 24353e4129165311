namespace EventReview.Core.Signal.Filters;

/// <summary>Applies cascaded second-order sections in direct form II transposed (causal, single pass).</summary>
public static class SosFilter
{
    /// <summary>Filters <paramref name="input"/> and returns a new array of the same length, starting from zero state.</summary>
    public static double[] Apply(IReadOnlyList<SosSection> sections, ReadOnlySpan<double> input)
    {
        var output = input.ToArray();
        ApplyInPlace(sections, output, null);
        return output;
    }

    /// <summary>
    /// Filters <paramref name="data"/> in place. <paramref name="state"/> holds two numbers per section
    /// (z1, z2 of direct form II transposed); when given it is used as the initial state and updated to the final state;
    /// when null the filter starts from rest.
    /// </summary>
    /// <exception cref="ArgumentException">When the state length is not twice the number of sections.</exception>
    public static void ApplyInPlace(IReadOnlyList<SosSection> sections, Span<double> data, double[]? state)
    {
        ArgumentNullException.ThrowIfNull(sections);
        if (state is not null && state.Length != 2 * sections.Count)
        {
            throw new ArgumentException("State must hold two values per section.", nameof(state));
        }

        Run(sections, data, state, backward: false);
    }

    /// <summary>
    /// Like <see cref="ApplyInPlace"/> but runs through <paramref name="data"/> from the last sample to the first (time-reversed
    /// filtering without copying). The state is used and updated the same way.
    /// </summary>
    public static void ApplyBackwardInPlace(IReadOnlyList<SosSection> sections, Span<double> data, double[]? state)
    {
        ArgumentNullException.ThrowIfNull(sections);
        if (state is not null && state.Length != 2 * sections.Count)
        {
            throw new ArgumentException("State must hold two values per section.", nameof(state));
        }

        Run(sections, data, state, backward: true);
    }

    // Sections are run in pairs per sample (fused loop): the two recursions are independent within a sample step, which lets
    // the processor overlap them; the result is identical to running the sections one after the other.
    private static void Run(IReadOnlyList<SosSection> sections, Span<double> data, double[]? state, bool backward)
    {
        int n = data.Length;
        int s = 0;
        for (; s + 1 < sections.Count; s += 2)
        {
            var c = sections[s];
            var d = sections[s + 1];
            double b0 = c.B0, b1 = c.B1, b2 = c.B2, a1 = c.A1, a2 = c.A2;
            double e0 = d.B0, e1 = d.B1, e2 = d.B2, f1 = d.A1, f2 = d.A2;
            double z1 = state?[2 * s] ?? 0, z2 = state?[(2 * s) + 1] ?? 0;
            double u1 = state?[(2 * s) + 2] ?? 0, u2 = state?[(2 * s) + 3] ?? 0;
            ref double r0 = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(data);
            for (int k = 0; k < n; k++)
            {
                ref double slot = ref System.Runtime.CompilerServices.Unsafe.Add(ref r0, backward ? n - 1 - k : k);
                double x = slot;
                double y = (b0 * x) + z1;
                z1 = (b1 * x) - (a1 * y) + z2;
                z2 = (b2 * x) - (a2 * y);
                double v = (e0 * y) + u1;
                u1 = (e1 * y) - (f1 * v) + u2;
                u2 = (e2 * y) - (f2 * v);
                slot = v;
            }

            if (state is not null)
            {
                state[2 * s] = z1;
                state[(2 * s) + 1] = z2;
                state[(2 * s) + 2] = u1;
                state[(2 * s) + 3] = u2;
            }
        }

        for (; s < sections.Count; s++)
        {
            var c = sections[s];
            double b0 = c.B0, b1 = c.B1, b2 = c.B2, a1 = c.A1, a2 = c.A2;
            double z1 = state?[2 * s] ?? 0, z2 = state?[(2 * s) + 1] ?? 0;
            for (int k = 0; k < n; k++)
            {
                int i = backward ? n - 1 - k : k;
                double x = data[i];
                double y = (b0 * x) + z1;
                z1 = (b1 * x) - (a1 * y) + z2;
                z2 = (b2 * x) - (a2 * y);
                data[i] = y;
            }

            if (state is not null)
            {
                state[2 * s] = z1;
                state[(2 * s) + 1] = z2;
            }
        }
    }

    /// <summary>
    /// Steady-state initial conditions for a unit step input (two values per section), so that filtering a constant
    /// signal c starting from c · state gives no transient. Scaled section by section by the DC gain of the sections before.
    /// </summary>
    public static double[] StepInitialState(IReadOnlyList<SosSection> sections)
    {
        ArgumentNullException.ThrowIfNull(sections);
        var zi = new double[2 * sections.Count];
        double scale = 1;
        for (int s = 0; s < sections.Count; s++)
        {
            var c = sections[s];
            double g = c.DcGain;
            double z2 = c.B2 - (c.A2 * g);
            double z1 = c.B1 - (c.A1 * g) + z2;
            zi[2 * s] = scale * z1;
            zi[(2 * s) + 1] = scale * z2;
            scale *= g;
        }

        return zi;
    }
}
