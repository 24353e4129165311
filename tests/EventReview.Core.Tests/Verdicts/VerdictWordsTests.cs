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
        Assert.Equal("nothing added", VerdictWords.Word(Verdict.NothingAdded));
        Assert.Equal(VerdictTone.Bad, VerdictWords.ToneOf("something added"));
        Assert.Equal(VerdictTone.Neutral, VerdictWords.ToneOf("a word no version used"));
        Assert.False(VerdictWords.TryParse("Consistent", out _));
    }
}
