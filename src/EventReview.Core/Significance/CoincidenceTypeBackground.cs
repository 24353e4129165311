namespace EventReview.Core.Significance;

/// <summary>The background of one coincidence type (a pair of sites, or the triple) at the candidate's ranking statistic.</summary>
/// <param name="Name">"AB-KP", "AB-KP-SM".</param>
/// <param name="Louder">Background coincidences of this type at least as loud as the candidate.</param>
/// <param name="BackgroundSeconds">Background time of this type, s.</param>
/// <param name="ObservingSeconds">Zero-lag observing time of this type, s.</param>
public sealed record CoincidenceTypeBackground(string Name, long Louder, double BackgroundSeconds, double ObservingSeconds);
