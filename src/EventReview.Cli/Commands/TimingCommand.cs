using System.CommandLine;
using System.Globalization;
using EventReview.Core.Network;
using EventReview.Core.Time;
using EventReview.Core.Timing;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview timing --network network.json --arrival CODE=GPS --arrival CODE=GPS [...] [--k-sigma 3] [--json]</c>:
/// the cross-site timing check. Exit 0 consistent, 1 inconsistent (a negative result), 2 bad input.
/// </summary>
public static class TimingCommand
{
    public static Command Build()
    {
        var network = new Option<string>("--network") { Description = "Network file (JSON: name and sites with WGS-84 positions, arm azimuths, timing uncertainty)." };
        var arrivals = new Option<string[]>("--arrival") { Description = "Arrival at one site as CODE=GPS seconds (repeat for each site, at least two).", AllowMultipleArgumentsPerToken = false };
        var kSigma = new Option<double>("--k-sigma") { Description = "Multiplier k of the combined timing uncertainty in the allowed window (default 3).", DefaultValueFactory = _ => 3.0 };
        var json = new Option<bool>("--json") { Description = "Write the result as camelCase JSON." };
        var command = new Command("timing", "Check that arrival times at the sites fit one plane wave: pairs, sky rings and sky directions.");
        command.Options.Add(network);
        command.Options.Add(arrivals);
        command.Options.Add(kSigma);
        command.Options.Add(json);
        command.SetAction(parseResult => Run(parseResult.GetValue(network), parseResult.GetValue(arrivals) ?? [], parseResult.GetValue(kSigma), parseResult.GetValue(json)));
        return command;
    }

    private static int Run(string? networkPath, string[] arrivalTexts, double kSigma, bool json)
    {
        if (string.IsNullOrWhiteSpace(networkPath))
        {
            return CliOutput.Fail("--network: a network file is required.");
        }

        NetworkDefinition network;
        try
        {
            network = NetworkFile.Read(networkPath);
        }
        catch (Exception ex) when (ex is FormatException or IOException or UnauthorizedAccessException)
        {
            return CliOutput.Fail($"--network '{networkPath}': {ex.Message}");
        }

        var arrivals = new List<SiteArrival>();
        foreach (var text in arrivalTexts)
        {
            var parts = text.Split('=', 2);
            if (parts.Length != 2 || parts[0].Trim().Length == 0 || !GpsTime.TryParse(parts[1], out var gps))
            {
                return CliOutput.Fail($"--arrival '{text}': expected CODE=GPS seconds, e.g. KX=1400000000.123456");
            }

            arrivals.Add(new SiteArrival(parts[0].Trim(), gps));
        }

        TimingCheckResult result;
        try
        {
            result = TimingCheck.Run(network.Sites, arrivals, new TimingOptions(kSigma));
        }
        catch (ArgumentException ex)
        {
            return CliOutput.Fail(ex.Message.Split(" (Parameter", 2)[0]);
        }

        if (json)
        {
            CliOutput.WriteJson(new
            {
                pairs = result.Pairs.Select(p => new
                {
                    p.A,
                    p.B,
                    p.BaselineMeters,
                    p.LightTravelSeconds,
                    p.AllowedSeconds,
                    p.ObservedSeconds,
                    p.MarginSeconds,
                    p.Consistent,
                    p.RingAngleDegrees,
                }),
                sky = result.Sky.Select(s => new { s.RaDegrees, s.DecDegrees, s.ResidualSeconds }),
                utc = result.Utc,
                verdict = result.Verdict,
            });
        }
        else
        {
            WriteTable(network, result);
        }

        return result.Consistent ? CliOutput.Success : CliOutput.Negative;
    }

    private static void WriteTable(NetworkDefinition network, TimingCheckResult result)
    {
        var o = Console.Out;
        var ci = CultureInfo.InvariantCulture;
        o.WriteLine(string.Create(ci, $"network {network.Name}; earliest arrival GPS {result.EarliestArrivalGps} = {result.Utc}; GMST {result.GmstDegrees:0.0000} deg; k = {result.KSigma:0.##}"));
        o.WriteLine(string.Create(ci, $"{"pair",-14}{"baseline km",12}{"light ms",10}{"allowed ms",12}{"observed ms",13}{"margin ms",11}{"ring deg",10}  verdict"));
        foreach (var p in result.Pairs)
        {
            var ring = p.RingAngleDegrees is { } r ? r.ToString("0.00", ci) : "outside";
            o.WriteLine(string.Create(ci, $"{p.A + "-" + p.B,-14}{p.BaselineMeters / 1e3,12:0.0}{p.LightTravelSeconds * 1e3,10:0.000}{p.AllowedSeconds * 1e3,12:0.000}{p.ObservedSeconds * 1e3,13:0.000}{p.MarginSeconds * 1e3,11:0.000}{ring,10}  {(p.Consistent ? "consistent" : "INCONSISTENT")}"));
        }

        foreach (var (s, i) in result.Sky.Select((s, i) => (s, i + 1)))
        {
            o.WriteLine(string.Create(ci, $"sky #{i}: RA {s.RaDegrees:0.000} deg, Dec {s.DecDegrees:0.000} deg (mean-of-date), RMS residual {s.ResidualSeconds * 1e3:0.000000} ms"));
        }

        o.WriteLine("sky: " + result.SkyNote);
        foreach (var w in result.Warnings)
        {
            o.WriteLine("warning: " + w);
        }

        o.WriteLine("verdict: " + result.Verdict);
    }
}
