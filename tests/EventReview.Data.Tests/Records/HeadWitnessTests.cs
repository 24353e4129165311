using EventReview.Data.Records;
using EventReview.Data.Tests.Fixtures;

namespace EventReview.Data.Tests.Records;

public sealed class HeadWitnessTests : IDisposable
{
    private readonly TempFolder _folder = new("er-witness");

    public void Dispose() => _folder.Dispose();

    private (HeadWitness Witness, FileRecordKeyRing Keys) Open(DateTimeOffset? now = null)
    {
        var settings = RecordSettings.ForDataDirectory(_folder.Path);
        var keys = FileRecordKeyRing.Open(settings.KeyDirectory);
        keys.EnsureSigningKey(DateTimeOffset.UtcNow, false);
        var clock = new FixedClock(now ?? new DateTimeOffset(2031, 5, 1, 8, 0, 0, TimeSpan.Zero));
        return (new HeadWitness(settings, keys, clock), keys);
    }

    [Fact]
    public void Batches_append_signed_lines_and_the_newest_head_of_each_chain_wins()
    {
        var (w, keys) = Open();
        using (w)
        using (keys)
        {
            w.Append([new WitnessedHead("case:A", 1, "a1"), new WitnessedHead("case:A", 2, "a2"), new WitnessedHead("case:B", 1, "b1")]);
            Assert.True(w.Flush());
            w.Append([new WitnessedHead("case:A", 3, "a3")]);
            w.Append([]);
            Assert.True(w.Flush());

            var r = w.Read();

            Assert.Equal(2, r.Lines);
            Assert.Empty(r.Problems);
            Assert.Equal(("a3", 3L), (r.Newest["case:A"].Head.Hash, r.Newest["case:A"].Head.Sequence));
            Assert.Equal("b1", r.Newest["case:B"].Head.Hash);
            Assert.Equal(2, File.ReadAllLines(w.FilePath).Length);
        }
    }

    [Fact]
    public void Batches_handed_over_while_a_line_is_written_share_the_next_line()
    {
        var (w, keys) = Open();
        using (w)
        using (keys)
        {
            for (var i = 1; i <= 200; i++)
            {
                w.Append([new WitnessedHead("case:A", i, $"a{i}")]);
            }

            Assert.True(w.Flush());
            var r = w.Read();
            Assert.InRange(r.Lines, 1, 200);
            Assert.Equal(200, r.Newest["case:A"].Head.Sequence);
            Assert.Empty(r.Problems);
        }
    }

    [Fact]
    public void A_torn_last_line_is_tolerated_but_a_damaged_or_forged_line_is_named()
    {
        var (w, keys) = Open();
        using (w)
        using (keys)
        {
            w.Append([new WitnessedHead("case:A", 1, "a1")]);
            w.Flush();
            w.Append([new WitnessedHead("case:A", 2, "a2")]);
            w.Dispose();
            File.AppendAllText(w.FilePath, "{\"format\":\"eventreview-wit");
            Assert.Empty(HeadWitness.Read(w.FilePath, keys).Problems);

            // A head raised by hand: the line no longer matches its signature, and its heads are not used.
            var lines = File.ReadAllLines(w.FilePath);
            File.WriteAllLines(w.FilePath, [lines[0], lines[1].Replace("\"sequence\":2", "\"sequence\":9", StringComparison.Ordinal), "garbage", lines[1]]);
            var r = HeadWitness.Read(w.FilePath, keys);

            Assert.Contains(r.Problems, p => p.Contains("line 2", StringComparison.Ordinal) && p.Contains("valid signature", StringComparison.Ordinal));
            Assert.Contains(r.Problems, p => p.Contains("line 3 cannot be read", StringComparison.Ordinal));
            Assert.False(r.Newest.ContainsKey("case:A") && r.Newest["case:A"].Head.Sequence == 9);
        }
    }

    [Fact]
    public void Reading_as_of_a_time_leaves_out_lines_written_later()
    {
        var settings = RecordSettings.ForDataDirectory(_folder.Path);
        using var keys = FileRecordKeyRing.Open(settings.KeyDirectory);
        keys.EnsureSigningKey(DateTimeOffset.UtcNow, false);
        var clock = new FixedClock(new DateTimeOffset(2031, 5, 1, 8, 0, 0, TimeSpan.Zero));
        using var w = new HeadWitness(settings, keys, clock);
        w.Append([new WitnessedHead("case:A", 1, "a1")]);
        w.Flush();
        clock.Advance(TimeSpan.FromHours(1));
        w.Append([new WitnessedHead("case:A", 2, "a2")]);

        Assert.Equal(1, w.Read(new DateTimeOffset(2031, 5, 1, 8, 30, 0, TimeSpan.Zero)).Newest["case:A"].Head.Sequence);
        Assert.Equal(2, w.Read().Newest["case:A"].Head.Sequence);
    }

    [Fact]
    public void The_default_witness_is_inside_the_data_folder_and_a_configured_one_is_not()
    {
        Assert.True(RecordSettings.ForDataDirectory(_folder.Path).WitnessInside(_folder.Path));
        Assert.False(RecordSettings.From(null, Path.Combine(Path.GetTempPath(), "elsewhere"), null, _folder.Path).WitnessInside(_folder.Path));
        Assert.False(RecordSettings.From(null, _folder.Path + "-witness", null, _folder.Path).WitnessInside(_folder.Path));
    }
}
