using System.Globalization;
using EventReview.Core.Significance;
using EventReview.Core.Statistics;

namespace EventReview.Web.Services.Checks;

/// <summary>How background figures are put into words, the same way in the summary line and on the result view.</summary>
public static class BackgroundWords
{
    /// <summary>Julian year in s, for "per year" rates.</summary>
    public const double SecondsPerYear = 365.25 * 86400;

    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>"≥ 5σ", "3–5σ" or "&lt; 3σ".</summary>
    public static string Band(double sigma) => sigma >= 5 ? "≥ 5σ" : sigma >= 3 ? "3–5σ" : "< 3σ";

    /// <summary>The largest sigma a background of <paramref name="backgroundSeconds"/> can give over <paramref name="observingSeconds"/> (FAR bound 1 / T_bg).</summary>
    public static double MaxReachableSigma(double backgroundSeconds, double observingSeconds) =>
        SignificanceFigures.Compute(0, 0, backgroundSeconds, observingSeconds).Sigma;

    /// <summary>Background time needed, as a multiple of T_obs, for the bound to reach <paramref name="sigma"/>: 1 / −ln(1 − Q(σ)).</summary>
    public static double BackgroundMultipleFor(double sigma) => 1 / -Math.Log(1 - GaussianTail.Q(sigma));

    /// <summary>"FAR &lt; 3.2e-08 Hz (1.0 per year; bound: no louder background in 3.1e7 s)" or "FAR 4.1e-06 Hz (129 per year; 12 louder in 2.9e6 s)".</summary>
    public static string Far(SignificanceFigures f, double backgroundSeconds) => f.FarIsBound
        ? string.Create(Inv, $"FAR < {f.FarHz:0.##e+0} Hz (< {PerYear(f.FarHz)} per year; bound: no louder background in {backgroundSeconds:0.##e+0} s)")
        : string.Create(Inv, $"FAR {f.FarHz:0.##e+0} Hz ({PerYear(f.FarHz)} per year; {f.Louder:N0} louder in {backgroundSeconds:0.##e+0} s)");

    /// <summary>"FAP &lt; 2.3e-04 over 2.0e5 s, ≥ 3.50σ" (bound) or "FAP 0.12 over ..., 1.17σ".</summary>
    public static string FapSigma(SignificanceFigures f, double observingSeconds) =>
        string.Create(Inv, $"FAP {(f.FarIsBound ? "< " : string.Empty)}{Probability(f.Fap)} over T_obs {observingSeconds:0.##e+0} s, {(f.FarIsBound ? "≥ " : string.Empty)}{f.Sigma:F2}σ");

    /// <summary>A rate per year with sensible digits.</summary>
    public static string PerYear(double hz)
    {
        var y = hz * SecondsPerYear;
        return y >= 100 ? y.ToString("N0", Inv) : y >= 0.01 ? y.ToString("0.###", Inv) : y.ToString("0.##e+0", Inv);
    }

    /// <summary>A probability with sensible digits.</summary>
    public static string Probability(double p) => p >= 0.01 ? p.ToString("0.###", Inv) : p.ToString("0.##e+0", Inv);

    /// <summary>Figures of a result as a record (for the with-candidate-triggers view).</summary>
    public static SignificanceFigures Figures(BackgroundResult r) => new(r.BackgroundCoincidences, r.Louder, r.FarHz, r.FarIsBound, r.Fap, r.Sigma);
}
