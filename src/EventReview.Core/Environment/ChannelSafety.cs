namespace EventReview.Core.Environment;

/// <summary>Veto-safety result of one channel.</summary>
/// <param name="Site">Site code.</param>
/// <param name="Channel">Channel name.</param>
/// <param name="Injections">Number of performed hardware injections at the site that were tested.</param>
/// <param name="Coincident">Injections with at least one trigger of the channel within +-w of their span.</param>
/// <param name="Expected">Number expected by chance: R x sum over injections of (2 w + duration); N_inj x 2 w R for short injections.</param>
/// <param name="Probability">Poisson probability of at least <paramref name="Coincident"/> given <paramref name="Expected"/>.</param>
/// <param name="Safe">False when <paramref name="Probability"/> is below the threshold (the channel responds to injections),
/// true otherwise, null when the site had no performed injection to test with.</param>
/// <param name="RateHz">Channel trigger rate used, triggers per second.</param>
/// <param name="Note">Why the channel could not be tested, or null.</param>
public sealed record ChannelSafety(string Site, string Channel, int Injections, int Coincident, double Expected, double Probability, bool? Safe, double RateHz, string? Note = null);
