using System.CommandLine;
using System.Globalization;
using EventReview.Core.Network;
using EventReview.Core.Time;
using EventReview.Core.Timing;
using EventReview.Core.Inputs;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview timing --network network.json --arrival CODE=GPS --arrival CODE=GPS [...] [--k-sigma 3] [--false-alarm-probability 2.7e-3]
/// [--antenna-pair A,B --observed-sign -1 --observed-ratio 0.8 [--ratio-tolerance 0.3]] [--json]</c>: the timing check kind, the same
/// Core entry point (<see cref="TimingReview"/>) and verdict as the app. Exit 0 consistent, 1 inconsistent (a negative result), 2 bad input.
/// </summary>
public static class TimingCommand
{
    public static Command Build()
    {
        var network = new Option<string>("--network") { Description = "Network file (JSON: name and sites with WGS-84 positions, arm azimuths, timing uncertainty)." };
        var arrivals = new Option<string[]>("--arrival") { Description = "Arrival at one site as CODE=GPS seconds (repeat for each site, at least two).", AllowMultipleArgumentsPerToken = false };
        var kSigma = new Option<double>("--k-sigma") { Description = "Multiplier k of the combined timing uncertainty in each pair's allowed window (default 3).", DefaultValueFactory = _ => 3.0 };
        var fap = new Option<double>("--false-alarm-probability") { Description = "Four or more sites: p-value of the sky-fit chi-square below which the arrivals are inconsistent (default 2.7e-3, the 3σ pair rule).", DefaultValueFactory = _ => TimingOptions.DefaultFalseAlarmProbability };
        var pair = new Option<string?>("--antenna-pair") { Description = "Antenna-response test: the two sites as A,B (with --observed-sign and --observed-ratio)." };
        var sign = new Option<int?>("--observed-sign") { Description = "Antenna-response test: +1 or -1, how B's waveform must be multiplied to match A's (e.g. from the overlap check)." };
        var ratio = new Option<double?>("--observed-ratio") { Description = "Antenna-response test: amplitude ratio |h_B| / |h_A|." };
        var tolerance = new Option<double>("--ratio-tolerance") { Description = "Antenna-response test: relative tolerance of the ratio (default 0.3).", DefaultValueFactory = _ => 0.3 };
        var json = new Option<bool>("--json") { Description = "Write the result as camelCase JSON." };
        var command = new Command("timing", "Check that arrival times at the sites fit one plane wave: pairs, sky rings, sky directions with their chi-square, antenna response.");
        foreach (var o in new Option[] { network, arrivals, kSigma, fap, pair, sign, ratio, tolerance, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parse =>
        {
            var pairText = parse.GetValue(pair);
            string? a = null, b = null;
            if (pairText is not null)
            {
                var parts = pairText.Split(',', StringSplitOptions.TrimEntries);
                if (parts.Length != 2 || parts.Any(p => p.Length == 0))
                {
                    return CliOutput.Fail($"--antenna-pair '{pairText}': expected two site codes as A,B.");
                }

                (a, b) = (parts[0].ToUpperInvariant(), parts[1].ToUpperInvariant());
            }

            var parameters = new TimingCheckParameters(parse.GetValue(kSigma), a, b, parse.GetValue(sign), parse.GetValue(ratio), parse.GetValue(tolerance), parse.GetValue(fap));
            if ((a ?? (object?)parse.GetValue(sign) ?? parse.GetValue(ratio)) is not null && !parameters.HasObservation)
            {
                return CliOutput.Fail("the antenna-response test needs --antenna-pair, --observed-sign and --observed-ratio together.");
            }

            return Run(parse.GetValue(network), parse.GetValue(arrivals) ?? [], parameters, parse.GetValue(json));
        });
        return command;
    }

    private static int Run(string? networkPath, string[] arrivalTexts, TimingCheckParameters parameters, bool json)
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

        TimingReviewResult result;
        try
        {
            result = TimingReview.Run(network.Sites, arrivals, parameters);
        }
        catch (ArgumentException ex)
        {
            return CliOutput.Fail(UserMessage.From(ex));
        }

        var t = result.Timing;
        var warnings = t.Warnings.Concat(LeapSecondWarnings.For(LeapSecondTable.Bundled, null, TimeProvider.System.GetUtcNow().UtcDateTime)).ToList();
        if (json)
        {
            CliOutput.WriteJson(new
            {
                verdict = result.Judgement!.Word,
                reason = result.Judgement.Reason,
                pairs = t.Pairs.Select(p => new
                {
                    p.A,
                    p.B,
                    p.BaselineMeters,
                    p.LightTravelSeconds,
                    p.CombinedSigmaSeconds,
                    p.AllowedSeconds,
                    p.ObservedSeconds,
                    p.MarginSeconds,
                    p.Consistent,
                    p.RingAngleDegrees,
                }),
                chi2 = t.Chi2,
                degreesOfFreedom = t.DegreesOfFreedom,
                pValue = t.PValue,
                pValueIsBound = t.PValueIsBound,
                falseAlarmProbability = t.FalseAlarmProbability,
                skyFrame = t.SkyFrame,
                sky = t.Sky.Select(s => new { s.RaDegrees, s.DecDegrees, s.ResidualSeconds, s.ChiSquare, s.IcrsOffsetDegrees }),
                skyNote = t.SkyNote,
                utc = t.Utc,
                gmstDegrees = t.GmstDegrees,
                antenna = result.Antenna is { } an ? new
                {
                    an.A,
                    an.B,
                    an.ObservedSign,
                    an.ObservedAmplitudeRatio,
                    an.RatioTolerance,
                    an.FractionAllowingSign,
                    an.FractionAllowingRatio,
                    an.FractionAllowingSignAndRatio,
                    an.MinExpectedRatio,
                    an.MaxExpectedRatio,
                } : null,
                summary = result.Summary,
                assumptions = t.Assumptions,
                warnings,
            });
        }
        else
        {
            WriteTable(network, result, warnings);
        }

        return result.Judgement!.Verdict == Core.Verdicts.Verdict.Consistent ? CliOutput.Success : CliOutput.Negative;
    }

