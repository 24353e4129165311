using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Tests.Builders;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Time;

public class RecordedTimeTests
{
    [Fact]
    public void Recorded_times_are_utc_truncated_to_the_millisecond()
    {
        var t = new DateTimeOffset(2026, 3, 1, 14, 0, 0, TimeSpan.FromHours(2)).AddTicks(9_999);

        var r = RecordedTime.Normalize(t);

        Assert.Equal(TimeSpan.Zero, r.Offset);
        Assert.Equal(new DateTimeOffset(2026, 3, 1, 12, 0, 0, TimeSpan.Zero), r);
        Assert.Equal(r, RecordedTime.Normalize(r));
    }

    [Fact]
    public void Times_before_the_unix_epoch_truncate_toward_the_past()
    {
        var t = new DateTimeOffset(1969, 12, 31, 23, 59, 59, 999, TimeSpan.Zero).AddTicks(5);

        Assert.Equal(new DateTimeOffset(1969, 12, 31, 23, 59, 59, 999, TimeSpan.Zero), RecordedTime.Normalize(t));
    }

    [Fact]
    public void Hashed_times_of_timeline_evidence_and_computations_are_kept_to_the_millisecond()
    {
        var clockReading = Clock.T0.AddTicks(1_234_567);
        var c = new CaseBuilder().OpenedAt(clockReading).Build();
        var note = EvidenceItem.Note("n", People.ReviewerA, clockReading);
        var record = new ComputationRecord("timing", "{}", "", "1", "{}", "clear", "", "", People.ReviewerA, clockReading);

        var expected = Clock.T0.AddMilliseconds(123);
        Assert.Equal(expected, c.Timeline[0].At);
        Assert.Equal(expected, note.AddedAt);
        Assert.Equal(expected, record.RunAt);
        Assert.Contains("2026-03-01T12:00:00.1230000Z", c.Timeline[0].CanonicalContent(), StringComparison.Ordinal);
        Assert.Null(TimelineChain.FirstProblem(c.Timeline));
    }
}
