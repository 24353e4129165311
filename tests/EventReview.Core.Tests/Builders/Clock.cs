namespace EventReview.Core.Tests.Builders;

/// <summary>A fixed start time for domain tests and a way to step from it.</summary>
public static class Clock
{
    /// <summary>2026-03-01 12:00:00 UTC.</summary>
    public static DateTimeOffset T0 { get; } = new(2026, 3, 1, 12, 0, 0, TimeSpan.Zero);

    /// <summary>T0 plus whole minutes.</summary>
    public static DateTimeOffset At(int minutes) => T0.AddMinutes(minutes);
}
