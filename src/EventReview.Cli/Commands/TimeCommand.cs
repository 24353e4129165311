using System.CommandLine;
using EventReview.Core.Time;
using EventReview.Core.Inputs;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview time --gps X</c> or <c>eventreview time --utc T</c> [--json]: GPS &lt;-&gt; UTC with the bundled leap-second table,
/// showing a leap second as 23:59:60. A stale table or an instant beyond its expiry gives a warning on stderr (exit still 0).
/// </summary>
public static class TimeCommand
{
    public static Command Build()
    {
        var gps = new Option<string>("--gps") { Description = "GPS seconds (decimal, up to nanoseconds)." };
        var utc = new Option<string>("--utc") { Description = "UTC as ISO 8601, e.g. 2017-01-01T00:00:00Z (23:59:60 allowed on a leap-second day)." };
        var json = new Option<bool>("--json") { Description = "Write the result as camelCase JSON." };
        var command = new Command("time", "Convert between GPS seconds and UTC (leap seconds from the bundled table).");
        command.Options.Add(gps);
        command.Options.Add(utc);
        command.Options.Add(json);
        command.SetAction(parseResult => Run(parseResult.GetValue(gps), parseResult.GetValue(utc), parseResult.GetValue(json)));
        return command;
    }

    private static int Run(string? gpsText, string? utcText, bool json)
    {
        if ((gpsText is null) == (utcText is null))
        {
            return CliOutput.Fail("give exactly one of --gps or --utc.");
        }

        var table = LeapSecondTable.Bundled;
        GpsTime gps;
        UtcInstant utc;
        if (gpsText is not null)
        {
            if (!GpsTime.TryParse(gpsText, out gps))
            {
                return CliOutput.Fail($"--gps '{gpsText}': expected decimal GPS seconds.");
            }

            utc = GpsUtc.ToUtc(gps, table);
        }
        else
        {
            if (!UtcInstant.TryParse(utcText, out utc))
            {
                return CliOutput.Fail($"--utc '{utcText}': expected an ISO 8601 UTC date-time such as 2017-01-01T00:00:00Z.");
            }

            try
            {
                gps = GpsUtc.FromUtc(utc, table);
            }
            catch (ArgumentException ex)
            {
                return CliOutput.Fail($"--utc '{utcText}': {UserMessage.From(ex)}");
            }
        }

        var offset = table.EntryAtUtc(utc.DateTimeUtc).GpsMinusUtcSeconds;
        var stale = table.IsStale(TimeProvider.System.GetUtcNow().UtcDateTime);
        var beyond = !table.Covers(utc.DateTimeUtc);
        var warnings = LeapSecondWarnings.For(table, utc.DateTimeUtc, TimeProvider.System.GetUtcNow().UtcDateTime);
        if (json)
        {
            CliOutput.WriteJson(new
            {
                gps = gps.ToString(),
                utc = utc.ToString(6),
                isLeapSecond = utc.IsLeapSecond,
                gpsMinusUtcSeconds = offset,
                gmstDegrees = Sidereal.GreenwichMeanSiderealDegrees(utc),
                leapSecondTableExpires = table.ExpiresUtc.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture),
                leapSecondTableStale = stale,
                beyondTableExpiry = beyond,
                gmstFrame = "mean sidereal time (IAU 1982, Meeus eq. 12.4), UTC taken as UT1: GMST, not apparent sidereal time",
                warnings,
            });
        }
        else
        {
            Console.Out.WriteLine($"GPS {gps} = UTC {utc.ToString(6)}{(utc.IsLeapSecond ? " (leap second)" : string.Empty)}; GPS - UTC = {offset} s");
        }

        foreach (var w in warnings)
        {
            Console.Error.WriteLine("warning: " + w);
        }

        return CliOutput.Success;
    }
}
