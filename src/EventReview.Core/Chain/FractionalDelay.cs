namespace EventReview.Core.Chain;

/// <summary>Delays a sampled signal by a real number of samples.</summary>
public static class FractionalDelay
{
    /// <summary>Half length of the interpolation kernel in samples.</summary>
    public const int HalfLength = 32;

    /// <summary>
    /// Returns y[n] = x(n - delay): the integer part is an exact shift, the fractional part a Hann-windowed sinc interpolator
    /// of 2 x 32 taps normalised to unit DC gain (Laakso et al. 1996, IEEE Signal Processing Magazine 13(1), "Splitting the unit delay").
    /// Samples before the start or after the end are taken as zero, so the first and last |delay| + 32 samples are unreliable.
    /// Positive delay: the output lags the input.
    /// </summary>
    public static double[] Apply(ReadOnlySpan<double> x, double delaySamples)
    {
        if (!double.IsFinite(delaySamples))
        {
            throw new ArgumentOutOfRangeException(nameof(delaySamples), delaySamples, "Delay must be finite.");
        }

        var m = (int)Math.Floor(delaySamples);
        var d = delaySamples - m;
        var y = new double[x.Length];
        if (d < 1e-9 || d > 1 - 1e-9)
        {
            m += d > 0.5 ? 1 : 0;
            for (var n = 0; n < y.Length; n++)
            {
                var i = n - m;
                y[n] = i >= 0 && i < x.Length ? x[i] : 0;
            }

            return y;
        }

        var kernel = new double[2 * HalfLength];
        var sum = 0.0;
        for (var j = 0; j < kernel.Length; j++)
        {
            var k = j - HalfLength + 1; // k = -31..32
            var t = k - d;
            var sinc = Math.Sin(Math.PI * t) / (Math.PI * t);
            var window = 0.5 * (1 + Math.Cos(Math.PI * t / (HalfLength + 1)));
            kernel[j] = sinc * window;
            sum += kernel[j];
        }

        for (var n = 0; n < y.Length; n++)
        {
            var acc = 0.0;
            for (var j = 0; j < kernel.Length; j++)
            {
                var i = n - m - (j - HalfLength + 1);
                if (i >= 0 && i < x.Length)
                {
                    acc += kernel[j] * x[i];
                }
            }

            y[n] = acc / sum;
        }

        return y;
    }
}
