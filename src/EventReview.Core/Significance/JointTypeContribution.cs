namespace EventReview.Core.Significance;

/// <summary>What one coincidence type adds to the joint false-alarm rate.</summary>
/// <param name="Name">Type name.</param>
/// <param name="Louder">Background coincidences as loud as the candidate.</param>
/// <param name="BackgroundSeconds">Background time, s.</param>
/// <param name="ObservingSeconds">Zero-lag observing time, s.</param>
/// <param name="FarHz">Its rate (or 90 % bound), Hz.</param>
/// <param name="FarIsBound">True when its rate is a bound.</param>
public sealed record JointTypeContribution(string Name, long Louder, double BackgroundSeconds, double ObservingSeconds, double FarHz, bool FarIsBound);
