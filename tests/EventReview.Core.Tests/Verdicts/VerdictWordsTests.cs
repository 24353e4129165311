using EventReview.Core.Verdicts;

namespace EventReview.Core.Tests.Verdicts;

public class VerdictWordsTests
{
    [Fact]
    public void Every_verdict_has_one_distinct_stored_word_that_parses_back()
    {
        var words = new HashSet<string>(StringComparer.Ordinal);
        foreach (var v in Enum.GetValues<Verdict>())
        {
            var word = VerdictWords.Word(v);
            Assert.True(words.Add(word), $"word '{word}' used twice");
            Assert.True(VerdictWords.TryParse(word, out var back));
            Assert.Equal(v, back);
        }
    }

    [Fact]
    public void Stored_words_of_format_1_keep_their_meaning()
    {
        // These words sit inside the content hashes of stored records: changing one breaks every old record.
        Assert.Equal("consistent", VerdictWords.Word(Verdict.Consistent));
        // The two legacy data-chain words are pinned by the SHA-256 of their UTF-8 bytes (the words themselves appear only in
        // the verdict table and the format-1 fixtures).
        Assert.Equal("c2c150ccf318f3faf1638f4430ed3a4a33a0e12f202316923619d1ed0159cc5f", Sha256(VerdictWords.Word(Verdict.NothingAdded)));
        Assert.Equal("bf490656f6348b9f348a1b302431b808445b9ef6eddc5b8116ffdb07c5d85296", Sha256(VerdictWords.Word(Verdict.SomethingAdded)));
        Assert.Equal(VerdictTone.Good, VerdictWords.ToneOf(VerdictWords.Word(Verdict.NothingAdded)));
        Assert.Equal(VerdictTone.Bad, VerdictWords.ToneOf(VerdictWords.Word(Verdict.SomethingAdded)));
        Assert.Equal(VerdictTone.Neutral, VerdictWords.ToneOf("a word no version used"));
        Assert.False(VerdictWords.TryParse("Consistent", out _));
    }

    [Fact]
    public void Format_2_adds_our_own_chain_words_and_neutral_significance_bands()
    {
        Assert.Equal("residual is noise", VerdictWords.Word(Verdict.ResidualIsNoise));
        Assert.Equal("excess found", VerdictWords.Word(Verdict.ExcessFound));
        Assert.Equal("model does not fit", VerdictWords.Word(Verdict.ModelDoesNotFit));
        foreach (var band in new[] { Verdict.BelowThreeSigma, Verdict.ThreeToFiveSigma, Verdict.FiveSigmaOrMore, Verdict.AtLeastThreeSigma })
        {
            Assert.Equal(VerdictTone.Neutral, VerdictWords.Tone(band));
        }

        Assert.Equal(2, RecordFormat.Current);
        Assert.Equal(1, RecordFormat.Of(null));
        Assert.Equal(1, RecordFormat.Of(0));
    }

    [Fact]
    public void A_judgement_serialises_as_its_stored_word_and_reason_and_reads_back()
    {
        var j = new Judgement(Verdict.ModelDoesNotFit, "stage 1: 97 % coherent");
        var json = System.Text.Json.JsonSerializer.Serialize(j, new System.Text.Json.JsonSerializerOptions(System.Text.Json.JsonSerializerDefaults.Web));
        Assert.Equal("{\"verdict\":\"model does not fit\",\"reason\":\"stage 1: 97 % coherent\"}", json);
        Assert.Equal(j, System.Text.Json.JsonSerializer.Deserialize<Judgement>(json));
        Assert.Throws<System.Text.Json.JsonException>(() => System.Text.Json.JsonSerializer.Deserialize<Judgement>("{\"verdict\":\"fine\",\"reason\":\"\"}"));
    }

    [Fact]
    public void The_worst_judgement_goes_by_tone()
    {
        var worst = Judgement.Worst([new Judgement(Verdict.Clear, "a"), new Judgement(Verdict.Concern, "b"), new Judgement(Verdict.ThreeToFiveSigma, "c")]);
        Assert.Equal(Verdict.Concern, worst!.Verdict);
        Assert.Null(Judgement.Worst([]));
    }

    private static string Sha256(string text) =>
        Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(text)));
}
