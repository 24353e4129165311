namespace EventReview.Data.Tests.Fixtures;

/// <summary>A clock that always answers the same time.</summary>
public sealed class FixedClock(DateTimeOffset now) : TimeProvider
{
    public override DateTimeOffset GetUtcNow() => now;
}
