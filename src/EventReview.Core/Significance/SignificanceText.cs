using System.Globalization;
using EventReview.Core.Formatting;

namespace EventReview.Core.Significance;

/// <summary>How background figures are put into words, the same way in the app's summary, its result view and the CLI.
/// A bound is always written as one: "&lt;" for the FAR and FAP, "≥" for sigma, "≤" for a p-value floor.</summary>
public static class SignificanceText
{
    /// <summary>Julian year in s, for "per year" rates.</summary>
    public const double SecondsPerYear = 365.25 * 86400;

    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>"FAR &lt; 2.6×10⁻⁹ Hz (&lt; 0.082 per year; 90 % upper bound, nothing as loud in 8.9×10⁸ s)" or "FAR 4.5×10⁻⁹ Hz (0.142 per year; 4 louder in 8.9×10⁸ s)" (numbers by <see cref="ScientificFormat"/>).</summary>
    public static string Far(SignificanceFigures f, double backgroundSeconds) => f.FarIsBound
        ? string.Create(Inv, $"FAR < {ScientificFormat.Format(f.FarHz)} Hz (< {PerYear(f.FarHz)} per year; {Confidence(f.BoundConfidence)} upper bound, nothing as loud in {ScientificFormat.Format(backgroundSeconds)} s)")
        : string.Create(Inv, $"FAR {ScientificFormat.Format(f.FarHz)} Hz ({PerYear(f.FarHz)} per year; {f.Louder:N0} louder in {ScientificFormat.Format(backgroundSeconds)} s)");

    /// <summary>"FAP &lt; 5.8×10⁻⁴ over T_obs 2.2×10⁵ s, ≥ 3.25σ" (bound) or "FAP 0.001 over ..., 3.09σ".</summary>
    public static string FapSigma(SignificanceFigures f, double observingSeconds) =>
        string.Create(Inv, $"FAP {(f.FapIsBound ? "< " : string.Empty)}{Probability(f.Fap)} over T_obs {ScientificFormat.Format(observingSeconds)} s, {(f.SigmaIsBound ? "≥ " : string.Empty)}{f.Sigma:F2}σ");

    /// <summary>"p ≤ 2.5×10⁻⁴ (floor 1 / 4001 slides + 1)" or "p = 0.0012 (4 of 4000 slides as loud)".</summary>
    public static string SlidePValue(double p, int slidesWithLouder, int slides) => slidesWithLouder == 0
        ? string.Create(Inv, $"slide p ≤ {Probability(p)} (floor 1 / ({slides:N0} slides + 1): no slide as loud)")
        : string.Create(Inv, $"slide p = {Probability(p)} ({slidesWithLouder:N0} of {slides:N0} slides as loud)");

    /// <summary>"90 %" for a confidence level; "1/T_bg, no stated" for a record without one (format 1).</summary>
    public static string Confidence(double? level) => level is { } c ? string.Create(Inv, $"{c * 100:0.#} %") : "unstated-confidence";

    /// <summary>A FAR table cell in Hz: "&lt; 2.6×10⁻⁹ (90 %)" for a bound, "4.5×10⁻⁹ ± 2.3×10⁻⁹" (Poisson 1σ, sqrt(N) / T_bg) when measured.</summary>
    public static string FarCell(double farHz, bool isBound, long louder, double? confidence) => isBound
        ? string.Create(Inv, $"< {ScientificFormat.Format(farHz)} ({Confidence(confidence)})")
        : string.Create(Inv, $"{ScientificFormat.Format(farHz)} ± {ScientificFormat.Format(farHz / Math.Sqrt(Math.Max(louder, 1)), 2)}");

    /// <summary>A per-year table cell: "&lt; 0.082" or "0.142".</summary>
    public static string PerYearCell(double farHz, bool isBound) => (isBound ? "< " : string.Empty) + PerYear(farHz);

    /// <summary>A FAP table cell: "&lt; 5.8×10⁻⁴" or "0.001".</summary>
    public static string FapCell(double fap, bool isBound) => (isBound ? "< " : string.Empty) + Probability(fap);

