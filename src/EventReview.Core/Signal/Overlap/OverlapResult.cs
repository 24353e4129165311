namespace EventReview.Core.Signal.Overlap;

/// <summary>
/// Outcome of the overlap check. Lags are the shift to add to B's times so that B lines up with A, i.e.
/// arrival(A) − arrival(B), in seconds. The coefficient is ρ = Σ a b' / sqrt(Σ a² Σ b'²) over the window, with b' = B shifted
/// by the lag and multiplied by the sign, so it lies in [−1, 1] and is positive at the best sign.
/// </summary>
/// <param name="CenterGps">Candidate GPS time (decimal seconds).</param>
/// <param name="LagSeconds">Best lag on the sample grid, seconds (arrival(A) − arrival(B)).</param>
/// <param name="RefinedLagSeconds">Best lag refined by a parabola through |ρ| at the three nearest lags, seconds.</param>
/// <param name="Sign">+1 or −1: the factor applied to B after shifting.</param>
/// <param name="Overlap">Overlap coefficient at the best lag and sign (0..1).</param>
/// <param name="AlternativeLagSeconds">Best lag with the other sign, seconds.</param>
/// <param name="AlternativeOverlap">Overlap coefficient with the other sign at that lag (may be negative when no lag gives a positive value).</param>
/// <param name="LagsSeconds">Lags of the curve, seconds (arrival(A) − arrival(B) convention), ascending.</param>
/// <param name="Correlation">ρ at each lag for sign +1 (the curve for sign −1 is its negative).</param>
/// <param name="SampleRateHz">Common sample rate used, Hz.</param>
/// <param name="ResamplingNote">What was done about sample rates.</param>
/// <param name="OffSourceOverlaps">Off-source statistic values (max |ρ| over lags and signs), ascending; empty when none were asked.</param>
/// <param name="PValue">(1 + #off-source ≥ observed) / (1 + N), or null without off-source overlaps.</param>
/// <param name="PlotTimesSeconds">Times of the plotted waveforms relative to the centre, seconds.</param>
/// <param name="PlotA">Whitened, band-passed A at those times.</param>
/// <param name="PlotB">Whitened, band-passed B, shifted by the whole-sample lag and multiplied by the sign, at those times.</param>
/// <param name="WindowSeconds">On-source window length used, seconds.</param>
/// <param name="MaxLagSeconds">Largest |lag| searched, seconds.</param>
/// <param name="BandLowHz">Band-pass lower edge, Hz.</param>
/// <param name="BandHighHz">Band-pass upper edge, Hz.</param>
/// <param name="Assumptions">Plain statements of conventions, approximations and tolerances.</param>
public sealed record OverlapResult(
    string CenterGps,
    double LagSeconds,
    double RefinedLagSeconds,
    int Sign,
    double Overlap,
    double AlternativeLagSeconds,
    double AlternativeOverlap,
    double[] LagsSeconds,
    double[] Correlation,
    double SampleRateHz,
    string ResamplingNote,
    double[] OffSourceOverlaps,
    double? PValue,
    double[] PlotTimesSeconds,
    double[] PlotA,
    double[] PlotB,
    double WindowSeconds,
    double MaxLagSeconds,
    double BandLowHz,
    double BandHighHz,
    IReadOnlyList<string> Assumptions);
