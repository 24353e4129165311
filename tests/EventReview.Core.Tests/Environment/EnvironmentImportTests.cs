using EventReview.Core.Environment;
using EventReview.Core.Imports;

namespace EventReview.Core.Tests.Environment;

public class EnvironmentImportTests
{
    private static readonly string[] Known = ["KX", "M2"];

    [Fact]
    public void Segments_import_merges_overlapping_rows_of_one_flag_and_says_so()
    {
        var csv = "site,flag,start_gps,end_gps,comment\nKX,GROUND_NOISE,100,110,a\nKX,GROUND_NOISE,105,120,b\nKX,OTHER,100,101,\nM2,GROUND_NOISE,100,110,\n";
        var result = DataQualitySegmentCsv.Parse(new StringReader(csv), Known);
        Assert.Equal(3, result.Segments.Count);
        var merged = result.Segments.Single(s => s.Site == "KX" && s.Flag == "GROUND_NOISE");
        Assert.Equal(100, merged.Start.Seconds);
        Assert.Equal(120, merged.End.Seconds);
        Assert.Equal("a; b", merged.Comment);
        Assert.Contains("lines 2, 3", Assert.Single(result.Notes));
    }

    [Fact]
    public void Segments_with_end_not_after_start_are_rejected_naming_the_line()
    {
        var csv = "site,flag,start_gps,end_gps\nKX,F,100,110\nKX,F,200,200\n";
        var ex = Assert.Throws<CsvFormatException>(() => DataQualitySegmentCsv.Parse(new StringReader(csv), Known));
        Assert.Equal(3, ex.LineNumber);
        Assert.Equal("end_gps", ex.Column);
        Assert.StartsWith("line 3", ex.Message);
    }

    [Fact]
    public void Unknown_site_codes_are_rejected_naming_the_line()
    {
        var csv = "site,channel,gps_time,snr\nKX,SEIS_X,100,5\nZ9,SEIS_X,101,5\n";
        var ex = Assert.Throws<CsvFormatException>(() => AuxiliaryTriggerCsv.Parse(new StringReader(csv), Known));
        Assert.Equal(3, ex.LineNumber);
        Assert.Contains("unknown site 'Z9'", ex.Message);
    }

    [Theory]
    [InlineData("KX,SEIS_X,100,NaN,,", "snr")]
    [InlineData("KX,SEIS_X,abc,5,,", "gps_time")]
    [InlineData("KX,SEIS_X,100,-1,,", "snr")]
    [InlineData("KX,SEIS_X,100,5,0,", "frequency_hz")]
    [InlineData("KX,,100,5,,", "channel")]
    [InlineData("KX,SEIS_X,100,5", null)] // fewer fields than the header: a shifted row is refused, not read with blanks
    public void Malformed_trigger_lines_are_rejected_naming_line_and_column(string row, string? column)
    {
        var csv = "site,channel,gps_time,snr,frequency_hz,duration_s\n" + row + "\n";
        var ex = Assert.Throws<CsvFormatException>(() => AuxiliaryTriggerCsv.Parse(new StringReader(csv), Known));
        Assert.Equal(2, ex.LineNumber);
        Assert.Equal(column, ex.Column);
    }

    [Fact]
    public void Triggers_import_reads_optional_columns_and_sorts_by_time()
    {
        var csv = "site,channel,gps_time,snr,frequency_hz,duration_s\nM2,MAG_Z,1000000010.5,8,60,0.1\nKX,SEIS_X,1000000001.25,12,,\n";
        var list = AuxiliaryTriggerCsv.Parse(new StringReader(csv), Known);
        Assert.Equal("KX", list[0].Site);
        Assert.Null(list[0].FrequencyHz);
        Assert.Equal(60, list[1].FrequencyHz);
        Assert.Equal(1000000010.5m, list[1].Time.Nanoseconds / 1e9m);
    }

    [Fact]
    public void Inventory_rejects_an_unknown_kind_and_a_duplicate_channel_naming_the_line()
    {
        var bad = "site,channel,kind,location\nKX,SEIS_X,seismic,end station\nKX,MIC_1,noisy,corner\n";
        var ex = Assert.Throws<CsvFormatException>(() => SensorInventoryCsv.Parse(new StringReader(bad), Known));
        Assert.Equal(3, ex.LineNumber);
        Assert.Equal("kind", ex.Column);

        var dup = "site,channel,kind,location\nKX,SEIS_X,seismic,a\nKX,SEIS_X,acoustic,b\n";
        Assert.Equal(3, Assert.Throws<CsvFormatException>(() => SensorInventoryCsv.Parse(new StringReader(dup), Known)).LineNumber);

        var ok = SensorInventoryCsv.Parse(new StringReader("site,channel,kind,location,coupling_file\nkx,MAG_Z,Magnetic,vault,mag.csv\n"), Known);
        Assert.Equal(SensorKind.Magnetic, ok[0].Kind);
        Assert.Equal("KX", ok[0].Site);
        Assert.Equal("mag.csv", ok[0].CouplingFile);
    }

    [Fact]
    public void A_file_without_the_required_header_is_rejected_on_line_one()
    {
        var ex = Assert.Throws<CsvFormatException>(() => DataQualitySegmentCsv.Parse(new StringReader("KX,F,100,110\n"), Known));
        Assert.Equal(1, ex.LineNumber);
        Assert.Throws<CsvFormatException>(() => DataQualitySegmentCsv.Parse(new StringReader(""), Known));
    }

    [Fact]
    public void Coupling_table_rejects_non_increasing_frequencies_naming_the_line()
    {
        var csv = "frequency_hz,coupling\n10,1e-20\n10,2e-20\n";
        var ex = Assert.Throws<CsvFormatException>(() => FrequencyTable.Parse(new StringReader(csv)));
        Assert.Equal(3, ex.LineNumber);
        Assert.Throws<CsvFormatException>(() => FrequencyTable.Parse(new StringReader("frequency_hz,coupling\n10,-1\n")));
    }
}
