using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using EventReview.Core.Network;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Overlap;
using EventReview.Core.Timing;
using EventReview.Core.Inputs;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview overlap</c>: the overlap check kind on two strain files, with the same Core entry point (<see cref="OverlapReview"/>)
/// and verdict as the app. The searched and allowed lag comes from <c>--network</c> and the two site codes (light-travel time +
/// k σ), or from <c>--max-lag-ms</c> given by hand; there is no fixed default. Exit 0 consistent, 1 concern or inconsistent, 2 bad input.
/// </summary>
public static class OverlapCommand
{
    public static Command Build()
    {
        var a = new Option<string>("--a") { Description = "strain text file of site A (gps_time value per line)", Required = true };
        var b = new Option<string>("--b") { Description = "strain text file of site B", Required = true };
        var center = new Option<string>("--center") { Description = "candidate GPS time (decimal seconds)", Required = true };
        var network = new Option<string?>("--network") { Description = "network file (JSON); with --site-a and --site-b it sets the lag limit to light-travel time + k sigma" };
        var siteA = new Option<string?>("--site-a") { Description = "site code of A in the network file" };
        var siteB = new Option<string?>("--site-b") { Description = "site code of B in the network file" };
        var kSigma = new Option<double>("--k-sigma") { Description = "k in the lag limit (light-travel + k x combined timing uncertainty), default 3", DefaultValueFactory = _ => 3 };
        var maxLag = new Option<double?>("--max-lag-ms") { Description = "largest |lag| searched and allowed, ms, given by hand (overrides --network)" };
        var window = new Option<double>("--window-s") { Description = "correlation window length in seconds", DefaultValueFactory = _ => 0.2 };
        var band = new Option<string>("--band") { Description = string.Create(CultureInfo.InvariantCulture, $"band-pass edges in Hz, low,high (default {ConditioningOptions.DefaultLowHz},{ConditioningOptions.DefaultHighHz})"), DefaultValueFactory = _ => string.Create(CultureInfo.InvariantCulture, $"{ConditioningOptions.DefaultLowHz},{ConditioningOptions.DefaultHighHz}") };
        var psdSeg = new Option<double>("--psd-segment-s") { Description = "Welch PSD segment length in seconds", DefaultValueFactory = _ => 4 };
        var offsource = new Option<int>("--offsource") { Description = "number of off-source (time-slid) overlaps for a p-value", DefaultValueFactory = _ => 0 };
        var threshold = new Option<double>("--overlap-threshold") { Description = "smallest overlap called consistent (our default 0.5)", DefaultValueFactory = _ => 0.5 };
        var json = new Option<bool>("--json") { Description = "write the result as JSON" };
        var command = new Command("overlap", "Overlap of two sites' whitened waveforms after shift and phase (lag = arrival(A) - arrival(B)), with its uncertainty and verdict.");
        foreach (var o in new Option[] { a, b, center, network, siteA, siteB, kSigma, maxLag, window, band, psdSeg, offsource, threshold, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parse =>
        {
            try
            {
                var c = StrainInput.Center(parse.GetValue(center)!);
                var (lo, hi) = StrainInput.Band(parse.GetValue(band)!);
                int n = parse.GetValue(offsource);
                if (n < 0)
                {
                    throw new FormatException("--offsource must not be negative.");
                }

                var (codeA, codeB, allowed, rule) = LagLimit(parse.GetValue(network), parse.GetValue(siteA), parse.GetValue(siteB), parse.GetValue(kSigma), parse.GetValue(maxLag));
                var sa = StrainInput.Read(parse.GetValue(a)!, "--a");
                var sb = StrainInput.Read(parse.GetValue(b)!, "--b");
                var options = new OverlapReviewOptions(c, parse.GetValue(window), allowed, rule,
                    new ConditioningOptions(lo, hi, PsdSegmentSeconds: parse.GetValue(psdSeg)), n, parse.GetValue(threshold));
                var sw = Stopwatch.StartNew();
                var r = OverlapReview.Run(new OverlapReviewSite(codeA, Path.GetFileName(parse.GetValue(a)!), sa), new OverlapReviewSite(codeB, Path.GetFileName(parse.GetValue(b)!), sb), options);
                double ms = sw.Elapsed.TotalMilliseconds;
                var o = r.Overlap;
                if (parse.GetValue(json))
                {
                    CliOutput.WriteJson(new
                    {
                        verdict = r.Judgement!.Word,
                        reason = r.Judgement.Reason,
                        lagSeconds = o.RefinedLagSeconds,
                        lagUncertaintySeconds = o.LagUncertaintySeconds,
                        phaseRadians = o.PhaseRadians,
                        phaseUncertaintyRadians = o.PhaseUncertaintyRadians,
                        sign = o.Sign,
                        signDetermined = o.SignDetermined,
                        atSearchEdge = o.AtSearchEdge,
                        overlap = o.Overlap,
                        pValue = o.PValue,
                        maxLagSeconds = o.MaxLagSeconds,
                        allowedLagRule = r.AllowedLagRule,
                        sampleRateHz = o.SampleRateHz,
                        chirp = r.Maps.Select(m => new { site = m.Site, chirpMassMsun = m.Fit?.ChirpMassMsun, chirpMassSigmaMsun = m.Fit?.ChirpMassSigmaMsun, chirpLike = m.Fit?.ChirpLike, scope = m.Fit?.Scope, error = m.Error }),
                        warnings = o.Warnings,
                        summary = r.Summary,
                        elapsedMs = Math.Round(ms, 3),
                    });
                }
                else
                {
                    Console.Out.WriteLine(r.Summary);
                    foreach (var w in o.Warnings ?? [])
                    {
                        Console.Out.WriteLine("warning: " + w);
                    }

                    Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture, $"verdict: {r.Judgement!.Word} ({r.Judgement.Reason}); {o.SampleRateHz:G} Hz ({o.ResamplingNote}), {ms:F1} ms"));
                }

                return r.Judgement.Verdict == Core.Verdicts.Verdict.Consistent ? CliOutput.Success : CliOutput.Negative;
            }
            catch (Exception ex) when (ex is FormatException or ArgumentException or IOException)
            {
                return CliOutput.Fail(UserMessage.From(ex));
            }
        });
        return command;
    }

    /// <summary>The sites' codes and the lag limit: by hand when --max-lag-ms is given, else from the network's pair window.</summary>
    private static (string A, string B, double AllowedSeconds, string Rule) LagLimit(string? networkPath, string? a, string? b, double k, double? maxLagMs)
    {
        if (maxLagMs is { } ms)
        {
            if (!double.IsFinite(ms) || ms < 0 || ms > 1000)
            {
                throw new FormatException("--max-lag-ms must be between 0 and 1000 ms.");
            }

            return (a ?? "A", b ?? "B", ms / 1e3, string.Create(CultureInfo.InvariantCulture, $"given by hand: ±{ms:0.###} ms"));
        }

        if (networkPath is null || a is null || b is null)
        {
            throw new FormatException("give --network with --site-a and --site-b (the lag limit is the pair's light-travel time plus its timing tolerance), or --max-lag-ms by hand.");
        }

        var net = NetworkFile.Read(networkPath);
        Site Find(string code, string option) => net.Sites.FirstOrDefault(s => string.Equals(s.Code, code, StringComparison.OrdinalIgnoreCase))
            ?? throw new FormatException($"{option} '{code}' is not in the network (it has: {string.Join(", ", net.Sites.Select(s => s.Code))}).");
        var window = PairWindow.For(Find(a, "--site-a"), Find(b, "--site-b"), k);
        return (window.A, window.B, window.AllowedSeconds, window.Rule);
    }
}
