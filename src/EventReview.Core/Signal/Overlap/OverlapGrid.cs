namespace EventReview.Core.Signal.Overlap;

/// <summary>
/// Index bookkeeping of an overlap comparison: B's sample offset from A's grid, the sub-sample residual, the on-source window,
/// the range where windows (with all lags) stay inside both valid ranges, and the off-source window positions.
/// </summary>
internal sealed class OverlapGrid
{
    public OverlapGrid(ConditionedSeries a, ConditionedSeries b, OverlapOptions options, double fs, int w, int maxLag)
    {
        SampleRateHz = fs;
        Window = w;
        MaxLag = maxLag;
        double offsetExact = a.Data.Start.SecondsSince(b.Data.Start) * fs;
        Offset = (int)Math.Round(offsetExact);
        ResidualSeconds = b.Data.Start.SecondsSince(a.Data.Start) + (Offset / fs);
        CenterIndex = (int)Math.Round(options.Center.SecondsSince(a.Data.Start) * fs);
        AStart = CenterIndex - (w / 2);
        int half = (maxLag / 2) + 2;
        Lo = Math.Max(a.ValidStart + half, b.ValidStart - Offset + half);
        Hi = Math.Min(a.ValidEnd - half, b.ValidEnd - Offset - half);
        if (AStart < Lo || AStart + w > Hi)
        {
            throw new ArgumentException(
                $"The window of {options.WindowSeconds:G} s around {options.Center} with lags of ±{options.MaxLagSeconds * 1e3:G} ms does not fit inside both series away from their tapered edges.",
                nameof(options));
        }

        var positions = new List<int>();
        double exclusion = (options.OffSourceExclusionSeconds * fs) + w;
        for (int p = Lo; p + w <= Hi; p += w)
        {
            if (Math.Abs(p + (w / 2) - CenterIndex) >= exclusion)
            {
                positions.Add(p);
            }
        }

        OffSourcePositions = positions;
        var after = new List<int>();
        for (int p = Lo; p + w <= Hi; p += Math.Max(1, w / 2))
        {
            if (p + (w / 2) - CenterIndex >= exclusion)
            {
                after.Add(p);
            }
        }

        var chosen = after.Count >= EnvelopePeak.MinimumWindows ? after : positions.ToList();
        NoisePositions = chosen.Count <= MaxNoiseWindows
            ? chosen
            : Enumerable.Range(0, MaxNoiseWindows).Select(i => chosen[i * chosen.Count / MaxNoiseWindows]).ToList();
        NoiseAfterOnly = after.Count >= EnvelopePeak.MinimumWindows;
    }

    /// <summary>Most off-source windows used for the noise of the correlation (evenly spread when more fit): 64 give the lag's sigma to about 9 %.</summary>
    public const int MaxNoiseWindows = 64;

    public double SampleRateHz { get; }

    public int Window { get; }

    public int MaxLag { get; }

    /// <summary>B's index of A's sample i is i + Offset (nearest sample).</summary>
    public int Offset { get; }

    /// <summary>Start(B) − start(A) + Offset / fs: the sub-sample part of the grid offset, seconds.</summary>
    public double ResidualSeconds { get; }

    public int CenterIndex { get; }

    /// <summary>First sample of A's on-source window.</summary>
    public int AStart { get; }

    public int Lo { get; }

    public int Hi { get; }

    /// <summary>Starts (A's grid) of the off-source windows: whole windows apart, away from the on-source stretch.</summary>
    public IReadOnlyList<int> OffSourcePositions { get; }

    /// <summary>
    /// Off-source windows used to measure the noise of the correlation: windows after the candidate, half a window apart, when at
    /// least <see cref="EnvelopePeak.MinimumWindows"/> fit there (a chirp's inspiral runs before its time and would leak into earlier
    /// windows), otherwise all of <see cref="OffSourcePositions"/>; at most <see cref="MaxNoiseWindows"/>, evenly spread.
    /// </summary>
    public IReadOnlyList<int> NoisePositions { get; }

    /// <summary>True when <see cref="NoisePositions"/> lie after the candidate only.</summary>
    public bool NoiseAfterOnly { get; }

    /// <summary>Lag in seconds (arrival(A) − arrival(B)) of a shift of k samples (possibly fractional) of B's window.</summary>
    public double LagOf(double k) => -((k / SampleRateHz) + ResidualSeconds);
}
