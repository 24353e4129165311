using System.Globalization;

namespace EventReview.Core.Plots;

/// <summary>
/// Tick positions and labels. Linear: the smallest step of 1, 2 or 5 × 10^k giving at most about
/// <c>target</c> intervals (common practice). Log: every decade, plus 2 and 5 within spans under two decades;
/// decades outside 0.001..10⁴ are written as powers of ten with a typeset exponent.
/// </summary>
public static class PlotTicks
{
    /// <summary>Ticks of a linear range [<paramref name="lo"/>, <paramref name="hi"/>].</summary>
    public static IReadOnlyList<double> Linear(double lo, double hi, int target = 6)
    {
        if (!(hi > lo) || double.IsInfinity(hi - lo))
        {
            return [lo];
        }

        double raw = (hi - lo) / Math.Max(1, target);
        double mag = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        double step = new[] { 1.0, 2, 5, 10 }.Select(m => m * mag).First(s => s >= raw * (1 - 1e-9));
        var ticks = new List<double>();
        for (long k = (long)Math.Ceiling((lo / step) - 1e-9); k * step <= hi + (step * 1e-9); k++)
        {
            double v = k * step;
            ticks.Add(Math.Abs(v) < step * 1e-9 ? 0 : v);
        }

        return ticks;
    }

    /// <summary>Ticks of a log range [<paramref name="lo"/>, <paramref name="hi"/>] (both positive).</summary>
    public static IReadOnlyList<double> Log(double lo, double hi)
    {
        if (!(lo > 0) || !(hi > lo))
        {
            return lo > 0 ? [lo] : [];
        }

        bool fine = Math.Log10(hi / lo) < 2;
        int first = (int)Math.Floor(Math.Log10(lo)), last = (int)Math.Ceiling(Math.Log10(hi));
        int every = Math.Max(1, (last - first) / 8);
        var ticks = new List<double>();
        for (int d = first; d <= last; d++)
        {
            foreach (var m in fine ? new[] { 1.0, 2, 5 } : [1.0])
            {
                double v = m * Math.Pow(10, d);
                if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9) && (m != 1 || fine || (d - first) % every == 0))
                {
                    ticks.Add(v);
                }
            }
        }

        return ticks;
    }

    /// <summary>The label of tick <paramref name="v"/> on a <paramref name="scale"/> axis.</summary>
    public static string Label(double v, AxisScale scale)
    {
        var ci = CultureInfo.InvariantCulture;
        if (v == 0)
        {
            return "0";
        }

        double a = Math.Abs(v);
        if (scale == AxisScale.Log && (a < 1e-3 || a >= 1e4))
        {
            int e = (int)Math.Floor(Math.Log10(a) + 1e-9);
            double m = v / Math.Pow(10, e);
            string mantissa = Math.Abs(m - 1) < 1e-9 ? string.Empty : m.ToString("0.#", ci) + "×";
            return mantissa + "10" + Superscript(e);
        }

        if (a < 1e-3 || a >= 1e6)
        {
            int e = (int)Math.Floor(Math.Log10(a) + 1e-9);
            return (v / Math.Pow(10, e)).ToString("0.##", ci) + "×10" + Superscript(e);
        }

        return v.ToString("G6", ci).Replace("-", "−", StringComparison.Ordinal);
    }

    /// <summary>Typeset exponent (Unicode superscript digits and minus).</summary>
    public static string Superscript(int e) =>
        string.Concat(e.ToString(CultureInfo.InvariantCulture).Select(c => c switch
        {
            '-' => '⁻', '0' => '⁰', '1' => '¹', '2' => '²', '3' => '³', '4' => '⁴',
            '5' => '⁵', '6' => '⁶', '7' => '⁷', '8' => '⁸', _ => '⁹',
        }));
}
