using EventReview.Core.Imports;
using EventReview.Core.Significance;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Significance;

public class ImportTests
{
    [Fact]
    public void Trigger_columns_may_come_in_any_order_with_extras_and_optional_fields()
    {
        const string csv = "snr,extra,gps_time,chirp_mass\n7.5,x,1300000000.123456789,1.2\n# comment\n\n8,y,1300000001,\n";
        var list = TriggerCsv.Parse(new StringReader(csv));
        Assert.Equal(2, list.Count);
        Assert.Equal(1_300_000_000_123_456_789L, list[0].Time.Nanoseconds);
        Assert.Equal(7.5, list[0].Snr);
        Assert.Equal(1.2, list[0].ChirpMass);
        Assert.Null(list[1].ChirpMass);
        Assert.Null(list[1].FrequencyHz);
    }

    [Theory]
    [InlineData("gps_time,snr\n1300000000,5\n1300000001,NaN\n", "line 3", "snr")]
    [InlineData("gps_time,snr\n1300000000,5\n1300000001,Infinity\n", "line 3", "snr")]
    [InlineData("gps_time,snr\n1300000000,abc\n", "line 2", "snr")]
    [InlineData("gps_time,snr\n\n1300000000,-1\n", "line 3", "snr")]
    [InlineData("gps_time,snr\nnot-a-time,5\n", "line 2", "gps_time")]
    [InlineData("gps_time,snr,chirp_mass\n1300000000,5,0\n", "line 2", "chirp_mass")]
    [InlineData("gps_time,snr\n1300000000,5,9\n", "line 2", "fields")]
    [InlineData("time,snr\n1300000000,5\n", "line 1", "gps_time")]
    public void Malformed_trigger_files_are_rejected_naming_the_line_and_column(string csv, string line, string column)
    {
        var ex = Assert.Throws<CsvFormatException>(() => TriggerCsv.Parse(new StringReader(csv), "t.csv"));
        Assert.Contains("t.csv " + line, ex.Message);
        Assert.Contains(column, ex.Message);
    }

    [Fact]
    public void A_segment_ending_at_or_before_its_start_is_rejected_with_its_line()
    {
        var ex = Assert.Throws<CsvFormatException>(() => SegmentCsv.Parse(new StringReader("start_gps,end_gps\n100,200\n300,300\n"), "s.csv"));
        Assert.Contains("s.csv line 3, column 'end_gps'", ex.Message);
    }

    [Fact]
    public void Overlapping_and_touching_segments_are_merged_and_counted()
    {
        var import = SegmentCsv.Parse(new StringReader("end_gps,start_gps\n200,100\n250,150\n400,300\n300,250\n600,500\n"));
        Assert.Equal(5, import.RowsRead);
        Assert.Equal(3, import.MergedCount);
        Assert.Equal(2, import.Segments.Count);
        Assert.Equal(GpsTime.FromSeconds(100m), import.Segments[0].Start);
        Assert.Equal(GpsTime.FromSeconds(400m), import.Segments[0].End);
    }

    [Fact]
    public void Triggers_at_a_segment_start_are_kept_and_at_its_end_are_dropped_and_counted()
    {
        var seg = new Segment(new GpsTime(1_000), new GpsTime(2_000));
        var site = SiteTriggers.Create("KX", [new Trigger(new GpsTime(1_999), 5), new Trigger(new GpsTime(1_000), 5), new Trigger(new GpsTime(2_000), 5), new Trigger(new GpsTime(999), 5)], [seg]);
        Assert.Equal(2, site.DroppedOutsideSegments);
        Assert.Equal([1_000L, 1_999L], site.Triggers.Select(t => t.Time.Nanoseconds));
    }
}
