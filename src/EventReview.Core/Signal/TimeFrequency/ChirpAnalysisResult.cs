namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>The Q map of one site around a candidate, a finer map zoomed on the last part of the signal (up to its loudest tile), and the chirp fit.</summary>
/// <param name="Map">The whole mapped span.</param>
/// <param name="Zoom">From 0.4 s before to 0.1 s after the loudest cell (inside the mapped span), at finer display resolution.</param>
/// <param name="Fit">The chirp-track fit on <paramref name="Map"/>.</param>
public sealed record ChirpAnalysisResult(QMap Map, QMap Zoom, ChirpFit Fit);
