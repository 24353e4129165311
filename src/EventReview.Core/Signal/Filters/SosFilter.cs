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

        for (int s = 0; s < sections.Count; s++)
        {
            var c = sections[s];
            double b0 = c.B0, b1 = c.B1, b2 = c.B2, a1 = c.A1, a2 = c.A2;
            double z1 = state?[2 * s] ?? 0, z2 = state?[(2 * s) + 1] ?? 0;
            for (int n = 0; n < data.Length; n++)
            {
                double x = data[n];
                double y = (b0 * x) + z1;
                z1 = (b1 * x) - (a1 * y) + z2;
                z2 = (b2 * x) - (a2 * y);
                data[n] = y;
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
