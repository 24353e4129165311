namespace EventReview.Core.Environment;

/// <summary>Settings of the veto-safety test.</summary>
/// <param name="WindowSeconds">Half window w: a trigger within [start - w, end + w] of an injection counts as coincident (default 1 s).</param>
/// <param name="ProbabilityThreshold">A channel is unsafe when the binomial tail P(K &gt;= coincident) is below this (default 1e-3,
/// a common-practice choice: about one false "unsafe" per thousand channels tested on unrelated noise).</param>
/// <param name="LiveTimeSeconds">Observation time over which channel rates are measured, seconds; null uses, per site, the span
/// from the first to the last trigger of that site in the trigger list (stated in the assumptions).</param>
/// <param name="VetoWindowSeconds">Half window a veto on the channel would remove around each of its triggers, for the deadtime,
/// seconds; null uses <paramref name="WindowSeconds"/>.</param>
public sealed record VetoSafetyOptions(double WindowSeconds = 1.0, double ProbabilityThreshold = 1e-3, double? LiveTimeSeconds = null, double? VetoWindowSeconds = null);
