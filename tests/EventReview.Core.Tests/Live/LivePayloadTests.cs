using EventReview.Core.Live;

namespace EventReview.Core.Tests.Live;

public sealed class LivePayloadTests
{
    [Fact]
    public void A_change_round_trips_and_carries_only_ids()
    {
        var text = LivePayload.Format("inst-a", new CaseChanged("DEMO-123", 42));

        Assert.Equal("""{"v":1,"o":"inst-a","t":"change","case":"DEMO-123","seq":42}""", text);
        var read = LivePayload.Parse(text);
        Assert.True(read.Ok);
        Assert.Equal("inst-a", read.Origin);
        Assert.Equal(new CaseChanged("DEMO-123", 42), read.Change);
        Assert.Null(read.Presence);
    }

    [Fact]
    public void A_presence_beat_round_trips_with_and_without_its_optional_fields()
    {
        var full = new PresenceBeat("DEMO-1", "s1", "u-ben", "Ben Example", "3.2", "editing a note");
        var bare = new PresenceBeat("DEMO-1", "s2", "u-ana", "Ana Example", null, null, Leaving: true);

        Assert.Equal(full, LivePayload.Parse(LivePayload.Format("o", full)).Presence);
        Assert.Equal(bare, LivePayload.Parse(LivePayload.Format("o", bare)).Presence);
    }

    [Fact]
    public void Names_and_activities_that_are_too_long_are_cut_when_written_so_the_payload_stays_readable()
    {
        var beat = new PresenceBeat("DEMO-1", "s1", "u1", new string('n', 500), null, new string('d', 500));

        var read = LivePayload.Parse(LivePayload.Format("o", beat)).Presence!;

        Assert.Equal(EventReview.Core.Inputs.InputLimits.MaxNameLength, read.DisplayName.Length);
        Assert.Equal(LivePayload.MaxDoingLength, read.Doing!.Length);
    }

    [Theory]
    [InlineData(null, "empty")]
    [InlineData("", "empty")]
    [InlineData("not json", "not JSON")]
    [InlineData("{\"v\":1,", "not JSON")]
    [InlineData("[1,2]", "not a JSON object")]
    [InlineData("\"change\"", "not a JSON object")]
    [InlineData("{\"o\":\"a\",\"t\":\"change\",\"case\":\"C\",\"seq\":1}", "version")]
    [InlineData("{\"v\":2,\"o\":\"a\",\"t\":\"change\",\"case\":\"C\",\"seq\":1}", "version")]
    [InlineData("{\"v\":\"1\",\"o\":\"a\",\"t\":\"change\",\"case\":\"C\",\"seq\":1}", "version")]
    [InlineData("{\"v\":1,\"t\":\"change\",\"case\":\"C\",\"seq\":1}", "origin or case")]
    [InlineData("{\"v\":1,\"o\":\"a\",\"t\":\"change\",\"seq\":1}", "origin or case")]
    [InlineData("{\"v\":1,\"o\":\"a\",\"t\":\"change\",\"case\":\"  \",\"seq\":1}", "origin or case")]
    [InlineData("{\"v\":1,\"o\":\"a\",\"t\":\"change\",\"case\":7,\"seq\":1}", "origin or case")]
    [InlineData("{\"v\":1,\"o\":\"a\",\"t\":\"change\",\"case\":\"C\"}", "sequence")]
    [InlineData("{\"v\":1,\"o\":\"a\",\"t\":\"change\",\"case\":\"C\",\"seq\":0}", "sequence")]
    [InlineData("{\"v\":1,\"o\":\"a\",\"t\":\"change\",\"case\":\"C\",\"seq\":1.5}", "sequence")]
    [InlineData("{\"v\":1,\"o\":\"a\",\"t\":\"change\",\"case\":\"C\",\"seq\":99999999999}", "sequence")]
    [InlineData("{\"v\":1,\"o\":\"a\",\"t\":\"delete\",\"case\":\"C\",\"seq\":1}", "unknown type")]
    [InlineData("{\"v\":1,\"o\":\"a\",\"t\":\"here\",\"case\":\"C\",\"u\":\"u\",\"n\":\"N\"}", "session, account or name")]
    [InlineData("{\"v\":1,\"o\":\"a\",\"t\":\"here\",\"case\":\"C\",\"s\":\"s\",\"u\":\"u\",\"n\":\"N\",\"i\":3}", "item or activity")]
    [InlineData("{\"v\":1,\"o\":\"a\",\"t\":\"here\",\"case\":\"C\",\"s\":\"s\",\"u\":\"u\",\"n\":\"N\",\"d\":{}}", "item or activity")]
    public void A_malformed_payload_is_refused_with_its_reason_and_never_throws(string? payload, string reason)
    {
        var read = LivePayload.Parse(payload);

        Assert.False(read.Ok);
        Assert.Null(read.Change);
        Assert.Null(read.Presence);
        Assert.Contains(reason, read.Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void A_payload_over_the_notify_limit_is_refused_before_it_is_parsed()
    {
        var huge = "{\"v\":1,\"o\":\"a\",\"t\":\"change\",\"case\":\"C\",\"seq\":1,\"pad\":\"" + new string('x', 8_000) + "\"}";

        Assert.Contains("longer than 7999 bytes", LivePayload.Parse(huge).Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void A_candidate_id_longer_than_the_stated_limit_is_refused()
    {
        var text = LivePayload.Format("o", new CaseChanged(new string('C', EventReview.Core.Inputs.InputLimits.MaxCandidateIdLength + 1), 1));

        Assert.False(LivePayload.Parse(text).Ok);
    }
}
