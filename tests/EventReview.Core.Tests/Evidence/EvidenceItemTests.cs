using EventReview.Core.Evidence;
using EventReview.Core.Tests.Builders;

namespace EventReview.Core.Tests.Evidence;

public class EvidenceItemTests
{
    [Fact]
    public void A_note_is_hashed_as_sha256_of_its_utf8_text()
    {
        var note = EvidenceItem.Note("abc", People.ReviewerA, Clock.T0);

        // FIPS 180-2, appendix B.1: SHA-256("abc").
        Assert.Equal("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", note.ContentSha256);
        Assert.Equal(EvidenceKind.Note, note.Kind);
        Assert.Equal(People.ReviewerA.UserId, note.AddedBy);
        Assert.Equal(People.ReviewerA.DisplayName, note.AddedByName);
        Assert.Equal(Clock.T0, note.AddedAt);
    }

    [Theory]
    [InlineData("")]
    [InlineData(" \n\t ")]
    public void An_empty_note_is_refused(string text)
    {
        Assert.Equal("text", Assert.Throws<ArgumentException>(() => EvidenceItem.Note(text, People.ReviewerA, Clock.T0)).ParamName);
    }

    [Fact]
    public void A_note_of_100000_characters_is_accepted_and_one_more_is_refused()
    {
        Assert.Equal(100_000, EvidenceItem.Note(new string('n', 100_000), People.ReviewerA, Clock.T0).Text.Length);

        var ex = Assert.Throws<ArgumentException>(() => EvidenceItem.Note(new string('n', 100_001), People.ReviewerA, Clock.T0));
        Assert.Contains("100,000", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("../../etc/passwd", "passwd")]
    [InlineData("..\\..\\windows\\win.ini", "win.ini")]
    [InlineData("C:\\data\\plots\\strain.png", "strain.png")]
    [InlineData("plain.txt", "plain.txt")]
    [InlineData("folder/", "attachment")]
    [InlineData("", "attachment")]
    public void An_attachment_keeps_only_the_bare_file_name_for_display(string uploaded, string kept)
    {
        var a = EvidenceItem.Attachment(uploaded, "text/plain", 3, new string('0', 64), "desc", People.ReviewerA, Clock.T0);

        Assert.Equal(kept, a.FileName);
        Assert.Equal(3, a.SizeBytes);
        Assert.Equal(new string('0', 64), a.ContentSha256);
    }

    [Theory]
    [InlineData("")]
    [InlineData("abc")]
    [InlineData("BA7816BF8F01CFEA414140DE5DAE2223B00361A396177A9CB410FF61F20015AD")]
    [InlineData("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015a")]
    [InlineData("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ag")]
    public void An_attachment_refuses_a_hash_that_is_not_64_lowercase_hex_digits(string hash)
    {
        Assert.Equal("sha256", Assert.Throws<ArgumentException>(() => EvidenceItem.Attachment("f.txt", "text/plain", 1, hash, "", People.ReviewerA, Clock.T0)).ParamName);
    }

    [Fact]
    public void A_link_keeps_the_url_hashes_it_and_uses_it_as_title_when_none_is_given()
    {
        var link = EvidenceItem.Link("https://logbook.example.invalid/entry/42", "  ", People.ReviewerA, Clock.T0);

        Assert.Equal("https://logbook.example.invalid/entry/42", link.Url);
        Assert.Equal(link.Url, link.Text);
        Assert.Equal(Hashing.Sha256Hex("https://logbook.example.invalid/entry/42"), link.ContentSha256);
        Assert.Equal("Shift log", EvidenceItem.Link("http://x.invalid/", " Shift log ", People.ReviewerA, Clock.T0).Text);
    }

    [Theory]
    [InlineData("javascript:alert(1)")]
    [InlineData("ftp://files.example.invalid/x")]
    [InlineData("/relative/path")]
    [InlineData("not a url")]
    [InlineData("file:///etc/passwd")]
    public void A_link_refuses_anything_but_absolute_http_or_https(string url)
    {
        Assert.Equal("url", Assert.Throws<ArgumentException>(() => EvidenceItem.Link(url, "t", People.ReviewerA, Clock.T0)).ParamName);
    }

    [Fact]
    public void A_computation_record_refuses_an_unknown_check_kind()
    {
        var ex = Assert.Throws<ArgumentException>(() =>
            new ComputationRecord("astrology", "{}", "", "1", "{}", "clear", "", "", People.ReviewerA, Clock.T0));

        Assert.Contains("astrology", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_computation_record_hash_covers_its_result_and_verdict()
    {
        ComputationRecord Make(string result, string verdict) =>
            new("timing", "{\"p\":1}", new string('e', 64), "1.0", result, verdict, "summary", "", People.ReviewerA, Clock.T0);

        var a = Make("{\"x\":1}", "consistent");

        Assert.Equal(a.ContentSha256, Make("{\"x\":1}", "consistent").ContentSha256);
        Assert.NotEqual(a.ContentSha256, Make("{\"x\":2}", "consistent").ContentSha256);
        Assert.NotEqual(a.ContentSha256, Make("{\"x\":1}", "inconsistent").ContentSha256);
    }

    [Theory]
    [InlineData("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", true)]
    [InlineData("BA7816BF8F01CFEA414140DE5DAE2223B00361A396177A9CB410FF61F20015AD", false)]
    [InlineData("ba7816bf", false)]
    [InlineData(null, false)]
    public void Only_64_lowercase_hex_digits_count_as_a_sha256(string? value, bool expected)
    {
        Assert.Equal(expected, Hashing.IsSha256Hex(value));
    }

    [Fact]
    public void Hashing_a_stream_and_its_bytes_give_the_same_digest()
    {
        var bytes = "The quick brown fox jumps over the lazy dog"u8.ToArray();

        // Well-known SHA-256 test string (e.g. the Wikipedia SHA-2 article's example).
        Assert.Equal("d7a8fbb307d7809469ca9abcb0082e4f8d5651e46d3cdb762d02d0bf37c9e592", Hashing.Sha256Hex(bytes));
        Assert.Equal(Hashing.Sha256Hex(bytes), Hashing.Sha256Hex(new MemoryStream(bytes)));
    }
}
