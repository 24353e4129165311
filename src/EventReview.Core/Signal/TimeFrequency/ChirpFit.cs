namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>
/// The ridge of a time-frequency map and the leading-order chirp fit f^{−8/3} = (8π)^{8/3} (G Mc/c³)^{5/3} (tc − t) / 5.
/// </summary>
/// <param name="ChirpMassMsun">Fitted chirp mass, solar masses (null when the slope has the wrong sign or there are too few points).</param>
/// <param name="ChirpMassSigmaMsun">One-sigma uncertainty of the chirp mass from the fit's slope uncertainty (scaled by the reduced χ²), solar masses (null when no fit).</param>
/// <param name="CoalescenceSeconds">Fitted coalescence time, seconds after the map's reference (null when no fit).</param>
/// <param name="RSquared">Weighted coefficient of determination of the straight-line fit (null when no fit).</param>
/// <param name="ChirpLike">True when the track rises in frequency and the fit is good.</param>
/// <param name="Reason">Plain statement of why the track is or is not chirp-like.</param>
/// <param name="TrackTimesSeconds">Times of the ridge points used, seconds after the reference.</param>
/// <param name="TrackFrequenciesHz">Ridge frequencies at those times, Hz.</param>
/// <param name="Assumptions">Conventions and approximations.</param>
/// <param name="Scope">What the fit can and cannot tell for this track (for example for a short, high-mass signal); empty in records of format 1.</param>
public sealed record ChirpFit(
    double? ChirpMassMsun,
    double? ChirpMassSigmaMsun,
    double? CoalescenceSeconds,
    double? RSquared,
    bool ChirpLike,
    string Reason,
    double[] TrackTimesSeconds,
    double[] TrackFrequenciesHz,
    IReadOnlyList<string> Assumptions,
    IReadOnlyList<string>? Scope = null);