    /// <summary>A sigma table cell: "≥ 3.25" or "3.09".</summary>
    public static string SigmaCell(double sigma, bool isBound) => (isBound ? "≥ " : string.Empty) + sigma.ToString("F2", Inv);

    /// <summary>A slide p-value cell: "≤ 2.5×10⁻⁴" at the floor, else the value.</summary>
    public static string SlidePCell(double p, bool isFloor) => (isFloor ? "≤ " : string.Empty) + Probability(p);

    /// <summary>
    /// One line for the record's summary and the CLI: the verdict word, the headline figures (the joint ones for three sites,
    /// else the least significant pair's), the background behind them, and what else was found.
    /// </summary>
    public static string Summary(BackgroundCheckResult check, double stepSeconds)
    {
        ArgumentNullException.ThrowIfNull(check);
        var text = check.Judgement.Word + ": ";
        if (check.Joint is { } j && check.Triple is { } t)
        {
            text += string.Create(Inv,
                $"joint over {j.Types.Count} coincidence types at the three-site statistic {j.CandidateStatistic:0.##}: FAR {FarCell(j.Figures.FarHz, j.Figures.FarIsBound, j.Figures.Louder, j.Figures.BoundConfidence)} Hz, FAP {FapCell(j.Figures.Fap, j.Figures.FapIsBound)}, {SigmaCell(j.Figures.Sigma, j.Figures.SigmaIsBound)}σ; triple {string.Join("–", t.Sites)}: {Far(t.Figures, t.BackgroundSeconds)}, {SlidePValue(t.SlidePValue, t.SlidesWithLouder, t.Slides)}.");
        }
        else
        {
            var h = check.Pairs[check.HeadlinePair];
            var r = h.Result;
            var f = new SignificanceFigures(r.BackgroundCoincidences, r.Louder, r.FarHz, r.FarIsBound, r.Fap, r.Sigma, r.FarBoundConfidence);
            text += string.Create(Inv,
                $"{(check.Pairs.Count > 1 ? $"least significant of {check.Pairs.Count} pairs, {h.Plan.Name}" : h.Plan.Name)}: {Far(f, r.BackgroundSeconds)}, {FapSigma(f, r.ObservingTimeSeconds)}, {SlidePValue(r.SlidePValue, r.SlidesWithLouder, r.Slides)}; background {ScientificFormat.Format(r.BackgroundSeconds)} s ({r.BackgroundSeconds / 86400:N0} days) from {r.Slides:N0} slides, window ±{r.WindowSeconds * 1e3:0.#} ms, step {stepSeconds:0.###} s.");
            if (r.WithoutCandidateTriggers is { } w)
            {
                text += string.Create(Inv, $" Without the candidate's own triggers: {FarCell(w.FarHz, w.FarIsBound, w.Louder, w.BoundConfidence)} Hz, {SigmaCell(w.Sigma, w.SigmaIsBound)}σ.");
            }
        }

        var others = check.Joint is null ? check.Pairs.Where((_, i) => i != check.HeadlinePair).ToList() : [.. check.Pairs];
        if (others.Count > 0)
        {
            text += (check.Joint is null ? " Other pairs: " : " Pairs: ") + string.Join("; ", others.Select(o => string.Create(Inv,
                $"{o.Plan.Name} {FarCell(o.Result.FarHz, o.Result.FarIsBound, o.Result.Louder, o.Result.FarBoundConfidence)} Hz, {SigmaCell(o.Result.Sigma, o.Result.SigmaIsBound)}σ"))) + ".";
        }

        foreach (var note in check.Notes)
        {
            text += " Note: " + note + ".";
        }

        return text;
    }

    /// <summary>A rate per year with sensible digits.</summary>
    public static string PerYear(double hz)
    {
        var y = hz * SecondsPerYear;
        return y >= 100 && y < ScientificFormat.PlainBelow ? y.ToString("N0", Inv) : ScientificFormat.Format(y);
    }

    /// <summary>A probability with sensible digits.</summary>
    public static string Probability(double p) => p >= 0.01 ? p.ToString("0.###", Inv) : ScientificFormat.Format(p);
}
