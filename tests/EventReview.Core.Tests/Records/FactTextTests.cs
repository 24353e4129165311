using EventReview.Core.Records;

namespace EventReview.Core.Tests.Records;

public class FactTextTests
{
    [Fact]
    public void Facts_round_trip_through_their_stored_text_whatever_the_values_hold()
    {
        Fact[] facts =
        [
            new("case.closing", "Line one\nline two\r\nback\\slash = sign"),
            new("item[timing.arrival].owner-name", string.Empty),
            new("signoff[a.b]+", "seal"),
        ];

        var text = FactText.Format(facts);

        Assert.Equal("case.closing=Line one\\nline two\\r\\nback\\\\slash = sign\nitem[timing.arrival].owner-name=\nsignoff[a.b]+=seal", text);
        Assert.Equal(facts, FactText.Parse(text));
        Assert.Empty(FactText.Parse(string.Empty));
    }

    [Theory]
    [InlineData("no-equals-sign")]
    [InlineData("=value without a name")]
    [InlineData("case.state=bad \\q escape")]
    [InlineData("case.state=ends in \\")]
    public void Unreadable_facts_are_refused_naming_the_line(string text)
    {
        var ex = Assert.Throws<FormatException>(() => FactText.Parse("case.state=Open\n" + text));

        Assert.Contains("line 2", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Names_with_an_equals_sign_or_a_line_break_cannot_be_written()
    {
        Assert.Throws<ArgumentException>(() => FactText.Format([new Fact("a=b", "c")]));
        Assert.Throws<ArgumentException>(() => FactText.Format([new Fact("a\nb", "c")]));
    }

    [Theory]
    [InlineData("case.state", "case", null, "state")]
    [InlineData("arrival[KX]", "arrival", "KX", "")]
    [InlineData("item[timing.arrival].owner-name", "item", "timing.arrival", "owner-name")]
    [InlineData("signoff[timing.arrival].stale", "signoff", "timing.arrival", "stale")]
    [InlineData("evidence[a]+", "evidence", "a", "+")]
    [InlineData("configuration+", "configuration", null, "+")]
    public void Fact_names_split_into_part_key_and_field(string name, string part, string? key, string rest)
    {
        Assert.True(FactNames.TryParse(name, out var p, out var k, out var r));
        Assert.Equal((part, key, rest), (p, k, r));
    }

    [Theory]
    [InlineData("case.")]
    [InlineData("arrival[KX].x")]
    [InlineData("item[a]")]
    [InlineData("evidence[a].stale")]
    [InlineData("gadget[a]+")]
    public void Unknown_fact_names_are_not_parsed(string name) => Assert.False(FactNames.TryParse(name, out _, out _, out _));
}
