namespace EventReview.Core.Significance;

/// <summary>Coincidence windows of the three pairs of sites in a triple, in ns (each the pair's light-travel time plus tolerance).</summary>
/// <param name="FirstSecondNs">Window between the first and second site.</param>
/// <param name="FirstThirdNs">Window between the first and third site.</param>
/// <param name="SecondThirdNs">Window between the second and third site.</param>
public sealed record TripleWindows(long FirstSecondNs, long FirstThirdNs, long SecondThirdNs)
{
    /// <summary>The largest of the three windows, ns.</summary>
    public long LargestNs => Math.Max(FirstSecondNs, Math.Max(FirstThirdNs, SecondThirdNs));

    /// <summary>Windows from milliseconds (rounded to the ns).</summary>
    public static TripleWindows FromMilliseconds(double firstSecondMs, double firstThirdMs, double secondThirdMs) =>
        new((long)Math.Round(firstSecondMs * 1e6), (long)Math.Round(firstThirdMs * 1e6), (long)Math.Round(secondThirdMs * 1e6));
}
