namespace EventReview.Core.Plots.Figures;

/// <summary>
/// Reduces a spectrum on a fine uniform grid to at most <c>columns</c> log-spaced columns for a log-frequency plot, keeping
/// each column's minimum and maximum (so a narrow line is never lost); frequencies at or below zero are skipped.
/// </summary>
internal static class SpectrumColumns
{
    public static (List<double> Frequencies, List<double> Values) Reduce(double stepHz, IReadOnlyList<double> values, double loHz, double hiHz, int columns = 500)
    {
        var xs = new List<double>();
        var ys = new List<double>();
        double logLo = Math.Log(loHz), width = (Math.Log(hiHz) - logLo) / columns;
        int column = -1;
        double min = double.NaN, max = double.NaN, fMin = 0, fMax = 0;
        void Flush()
        {
            if (!double.IsNaN(min))
            {
                bool minFirst = fMin <= fMax;
                xs.Add(minFirst ? fMin : fMax);
                ys.Add(minFirst ? min : max);
                if (fMin != fMax)
                {
                    xs.Add(minFirst ? fMax : fMin);
                    ys.Add(minFirst ? max : min);
                }
            }

            min = max = double.NaN;
        }

        for (int k = 1; k < values.Count; k++)
        {
            double f = k * stepHz, v = values[k];
            if (f < loHz || f > hiHz || !(v > 0) || !double.IsFinite(v))
            {
                continue;
            }

            int c = (int)((Math.Log(f) - logLo) / width);
            if (c != column)
            {
                Flush();
                column = c;
            }

            if (double.IsNaN(min) || v < min)
            {
                (min, fMin) = (v, f);
            }

            if (double.IsNaN(max) || v > max)
            {
                (max, fMax) = (v, f);
            }
        }

        Flush();
        return (xs, ys);
    }
}
