namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>A weighted least-squares straight line y = a + b x with the slope's one-sigma uncertainty (scaled by sqrt(reduced χ²) when above 1) and the weighted R².</summary>
internal readonly record struct WeightedLine(double Intercept, double Slope, double SlopeSigma, double RSquared)
{
    /// <summary>The same line with the slope's sigma multiplied by <paramref name="factor"/>.</summary>
    public WeightedLine Inflated(double factor) => this with { SlopeSigma = SlopeSigma * factor };

    public static WeightedLine Fit(double[] x, double[] y, double[] w)
    {
        int n = x.Length;
        double sw = w.Sum(), sx = 0, sy = 0;
        for (int i = 0; i < n; i++)
        {
            sx += w[i] * x[i];
            sy += w[i] * y[i];
        }

        double xm = sx / sw, ym = sy / sw, sxx = 0, sxy = 0, syy = 0;
        for (int i = 0; i < n; i++)
        {
            sxx += w[i] * (x[i] - xm) * (x[i] - xm);
            sxy += w[i] * (x[i] - xm) * (y[i] - ym);
            syy += w[i] * (y[i] - ym) * (y[i] - ym);
        }

        double b = sxy / sxx, a = ym - (b * xm), chi2 = 0;
        for (int i = 0; i < n; i++)
        {
            double r = y[i] - (a + (b * x[i]));
            chi2 += w[i] * r * r;
        }

        double reduced = n > 2 ? chi2 / (n - 2) : 1;
        return new WeightedLine(a, b, Math.Sqrt(1 / sxx) * Math.Sqrt(Math.Max(1, reduced)), syy > 0 ? 1 - (chi2 / syy) : double.NaN);
    }
}
