namespace EventReview.Core.Plots.Figures;

/// <summary>A sign-off's times for the review-progress chart: when it was given and, if the evidence changed since, when it went stale (UTC, 100 ns ticks).</summary>
/// <param name="SignedAtUtcTicks">When it was given.</param>
/// <param name="StaleSinceUtcTicks">When it went stale, or null while it is current.</param>
public sealed record ReviewProgressSignOff(long SignedAtUtcTicks, long? StaleSinceUtcTicks);
