namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>
/// The display map of a Q transform: Energy[i][j] is the largest power / median of any Q plane's tile at TimesSeconds[i] (seconds
/// from the reference GPS time) and FrequenciesHz[j] (log-spaced, ascending); BestQ[i][j] the Q of that tile. White Gaussian noise
/// gives values of median about 1 per plane.
/// </summary>
/// <param name="ReferenceGps">GPS time the times are measured from (decimal seconds).</param>
/// <param name="TimesSeconds">Column times, seconds after the reference, ascending and evenly spaced.</param>
/// <param name="FrequenciesHz">Row frequencies, Hz, log-spaced and ascending.</param>
/// <param name="Energy">Power / median per column (outer) and row (inner).</param>
/// <param name="BestQ">Q of the plane that gave each value.</param>
/// <param name="QPlanes">The Q values of the planes used.</param>
/// <param name="MaxMismatch">The tiling's largest mismatch.</param>
public sealed record QMap(string ReferenceGps, double[] TimesSeconds, double[] FrequenciesHz, double[][] Energy, double[][] BestQ, double[] QPlanes, double MaxMismatch)
{
    /// <summary>The loudest cell: its value, time (s from the reference), frequency (Hz) and Q.</summary>
    public (double Energy, double TimeSeconds, double FrequencyHz, double Q) Loudest()
    {
        double best = -1, t = 0, f = 0, q = 0;
        for (int i = 0; i < TimesSeconds.Length; i++)
        {
            for (int j = 0; j < FrequenciesHz.Length; j++)
            {
                if (Energy[i][j] > best)
                {
                    (best, t, f, q) = (Energy[i][j], TimesSeconds[i], FrequenciesHz[j], BestQ[i][j]);
                }
            }
        }

        return (best, t, f, q);
    }

    /// <summary>The value below which <paramref name="fraction"/> of all cells lie (e.g. 0.995 for the colour scale's cap).</summary>
    public double Percentile(double fraction)
    {
        var all = Energy.SelectMany(r => r).Order().ToArray();
        if (all.Length == 0)
        {
            return 0;
        }

        return all[Math.Clamp((int)Math.Ceiling(fraction * all.Length) - 1, 0, all.Length - 1)];
    }
}
