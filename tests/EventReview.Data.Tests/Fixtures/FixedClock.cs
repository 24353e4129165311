namespace EventReview.Data.Tests.Fixtures;

/// <summary>A clock that answers the same time until it is moved on.</summary>
public sealed class FixedClock(DateTimeOffset now) : TimeProvider
{
    private DateTimeOffset _now = now;

    public override DateTimeOffset GetUtcNow() => _now;

    public void Advance(TimeSpan by) => _now += by;
}
