using System.Globalization;
using EventReview.Core.Verdicts;
using EventReview.Core.Formatting;

namespace EventReview.Core.Significance;

/// <summary>
/// Joint significance of a candidate seen by three sites, combining the background of every coincidence type searched (the
/// three pairs and the triple), each with its own time slides and windows. Rule: the false-alarm rate of the candidate is the
/// sum over coincidence types of each type's background rate at or above the candidate's ranking statistic, so a louder
/// event of any type counts against it (a trials factor over the types); the expected number of false alarms is the sum of
/// each type's rate times its own observing time. This is how multi-detector searches combine detector combinations
/// (Davies et al. 2020, Phys. Rev. D 102, 022004, on combining the coincidence types of a three-detector network; from memory).
/// A type with nothing as loud adds its own 90 % upper bound, and the sum is then an upper bound. Pair coincidences that are
/// part of a triple are counted in both, which can only raise the FAR (conservative).
/// </summary>
public static class JointSignificance
{
    /// <summary>Combines the types' backgrounds at one ranking statistic.</summary>
    /// <param name="candidateStatistic">The candidate's ranking statistic (its three-site network SNR).</param>
    /// <param name="types">Each type's louder count (at <paramref name="candidateStatistic"/>), background and observing time.</param>
    /// <exception cref="ArgumentException">When no type is given or a time is not positive.</exception>
    public static JointSignificanceResult Combine(double candidateStatistic, IReadOnlyList<CoincidenceTypeBackground> types)
    {
        ArgumentNullException.ThrowIfNull(types);
        if (types.Count == 0)
        {
            throw new ArgumentException("At least one coincidence type is needed.", nameof(types));
        }

        var parts = types.Select(t => (Type: t, Figures: SignificanceFigures.Compute(0, t.Louder, t.BackgroundSeconds, t.ObservingSeconds))).ToList();
        var far = parts.Sum(p => p.Figures.FarHz);
        var expected = parts.Sum(p => p.Figures.FarHz * p.Type.ObservingSeconds);
        var bound = parts.Any(p => p.Figures.FarIsBound);
        var figures = SignificanceFigures.FromRate(0, types.Sum(t => t.Louder), far, bound, expected, bound ? SignificanceFigures.DefaultBoundConfidence : null);
        var what = $"joint over {string.Join(", ", types.Select(t => t.Name))}";
        var band = SignificanceBand.Of(figures.Sigma, figures.SigmaIsBound);
        var inv = CultureInfo.InvariantCulture;
        var contributions = string.Join("; ", parts.Select(p => string.Create(inv,
            $"{p.Type.Name} {(p.Figures.FarIsBound ? "< " : string.Empty)}{ScientificFormat.Format(p.Figures.FarHz, 3)} Hz ({p.Type.Louder:N0} as loud in {ScientificFormat.Format(p.Type.BackgroundSeconds, 3)} s)")));
        var judgement = band == Verdict.Concern
            ? new Judgement(Verdict.Concern, $"{what}: nothing as loud in any type, but the sum of their bounds only supports {SignificanceText.FapSigma(figures, types.Max(t => t.ObservingSeconds))}; the backgrounds are too short ({contributions}).")
            : new Judgement(band, string.Create(inv,
                $"{what}: {VerdictWords.Word(band)}, FAR {(figures.FarIsBound ? "< " : string.Empty)}{ScientificFormat.Format(far, 3)} Hz summed over the types ({contributions}), FAP {(figures.FapIsBound ? "< " : string.Empty)}{SignificanceText.Probability(figures.Fap)} (expected false alarms {ScientificFormat.Format(expected, 3)}), {(figures.SigmaIsBound ? "≥ " : string.Empty)}{figures.Sigma:F2}σ. A statement of significance, not a pass or fail."));
        return new JointSignificanceResult(candidateStatistic, [.. parts.Select(p => new JointTypeContribution(p.Type.Name, p.Type.Louder, p.Type.BackgroundSeconds,
            p.Type.ObservingSeconds, p.Figures.FarHz, p.Figures.FarIsBound))], figures, expected, judgement,
        [
            "FAR = sum over coincidence types (each pair, and the triple) of louder / background time at the candidate's statistic; a type with nothing as loud adds its 90 % upper bound 2.3026 / background time and makes the sum an upper bound",
            "expected false alarms = sum over types of the type's FAR x its own zero-lag observing time; FAP = 1 - exp(-expected); sigma one-sided Gaussian",
            "rule from the practice of multi-detector searches (Davies et al. 2020, Phys. Rev. D 102, 022004; from memory); pair coincidences inside triples count in both types (conservative)",
        ]);
    }
}
