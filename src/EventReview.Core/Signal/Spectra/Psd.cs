namespace EventReview.Core.Signal.Spectra;

/// <summary>
/// A one-sided power spectral density on a uniform grid f_k = k · FrequencyStepHz, k = 0..Values.Length − 1, in
/// (unit of the data)²/Hz. For strain the unit is 1/Hz. DC and Nyquist are not doubled (Heinzel et al. 2002).
/// </summary>
/// <param name="FrequencyStepHz">Grid spacing in Hz (fs / segment length).</param>
/// <param name="Values">PSD values, one per grid frequency.</param>
/// <param name="SampleRateHz">Sample rate of the data in Hz.</param>
/// <param name="Segments">Number of averaged segments (0 when the PSD is a model).</param>
public sealed record Psd(double FrequencyStepHz, double[] Values, double SampleRateHz, int Segments)
{
    /// <summary>Frequency of bin k in Hz.</summary>
    public double FrequencyOf(int k) => k * FrequencyStepHz;

    /// <summary>
    /// PSD at <paramref name="frequencyHz"/> by linear interpolation between grid points; clamped to the end values
    /// outside the grid.
    /// </summary>
    public double ValueAt(double frequencyHz)
    {
        double x = frequencyHz / FrequencyStepHz;
        if (x <= 0)
        {
            return Values[0];
        }

        int i = (int)x;
        if (i >= Values.Length - 1)
        {
            return Values[^1];
        }

        double t = x - i;
        return (Values[i] * (1 - t)) + (Values[i + 1] * t);
    }

    /// <summary>Amplitude spectral density, sqrt(PSD), in (unit)/sqrt(Hz), on the same grid.</summary>
    public double[] Asd() => Values.Select(Math.Sqrt).ToArray();

    /// <summary>Sum of PSD · df over all bins: the mean square of the data (Parseval), in unit².</summary>
    public double Integral() => Values.Sum() * FrequencyStepHz;
}
