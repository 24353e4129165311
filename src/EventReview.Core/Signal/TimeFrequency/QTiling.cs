namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>
/// The tiling of the (time, frequency, Q) space by the Q transform of Chatterji, Blackburn, Martin and Katsavounidis 2004
/// (Class. Quantum Grav. 21 S1809, section 4, from memory): tiles are placed so that no sine-Gaussian loses more than a fraction
/// μ of its energy to its nearest tile, using the diagonal mismatch metric ds² = (2π f / Q)² dτ² + (2 + Q²)/4 (df / f)² + ½ (dQ / Q)².
/// With a cubic lattice of side δ in metric distance the worst point lies (√3 / 2) δ from a tile, so δ = 2 sqrt(μ / 3).
/// Along Q the metric length is ln(Q_max / Q_min) / √2; along f it is sqrt(2 + Q²)/2 × ln(f_max / f_min); along time it is
/// 2π f T / Q for a segment of T seconds. Each length is cut into the fewest equal steps no longer than δ, tiles at the step centres
/// (time tiles: a power of two, for the inverse FFT).
/// </summary>
public static class QTiling
{
    /// <summary>The largest metric step between neighbouring tiles for a maximum mismatch μ: 2 sqrt(μ / 3).</summary>
    public static double Step(double maxMismatch) => 2 * Math.Sqrt(maxMismatch / 3);

    /// <summary>The diagonal mismatch metric distance² between (τ₁, f₁, Q₁) and (τ₂, f₂, Q₂), evaluated at their mean f and Q (seconds, Hz).</summary>
    public static double DistanceSquared(double t1, double f1, double q1, double t2, double f2, double q2)
    {
        double f = Math.Sqrt(f1 * f2), q = Math.Sqrt(q1 * q2);
        double dt = (2 * Math.PI * f / q) * (t2 - t1);
        double df = Math.Sqrt(2 + (q * q)) / 2 * Math.Log(f2 / f1);
        double dq = Math.Log(q2 / q1) / Math.Sqrt(2);
        return (dt * dt) + (df * df) + (dq * dq);
    }

    /// <summary>
    /// The planes for a segment of <paramref name="segmentSeconds"/> at <paramref name="sampleRateHz"/>: Q planes between QMin and QMax,
    /// each with frequency rows between max(LowHz, Q / (2π T)) (a tile's duration, about Q / (2π f), fits the segment) and min(HighHz, (fs/2) / (1 + √11 / Q)) (the window stays below Nyquist).
    /// </summary>
    /// <exception cref="ArgumentException">When a setting is out of range or no plane has a frequency row.</exception>
    public static IReadOnlyList<QPlane> Planes(QTransformOptions options, double segmentSeconds, double sampleRateHz)
    {
        ArgumentNullException.ThrowIfNull(options);
        if (!(options.QMin >= Math.Sqrt(11)) || !(options.QMax >= options.QMin) || !(options.MaxMismatch is > 0 and < 1)
            || !(options.LowHz > 0) || !(options.HighHz > options.LowHz) || !(segmentSeconds > 0) || !(sampleRateHz > 0))
        {
            throw new ArgumentException("Q transform settings: need √11 ≤ QMin ≤ QMax, 0 < mismatch < 1, 0 < low < high (Hz), a positive segment and sample rate.", nameof(options));
        }

        double step = Step(options.MaxMismatch);
        double qLength = Math.Log(options.QMax / options.QMin) / Math.Sqrt(2);
        int qCount = Math.Max(1, (int)Math.Ceiling(qLength / step));
        double dq = qLength / qCount;
        var planes = new List<QPlane>();
        for (int i = 0; i < qCount; i++)
        {
            double q = options.QMin * Math.Exp(Math.Sqrt(2) * dq * (i + 0.5));
            double lo = Math.Max(options.LowHz, q / (2 * Math.PI * segmentSeconds));
            double hi = Math.Min(options.HighHz, sampleRateHz / 2 / (1 + (Math.Sqrt(11) / q)));
            if (!(hi > lo))
            {
                continue;
            }

            double fLength = Math.Log(hi / lo) * Math.Sqrt(2 + (q * q)) / 2;
            int fCount = Math.Max(1, (int)Math.Ceiling(fLength / step));
            double df = fLength / fCount;
            var rows = new List<QRow>();
            for (int j = 0; j < fCount; j++)
            {
                double f = lo * Math.Exp(2 / Math.Sqrt(2 + (q * q)) * df * (j + 0.5));
                double tLength = 2 * Math.PI * f * segmentSeconds / q;
                rows.Add(new QRow(f, f * Math.Sqrt(11) / q, NextPowerOfTwo((int)Math.Ceiling(tLength / step))));
            }

            planes.Add(new QPlane(q, rows));
        }

        return planes.Count > 0 ? planes : throw new ArgumentException("No Q plane has a frequency row inside the band: widen the band or the analysed span.", nameof(options));
    }

    private static int NextPowerOfTwo(int n)
    {
        int p = 1;
        while (p < n)
        {
            p <<= 1;
        }

        return p;
    }
}
