using System.Globalization;

namespace EventReview.Core.Significance;

/// <summary>How background figures are put into words, the same way in the app's summary, its result view and the CLI.
/// A bound is always written as one: "&lt;" for the FAR and FAP, "≥" for sigma, "≤" for a p-value floor.</summary>
public static class SignificanceText
{
    /// <summary>Julian year in s, for "per year" rates.</summary>
    public const double SecondsPerYear = 365.25 * 86400;

    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>"FAR &lt; 2.6e-9 Hz (&lt; 0.082 per year; 90 % upper bound, nothing as loud in 8.9e+8 s)" or "FAR 4.5e-9 Hz (0.142 per year; 4 louder in 8.9e+8 s)".</summary>
    public static string Far(SignificanceFigures f, double backgroundSeconds) => f.FarIsBound
        ? string.Create(Inv, $"FAR < {f.FarHz:0.##e+0} Hz (< {PerYear(f.FarHz)} per year; {Confidence(f.BoundConfidence)} upper bound, nothing as loud in {backgroundSeconds:0.##e+0} s)")
        : string.Create(Inv, $"FAR {f.FarHz:0.##e+0} Hz ({PerYear(f.FarHz)} per year; {f.Louder:N0} louder in {backgroundSeconds:0.##e+0} s)");

    /// <summary>"FAP &lt; 5.8e-4 over T_obs 2.2e+5 s, ≥ 3.25σ" (bound) or "FAP 1e-3 over ..., 3.09σ".</summary>
    public static string FapSigma(SignificanceFigures f, double observingSeconds) =>
        string.Create(Inv, $"FAP {(f.FapIsBound ? "< " : string.Empty)}{Probability(f.Fap)} over T_obs {observingSeconds:0.##e+0} s, {(f.SigmaIsBound ? "≥ " : string.Empty)}{f.Sigma:F2}σ");

    /// <summary>"p ≤ 2.5e-4 (floor 1 / 4001 slides + 1)" or "p = 1.2e-3 (4 of 4000 slides as loud)".</summary>
    public static string SlidePValue(double p, int slidesWithLouder, int slides) => slidesWithLouder == 0
        ? string.Create(Inv, $"slide p ≤ {Probability(p)} (floor 1 / ({slides:N0} slides + 1): no slide as loud)")
        : string.Create(Inv, $"slide p = {Probability(p)} ({slidesWithLouder:N0} of {slides:N0} slides as loud)");

    /// <summary>"90 %" for a confidence level; "1/T_bg, no stated" for a record without one (format 1).</summary>
    public static string Confidence(double? level) => level is { } c ? string.Create(Inv, $"{c * 100:0.#} %") : "unstated-confidence";

    /// <summary>A rate per year with sensible digits.</summary>
    public static string PerYear(double hz)
    {
        var y = hz * SecondsPerYear;
        return y >= 100 ? y.ToString("N0", Inv) : y >= 0.01 ? y.ToString("0.###", Inv) : y.ToString("0.##e+0", Inv);
    }

    /// <summary>A probability with sensible digits.</summary>
    public static string Probability(double p) => p >= 0.01 ? p.ToString("0.###", Inv) : p.ToString("0.##e+0", Inv);
}
