using System.Globalization;
using EventReview.Core.Statistics;
using EventReview.Core.Verdicts;
using EventReview.Core.Formatting;

namespace EventReview.Core.Significance;

/// <summary>
/// The background check's verdict: the significance band itself (below 3 sigma, 3 to 5 sigma, 5 sigma or more), a neutral
/// statement rather than a pass or fail. When nothing in the background is as loud the sigma is only a lower bound: a bound
/// from 3 up to 5 sigma is "at least 3 sigma" (the true value may be higher), and a bound below 3 sigma is a concern,
/// because the background is too short to say anything (the 3 and 5 sigma marks are the trade's habit, CHECKS.md).
/// </summary>
public static class SignificanceBand
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The band of a sigma; <paramref name="isLowerBound"/> when it is only a lower bound.</summary>
    public static Verdict Of(double sigma, bool isLowerBound) => (sigma, isLowerBound) switch
    {
        ( >= 5, _) => Verdict.FiveSigmaOrMore,
        ( >= 3, true) => Verdict.AtLeastThreeSigma,
        ( >= 3, false) => Verdict.ThreeToFiveSigma,
        (_, true) => Verdict.Concern,
        _ => Verdict.BelowThreeSigma,
    };

    /// <summary>The band's stored word for a table cell ("below 3 sigma", "at least 3 sigma", ...; "background too short" for a bound below 3).</summary>
    public static string Word(double sigma, bool isLowerBound) =>
        Of(sigma, isLowerBound) == Verdict.Concern ? "background too short" : VerdictWords.Word(Of(sigma, isLowerBound));

    /// <summary>The largest sigma a background of <paramref name="backgroundSeconds"/> can show over <paramref name="observingSeconds"/> (the bound with nothing as loud).</summary>
    public static double MaxReachableSigma(double backgroundSeconds, double observingSeconds) =>
        SignificanceFigures.Compute(0, 0, backgroundSeconds, observingSeconds).Sigma;

    /// <summary>Background time needed, as a multiple of T_obs, for the 90 % bound to reach <paramref name="sigma"/>: 2.3026 / -ln(1 - Q(sigma)).</summary>
    public static double BackgroundMultipleFor(double sigma) =>
        Poisson.UpperLimitForNoEvents(SignificanceFigures.DefaultBoundConfidence) / -Math.Log(1 - GaussianTail.Q(sigma));

    /// <summary>
    /// The judgement of one set of figures: band, with FAR, FAP and sigma (bounds marked) and the background behind them.
    /// </summary>
    /// <param name="f">The figures.</param>
    /// <param name="backgroundSeconds">Background time, s.</param>
    /// <param name="observingSeconds">Observing time, s.</param>
    /// <param name="what">What the figures are of ("AB-KP", "joint over 3 pairs and the triple").</param>
    public static Judgement Judge(SignificanceFigures f, double backgroundSeconds, double observingSeconds, string what)
    {
        ArgumentNullException.ThrowIfNull(f);
        var band = Of(f.Sigma, f.SigmaIsBound);
        var figures = $"{SignificanceText.Far(f, backgroundSeconds)}, {SignificanceText.FapSigma(f, observingSeconds)}";
        if (band == Verdict.Concern)
        {
            return new Judgement(Verdict.Concern, string.Create(Inv,
                $"{what}: nothing in the background is as loud, but the background ({ScientificFormat.Format(backgroundSeconds, 3)} s, {backgroundSeconds / observingSeconds:0.#} × T_obs) can only show {figures}; 3σ needs at least {BackgroundMultipleFor(3):N0} × T_obs (more slides, a longer span, or a shorter T_obs)."));
        }

        return new Judgement(band, string.Create(Inv,
            $"{what}: {VerdictWords.Word(band)}, {figures}. A statement of significance, not a pass or fail."));
    }
}
