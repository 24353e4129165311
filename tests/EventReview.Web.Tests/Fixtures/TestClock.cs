namespace EventReview.Web.Tests.Fixtures;

/// <summary>A clock that reads the real time plus an offset the test moves (<see cref="Advance"/>); timers run in real time.</summary>
public sealed class TestClock : TimeProvider
{
    private long _offsetTicks;

    public TimeSpan Offset => TimeSpan.FromTicks(Interlocked.Read(ref _offsetTicks));

    public override DateTimeOffset GetUtcNow() => base.GetUtcNow() + Offset;

    public void Advance(TimeSpan by) => Interlocked.Add(ref _offsetTicks, by.Ticks);

    /// <summary>Moves the clock so that it reads <paramref name="at"/> now.</summary>
    public void Set(DateTimeOffset at) => Interlocked.Exchange(ref _offsetTicks, (at - base.GetUtcNow()).Ticks);
}
