using EventReview.Core.Signal;
using EventReview.Core.Signal.Io;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Signal.Io;

public class StrainTextReaderTests
{
    private static string Good(int n = 20, double fs = 16, string sep = " ")
    {
        var lines = new List<string> { "# made by a test", "gps_time value" };
        for (int i = 0; i < n; i++)
        {
            lines.Add(FormattableString.Invariant($"{1000000000 + (i / fs):F6}{sep}{Math.Sin(i):R}"));
        }

        return string.Join('\n', lines);
    }

    private static TimeSeries Read(string text, int min = 16) => StrainTextReader.Read(new StringReader(text), new StrainReadOptions(MinimumSamples: min));

    [Theory]
    [InlineData(" ")]
    [InlineData("\t")]
    [InlineData(",")]
    public void A_well_formed_file_is_read_with_rate_from_the_span(string sep)
    {
        var ts = Read(Good(sep: sep));
        Assert.Equal(16, ts.SampleRateHz);
        Assert.Equal(20, ts.Length);
        Assert.Equal(GpsTime.FromSeconds(1000000000m), ts.Start);
        Assert.Equal(Math.Sin(3), ts.Samples[3], 15);
    }

    [Fact]
    public void Round_trip_through_the_writer_keeps_times_and_values()
    {
        var src = new TimeSeries(GpsTime.FromSeconds(1234567890.5m), 4096, Enumerable.Range(0, 100).Select(i => Math.Cos(i) * 1e-21).ToArray());
        var sw = new StringWriter();
        StrainTextWriter.Write(sw, src, ["site KX"]);
        var back = Read(sw.ToString());
        Assert.Equal(src.Start, back.Start);
        Assert.Equal(4096, back.SampleRateHz);
        Assert.Equal(src.Samples, back.Samples);
    }

    [Fact]
    public void Rounded_time_stamps_within_one_percent_are_accepted()
    {
        var text = "1.000 1\n1.333 2\n1.667 3\n2.000 4\n2.333 5\n2.667 6\n3.000 7";
        var ts = Read(text, 5);
        Assert.Equal(3, ts.SampleRateHz, 9);
    }

    [Theory]
    [InlineData("1 0\n2 0\n3 0\n4 x\n5 0\n6 0", 4, "not a number")]
    [InlineData("1 0\n2 0\n3 0 7\n4 0\n5 0\n6 0", 3, "two columns")]
    [InlineData("1 0\n2 0\n3 NaN\n4 0\n5 0\n6 0", 3, "NaN")]
    [InlineData("1 0\n2 0\n3 Infinity\n4 0\n5 0\n6 0", 3, "infinite")]
    [InlineData("1 0\n2 0\n2 0\n4 0\n5 0\n6 0", 3, "not after")]
    [InlineData("1 0\n2 0\n3 0\n4.5 0\n5 0\n6 0\n7 0", 4, "uniformly")]
    [InlineData("# c\nhead er\n1 0\n2 0\nbad 0\n4 0\n5 0", 5, "not a number")]
    public void Malformed_files_are_rejected_naming_the_first_bad_line(string text, int line, string fragment)
    {
        var ex = Assert.Throws<StrainFormatException>(() => Read(text, 5));
        Assert.Equal(line, ex.LineNumber);
        Assert.Contains($"line {line}:", ex.Message);
        Assert.Contains(fragment, ex.Message);
    }

    [Fact]
    public void Too_few_samples_are_rejected()
    {
        var ex = Assert.Throws<StrainFormatException>(() => Read(Good(n: 10)));
        Assert.Equal(0, ex.LineNumber);
        Assert.Contains("at least 16", ex.Message);
    }
}
