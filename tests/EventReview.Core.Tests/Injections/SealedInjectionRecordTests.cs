using System.Text;
using EventReview.Core.Cases;
using EventReview.Core.Injections;

namespace EventReview.Core.Tests.Injections;

public sealed class SealedInjectionRecordTests
{
    private static readonly Actor Coordinator = new("u1", "Coordinator One");
    private static readonly DateTimeOffset Then = new(2026, 1, 2, 3, 4, 5, TimeSpan.Zero);
    private static readonly byte[] Record = Encoding.UTF8.GetBytes("site,start_gps,end_gps,kind,waveform_ref,status\nTQ,1000,1010,cbc,blind-1,performed");
    private static readonly byte[] Salt = Enumerable.Range(0, 32).Select(i => (byte)(7 * i)).ToArray();

    private static SealedInjectionRecord Sealed() => SealedInjectionRecord.Register(SealedRecord.Commitment(Salt, Record).ToUpperInvariant(), " Period 3 ", Coordinator, Then);

    [Fact]
    public void Register_keeps_the_commitment_in_lower_case_and_the_trimmed_label_and_is_not_opened()
    {
        var s = Sealed();
        Assert.Equal(SealedRecord.Commitment(Salt, Record), s.Commitment);
        Assert.Equal("Period 3", s.Label);
        Assert.False(s.IsOpened);
        Assert.Null(s.OpenedRecord);
    }

    [Theory]
    [InlineData("abc")]
    [InlineData("zz00000000000000000000000000000000000000000000000000000000000000")]
    public void Register_refuses_a_commitment_that_is_not_64_hex_digits(string commitment) =>
        Assert.Throws<ArgumentException>(() => SealedInjectionRecord.Register(commitment, "x", Coordinator, Then));

    [Fact]
    public void Open_with_the_right_record_and_salt_records_who_when_where_and_the_revealed_bytes()
    {
        var s = Sealed();
        s.Open(Record, Convert.ToHexString(Salt), 42, "nothing overlaps", Coordinator, Then.AddDays(3));
        Assert.True(s.IsOpened);
        Assert.Equal(42, s.OpenedInCaseId);
        Assert.Equal("Coordinator One", s.OpenedByName);
        Assert.Equal(Record, s.OpenedRecord);
        Assert.Equal(Convert.ToHexStringLower(Salt), s.OpenedSalt);
        Assert.True(s.Matches(s.OpenedRecord!, s.OpenedSalt!)); // anyone can re-verify from what is kept
    }

    [Fact]
    public void Open_with_a_wrong_salt_an_altered_record_or_a_non_hex_salt_is_refused_and_changes_nothing()
    {
        var s = Sealed();
        var wrongSalt = Convert.ToHexString(Salt.Select(b => (byte)(b ^ 1)).ToArray());
        var altered = Record.ToArray();
        altered[^1] ^= 0x20;
        foreach (var (record, salt) in new[] { (Record, wrongSalt), (altered, Convert.ToHexString(Salt)), (Record, "not hex") })
        {
            var ex = Assert.Throws<DomainRuleException>(() => s.Open(record, salt, 1, "x", Coordinator, Then));
            Assert.Equal("commitment-mismatch", ex.Rule);
        }

        Assert.False(s.IsOpened);
        Assert.Null(s.OpenedRecord);
        Assert.Null(s.OpenedSalt);
    }

    [Fact]
    public void A_seal_is_opened_only_once()
    {
        var s = Sealed();
        s.Open(Record, Convert.ToHexString(Salt), 1, "first", Coordinator, Then);
        var ex = Assert.Throws<DomainRuleException>(() => s.Open(Record, Convert.ToHexString(Salt), 2, "second", Coordinator, Then));
        Assert.Equal("seal-already-opened", ex.Rule);
        Assert.Equal(1, s.OpenedInCaseId);
    }
}
