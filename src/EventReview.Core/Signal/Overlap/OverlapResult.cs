namespace EventReview.Core.Signal.Overlap;

/// <summary>
/// Outcome of the overlap check. Lags are the shift to add to B's times so that B lines up with A, i.e. arrival(A) − arrival(B),
/// in seconds. The comparison uses analytic signals â = a + i H(a): Z(k) = Σ conj(â) b̂ₖ over the window, whose envelope |Z| peaks
/// at the lag whatever the phase between the sites, and whose argument at the peak is the phase of B relative to A. The normalised
/// envelope |Z| / sqrt(Σ|â|² Σ|b̂ₖ|²) is the overlap (0..1) after the best shift and phase. Fields marked "format 2" are null in
/// records of format 1 (real correlation, lag and sign only).
/// </summary>
/// <param name="CenterGps">Candidate GPS time (decimal seconds).</param>
/// <param name="LagSeconds">Best lag on the sample grid, seconds (arrival(A) − arrival(B)).</param>
/// <param name="RefinedLagSeconds">Best lag refined by a parabola through |Z| at the three nearest lags, seconds.</param>
/// <param name="Sign">+1 or −1: the sign of cos(phase), the factor that best lines B up with A without a phase shift.</param>
/// <param name="Overlap">Normalised envelope at the best lag (0..1): the overlap after shift and phase.</param>
/// <param name="LagsSeconds">Lags of the curves, seconds, ascending.</param>
/// <param name="Correlation">Re Z / norm at each lag: the correlation for sign +1 (its negative is the curve for sign −1).</param>
/// <param name="SampleRateHz">Common sample rate used, Hz.</param>
/// <param name="ResamplingNote">What was done about sample rates.</param>
/// <param name="OffSourceOverlaps">Off-source statistic values (max normalised envelope over the same lags), ascending; empty when none were asked.</param>
/// <param name="PValue">(1 + #off-source ≥ observed) / (1 + N), or null without off-source overlaps.</param>
/// <param name="PlotTimesSeconds">Times of the plotted waveforms relative to the centre, seconds.</param>
/// <param name="PlotA">Whitened, band-passed A at those times.</param>
/// <param name="PlotB">Whitened, band-passed B shifted by the whole-sample lag and turned by −phase (Re(e^{−iφ} b̂)), at those times.</param>
/// <param name="WindowSeconds">On-source window length used, seconds.</param>
/// <param name="MaxLagSeconds">Largest |lag| searched, seconds.</param>
/// <param name="BandLowHz">Band-pass lower edge, Hz.</param>
/// <param name="BandHighHz">Band-pass upper edge, Hz.</param>
/// <param name="Assumptions">Plain statements of conventions, approximations and tolerances.</param>
/// <param name="LagUncertaintySeconds">One-sigma uncertainty of the refined lag, seconds (format 2; null when it cannot be estimated).</param>
/// <param name="PhaseRadians">Phase of B relative to A at the best lag, radians in (−π, π] (format 2).</param>
/// <param name="SignDetermined">False when the phase lies within the sign margin (or two of its sigmas) of ±90°: then neither sign is preferred (format 2).</param>
/// <param name="SignOnlyOverlap">Overlap with a sign flip only, no phase shift: Overlap × |cos φ| (format 2).</param>
/// <param name="Envelope">Normalised envelope |Z| / norm at each lag (format 2).</param>
/// <param name="AtSearchEdge">True when the best lag lies within one sample of the search limit: the true peak may lie outside (format 2).</param>
/// <param name="Warnings">What the reader must know before trusting the numbers (format 2).</param>
/// <param name="PhaseUncertaintyRadians">One-sigma uncertainty of the phase, radians: its own noise plus the lag's error times the phase's turn per second (format 2).</param>
public sealed record OverlapResult(
    string CenterGps,
    double LagSeconds,
    double RefinedLagSeconds,
    int Sign,
    double Overlap,
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
    IReadOnlyList<string> Assumptions,
    double? LagUncertaintySeconds = null,
    double? PhaseRadians = null,
    bool? SignDetermined = null,
    double? SignOnlyOverlap = null,
    double[]? Envelope = null,
    bool AtSearchEdge = false,
    IReadOnlyList<string>? Warnings = null,
    double? PhaseUncertaintyRadians = null);
