namespace EventReview.Load;

/// <summary>Percentiles of a set of latencies in milliseconds (nearest-rank method).</summary>
public sealed record LatencyStats(int Count, double P50Ms, double P90Ms, double P99Ms, double MaxMs, double MeanMs)
{
    public static LatencyStats Of(IReadOnlyCollection<double> millis)
    {
        if (millis.Count == 0)
        {
            return new LatencyStats(0, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN);
        }

        var sorted = millis.Order().ToArray();
        return new LatencyStats(sorted.Length, Rank(sorted, 0.50), Rank(sorted, 0.90), Rank(sorted, 0.99), sorted[^1], sorted.Average());
    }

    // Nearest-rank percentile: the smallest value with at least p of the sample at or below it (common practice).
    private static double Rank(double[] sorted, double p) => sorted[Math.Clamp((int)Math.Ceiling(p * sorted.Length) - 1, 0, sorted.Length - 1)];

    public override string ToString() =>
        $"n={Count:N0}  p50 {P50Ms:0.0} ms  p90 {P90Ms:0.0} ms  p99 {P99Ms:0.0} ms  max {MaxMs:0.0} ms  mean {MeanMs:0.0} ms";
}
