using System.Text.Json;
using EventReview.Cli.Commands;

namespace EventReview.Cli.Tests.Commands;

[Collection("Console")]
public class TimeCommandTests
{
    [Fact]
    public void Gps_of_the_leap_second_prints_second_60()
    {
        var (code, output, _) = TimingCommandTests.Invoke(TimeCommand.Build(), "time", "--gps", "1167264017");

        // ref (astropy, CHECKS.md): GPS 1167264017 is 2016-12-31T23:59:60 UTC.
        Assert.Equal(0, code);
        Assert.Contains("2016-12-31T23:59:60.000000Z (leap second)", output);
    }

    [Fact]
    public void Utc_to_gps_as_json()
    {
        var (code, output, _) = TimingCommandTests.Invoke(TimeCommand.Build(), "time", "--utc", "2011-09-14T01:46:25Z", "--json");

        // ref (astropy Time, format gps): 1000000000.
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(output);
        Assert.Equal("1000000000", doc.RootElement.GetProperty("gps").GetString());
        Assert.Equal(15, doc.RootElement.GetProperty("gpsMinusUtcSeconds").GetInt32());
    }

    [Fact]
    public void Both_or_neither_option_exits_2()
    {
        Assert.Equal(2, TimingCommandTests.Invoke(TimeCommand.Build(), "time").ExitCode);
        Assert.Equal(2, TimingCommandTests.Invoke(TimeCommand.Build(), "time", "--gps", "1", "--utc", "2017-01-01T00:00:00Z").ExitCode);
        Assert.Equal(2, TimingCommandTests.Invoke(TimeCommand.Build(), "time", "--gps", "abc").ExitCode);
    }

    [Fact]
    public void The_json_of_a_time_beyond_the_leap_second_table_carries_the_warning()
    {
        // GPS 1500000000 = 2027-07-19 (after the bundled table's expiry, 2027-06-28); an earlier time carries none of its own.
        var (code, output, _) = TimingCommandTests.Invoke(TimeCommand.Build(), "time", "--gps", "1500000000", "--json");
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(output);
        Assert.Contains(doc.RootElement.GetProperty("warnings").EnumerateArray(), w => w.GetString()!.Contains("leap-second table's expiry", StringComparison.Ordinal));

        var (_, early, _) = TimingCommandTests.Invoke(TimeCommand.Build(), "time", "--gps", "1000000000", "--json");
        using var earlyDoc = JsonDocument.Parse(early);
        Assert.DoesNotContain(earlyDoc.RootElement.GetProperty("warnings").EnumerateArray(), w => w.GetString()!.Contains("the instant", StringComparison.Ordinal));
    }
}