    private static void WriteTable(NetworkDefinition network, TimingReviewResult review, IReadOnlyList<string> warnings)
    {
        var result = review.Timing;
        var o = Console.Out;
        var ci = CultureInfo.InvariantCulture;
        o.WriteLine(string.Create(ci, $"network {network.Name}; earliest arrival GPS {result.EarliestArrivalGps} = {result.Utc}; GMST {result.GmstDegrees:0.0000} deg; k = {result.KSigma:0.##}"));
        o.WriteLine(string.Create(ci, $"{"pair",-14}{"baseline km",12}{"light ms",10}{"sigma ms",10}{"allowed ms",12}{"observed ms",13}{"margin ms",11}{"ring deg",10}  within"));
        foreach (var p in result.Pairs)
        {
            var ring = p.RingAngleDegrees is { } r ? r.ToString("0.00", ci) : "outside";
            o.WriteLine(string.Create(ci, $"{p.A + "-" + p.B,-14}{p.BaselineMeters / 1e3,12:0.0}{p.LightTravelSeconds * 1e3,10:0.000}{p.CombinedSigmaSeconds * 1e3,10:0.000}{p.AllowedSeconds * 1e3,12:0.000}{p.ObservedSeconds * 1e3,13:0.000}{p.MarginSeconds * 1e3,11:0.000}{ring,10}  {(p.Consistent ? "yes" : "NO")}"));
        }

        foreach (var (s, i) in result.Sky.Select((s, i) => (s, i + 1)))
        {
            o.WriteLine(string.Create(ci, $"sky #{i}: RA {s.RaDegrees:0.000} deg, Dec {s.DecDegrees:0.000} deg ({result.SkyFrame}; {s.IcrsOffsetDegrees:0.00} deg from ICRS), RMS residual {s.ResidualSeconds * 1e3:0.000000} ms, chi2 {s.ChiSquare:0.##}"));
        }

        o.WriteLine("sky: " + result.SkyNote);
        if (review.Antenna is { } an)
        {
            o.WriteLine(string.Create(ci, $"antenna response {an.A}/{an.B}: sign {an.ObservedSign:+0;-0}, ratio {an.ObservedAmplitudeRatio:0.###} allowed on {an.FractionAllowingSignAndRatio:P0} of {an.DirectionCount} directions"));
        }

        foreach (var w in warnings)
        {
            o.WriteLine("warning: " + w);
        }

        o.WriteLine($"verdict: {review.Judgement!.Word} ({review.Judgement.Reason})");
    }
}
