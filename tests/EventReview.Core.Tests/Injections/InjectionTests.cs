using System.Text;
using EventReview.Core.Imports;
using EventReview.Core.Injections;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Injections;

public class InjectionTests
{
    private const string Log = "site,start_gps,end_gps,kind,waveform_ref,status\n" +
        "KX,1000,1002,burst,sg_100.txt,performed\n" +
        "MV,1000.5,1001,burst,sg_100.txt,aborted\n" +
        "KX,5000,5010,cbc,bns_a.txt,scheduled\n";

    [Fact]
    public void Injection_log_import_reads_every_status()
    {
        var list = InjectionLogCsv.Parse(new StringReader(Log), ["KX", "MV"]);
        Assert.Equal(3, list.Count);
        Assert.Equal(InjectionStatus.Aborted, list[1].Status);
        Assert.Equal(2.0, list[0].DurationSeconds);
    }

    [Theory]
    [InlineData("KX,1000,1002,burst,w,done", "status")]
    [InlineData("KX,1000,999,burst,w,performed", "end_gps")]
    [InlineData("QQ,1000,1002,burst,w,performed", "site")]
    [InlineData("KX,1000,1002,burst,,performed", "waveform_ref")]
    public void Malformed_injection_lines_are_rejected_naming_the_line(string row, string column)
    {
        var csv = "site,start_gps,end_gps,kind,waveform_ref,status\nKX,1,2,burst,w,performed\n" + row + "\n";
        var ex = Assert.Throws<CsvFormatException>(() => InjectionLogCsv.Parse(new StringReader(csv), ["KX", "MV"]));
        Assert.Equal(3, ex.LineNumber);
        Assert.Equal(column, ex.Column);
    }

    [Fact]
    public void Overlap_lookup_checks_every_site_with_its_arrival_and_the_margin()
    {
        var list = InjectionLogCsv.Parse(new StringReader(Log), null);
        var arrivals = new Dictionary<string, GpsTime> { ["KX"] = GpsTime.FromSeconds(1002.5m) };
        var none = InjectionOverlap.Find(list, GpsTime.FromSeconds(1000.7m), arrivals, ["TQ"], marginSeconds: 0.1);
        Assert.Equal(["KX", "MV", "TQ"], none.SitesChecked.Select(s => s.Site));
        // KX arrives 0.5 s after its injection ended: outside a 0.1 s margin; MV (case time 1000.7) overlaps an aborted one.
        var mv = Assert.Single(none.Hits);
        Assert.Equal("aborted", mv.Status);
        Assert.Equal("clear", none.Judgement.Word);

        var withMargin = InjectionOverlap.Find(list, GpsTime.FromSeconds(1000.7m), arrivals, [], marginSeconds: 1);
        var k1 = withMargin.Hits.Single(h => h.Site == "KX");
        Assert.Equal(0.5, k1.OffsetSeconds, 1e-9);
        Assert.Equal("concern", withMargin.Judgement.Word);
    }

    [Fact]
    public void Sealed_record_round_trip_verifies()
    {
        var record = Encoding.UTF8.GetBytes(Log);
        var seal = SealedRecord.Seal(record);
        Assert.Matches("^[0-9a-f]{64}$", seal.Commitment);
        Assert.Matches("^[0-9a-f]{64}$", seal.Salt);
        Assert.True(SealedRecord.Verify(seal.Commitment, record, seal.Salt));
        Assert.True(SealedRecord.Verify(seal.Commitment.ToUpperInvariant(), record, seal.Salt.ToUpperInvariant()));
        Assert.NotEqual(seal.Salt, SealedRecord.Seal(record).Salt);
    }

    [Fact]
    public void Sealed_record_rejects_a_wrong_salt_and_an_altered_record()
    {
        var record = Encoding.UTF8.GetBytes(Log);
        var seal = SealedRecord.Seal(record);
        var wrongSalt = (seal.Salt[0] == '0' ? "1" : "0") + seal.Salt[1..];
        Assert.False(SealedRecord.Verify(seal.Commitment, record, wrongSalt));
        var altered = (byte[])record.Clone();
        altered[^2] ^= 1;
        Assert.False(SealedRecord.Verify(seal.Commitment, altered, seal.Salt));
        Assert.Throws<FormatException>(() => SealedRecord.Verify(seal.Commitment, record, "xyz"));
    }

    [Fact]
    public void Commitment_is_sha256_of_salt_then_record()
    {
        // FIPS 180-2 / NIST example (from memory): SHA-256("abc") = ba7816bf...15ad; here salt "a" (0x61) + record "bc".
        Assert.Equal("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad",
            SealedRecord.Commitment([0x61], Encoding.ASCII.GetBytes("bc")));
    }

    [Fact]
    public void Opening_a_blind_record_reveals_overlaps_only_when_the_commitment_matches()
    {
        var record = Encoding.UTF8.GetBytes("site,start_gps,end_gps,kind,waveform_ref,status\nKX,2000,2001,cbc,blind_1.txt,performed\n");
        var seal = SealedRecord.Seal(record);
        var arrivals = new Dictionary<string, GpsTime>();
        var opened = BlindInjectionRecord.Open(seal.Commitment, record, seal.Salt, GpsTime.FromSeconds(2000.5m), arrivals, ["KX", "MV"], 0);
        Assert.NotNull(opened);
        Assert.Equal("concern", opened.Judgement.Word);
        Assert.Equal("blind_1.txt", Assert.Single(opened.Hits).WaveformRef);
        Assert.Null(BlindInjectionRecord.Open(new string('0', 64), record, seal.Salt, GpsTime.FromSeconds(2000.5m), arrivals, ["KX"], 0));
        var empty = Encoding.UTF8.GetBytes("site,start_gps,end_gps,kind,waveform_ref,status\n");
        Assert.Empty(BlindInjectionRecord.Parse(empty, null));
    }
}
