using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using EventReview.Core.Significance;
using EventReview.Core.Time;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview background</c>: time-slide background of a candidate seen by two or three sites, with the same Core code and
/// verdict as the app (<see cref="BackgroundCheck"/>): every pair, and for three sites the three-site background with a window
/// per pair and the joint significance. The verdict is the significance band; bounds are marked.
/// </summary>
public static class BackgroundCommand
{
    /// <summary>
    /// The JSON written with --json. The headline figures are the pair's for two sites and the joint ones for three; the pairs,
    /// the triple and the joint figure are given in full besides.
    /// </summary>
    public sealed record Output(
        string Verdict,
        string Reason,
        string SignificanceBand,
        int Slides,
        double BackgroundSeconds,
        long BackgroundCoincidences,
        long Louder,
        double FarHz,
        bool FarIsBound,
        double? FarBoundConfidence,
        double Fap,
        bool FapIsBound,
        double Sigma,
        bool SigmaIsBound,
        double? SlidePValue,
        bool SlidePValueIsFloor,
        IReadOnlyList<BackgroundPairOutcome> Pairs,
        TripleBackgroundResult? Triple,
        JointSignificanceResult? Joint,
        IReadOnlyList<string> Notes,
        string? CandidateUtc,
        LeapSecondNotice? LeapSeconds,
        long ElapsedMs);

    public static Command Build()
    {
        var triggers = new Option<string[]>("--triggers") { Description = "Trigger list of one site as CODE=FILE (CSV: gps_time,snr[,chirp_mass,frequency_hz]); give it for two or three sites (the first by code stays fixed)." };
        var segments = new Option<string[]>("--segments") { Description = "Analysed time of one site as CODE=FILE (CSV: start_gps,end_gps); once per site." };
        var window = new Option<double?>("--window-ms") { Description = "Coincidence window in ms for every pair (default: each pair's light-travel time from --network plus --tolerance-ms)." };
        var network = new Option<string?>("--network") { Description = "Network file: each pair's window is its light-travel time plus --tolerance-ms." };
        var tolerance = new Option<double>("--tolerance-ms") { Description = "Timing tolerance added to each light-travel time, ms.", DefaultValueFactory = _ => 5.0 };
        var step = new Option<double?>("--step-s") { Description = "Slide step in s (at least 10 × every window)." };
        var slides = new Option<int?>("--slides") { Description = "K: slides k = ±1..±K (2K slides)." };
        var candidate = new Option<double?>("--candidate-stat") { Description = "Ranking statistic of the candidate: the pair's network SNR for two sites, the three-site network SNR for three (default: the zero-lag coincidence nearest --candidate-time)." };
        var candidateTime = new Option<string?>("--candidate-time") { Description = "Candidate GPS time: its zero-lag coincidence is the one nearest to it (default: the loudest)." };
        var remove = new Option<bool>("--remove-candidate-triggers") { Description = "Also report the figures without any background coincidence that uses one of the candidate's own triggers." };
        var observing = new Option<double?>("--observing-time-s") { Description = "Observing time for the false-alarm probability, in s (default: zero-lag coincident analysed time)." };
        var chirp = new Option<double?>("--chirp-mass-tolerance") { Description = "Optional relative chirp-mass agreement cut (e.g. 0.1)." };
        var json = new Option<bool>("--json") { Description = "Write the result as JSON (verdict, significanceBand, fapIsBound, pairs, triple, joint)." };
        var command = new Command("background", "Time-slide background: FAR, false-alarm probability and sigma of a two- or three-site candidate, and its significance band.");
        foreach (var o in new Option[] { triggers, segments, window, network, tolerance, step, slides, candidate, candidateTime, remove, observing, chirp, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parseResult => LocalCausesInput.Guard(() =>
        {
            var watch = Stopwatch.StartNew();
            var trig = LocalCausesInput.CodeFiles(parseResult.GetValue(triggers), "--triggers");
            var segs = LocalCausesInput.CodeFiles(parseResult.GetValue(segments), "--segments");
            if (trig.Count is not (2 or 3))
            {
                return CliOutput.Fail($"--triggers must be given for two or three sites (got {trig.Count}).");
            }

            var sites = new Dictionary<string, SiteTriggers>(StringComparer.Ordinal);
            foreach (var (code, file) in trig)
            {
                var seg = segs.FirstOrDefault(s => s.Code == code);
                if (seg.File is null)
                {
                    return CliOutput.Fail($"--segments is missing for site {code}.");
                }

                sites[code] = SiteTriggers.Create(code, TriggerCsv.Load(file), SegmentCsv.Load(seg.File).Segments);
            }

            var windowMs = parseResult.GetValue(window);
            var net = parseResult.GetValue(network) is { } netPath ? LocalCausesInput.Network(netPath, "--network") : null;
            if (windowMs is null && net is null)
            {
                return CliOutput.Fail("give --window-ms, or --network to derive each pair's window from its light-travel time.");
            }

            var stepS = parseResult.GetValue(step) ?? throw new ArgumentException("--step-s is required.");
            var k = parseResult.GetValue(slides) ?? throw new ArgumentException("--slides is required.");
            var stat = parseResult.GetValue(candidate);
            if ((windowMs is { } w && !(w >= 0)) || !(stepS > 0) || (stat is { } x && !double.IsFinite(x)))
            {
                return CliOutput.Fail("--window-ms must be >= 0, --step-s > 0 and --candidate-stat finite.");
            }

            GpsTime? t0 = parseResult.GetValue(candidateTime) is { } ct ? LocalCausesInput.Gps(ct, "--candidate-time") : null;
            var codes = sites.Keys.Order(StringComparer.Ordinal).ToList();
            var plans = BackgroundPlanner.Pairs(codes, code => net?.Sites.FirstOrDefault(s => string.Equals(s.Code, code, StringComparison.OrdinalIgnoreCase)),
                windowMs, parseResult.GetValue(tolerance), _ => null, codes.Count == 2 ? stat : null);
            var settings = new BackgroundCheckSettings
            {
                StepSeconds = stepS,
                Slides = k,
                ObservingTimeSeconds = parseResult.GetValue(observing),
                ChirpMassRelativeTolerance = parseResult.GetValue(chirp),
                RemoveCandidateTriggers = parseResult.GetValue(remove),
                CandidateTime = t0,
                TripleStatistic = codes.Count == 3 ? stat : null,
                TripleStatisticRule = codes.Count == 3 && stat is not null ? "given (--candidate-stat)" : "the zero-lag triple nearest the candidate time",
            };
            var check = BackgroundCheck.Run(sites, plans, settings);
            var leap = t0 is { } t ? LocalCausesInput.Leap(t) : null;
            var output = Summarise(check, leap, watch.ElapsedMilliseconds);
            if (parseResult.GetValue(json))
            {
                CliOutput.WriteJsonWithVerdicts(output);
            }
            else
            {
                if (leap is not null)
                {
                    LocalCausesInput.WarnLeap(leap);
                }

                Console.Out.WriteLine(SignificanceText.Summary(check, stepS));
                foreach (var a in check.Method)
                {
                    Console.Out.WriteLine("  " + a);
                }

                Console.Out.WriteLine($"verdict: {check.Judgement.Word} ({check.Judgement.Reason}) ({output.ElapsedMs} ms)");
            }

            return CliOutput.Success;
        }));
        return command;
    }

    private static Output Summarise(BackgroundCheckResult check, LeapSecondNotice? leap, long elapsedMs)
    {
        var j = check.Judgement;
        if (check.Joint is { } joint && check.Triple is { } t)
        {
            var f = joint.Figures;
            return new Output(j.Word, j.Reason, SignificanceBand.Word(f.Sigma, f.SigmaIsBound), t.Slides, t.BackgroundSeconds, t.Figures.BackgroundCoincidences, f.Louder,
                f.FarHz, f.FarIsBound, f.BoundConfidence, f.Fap, f.FapIsBound, f.Sigma, f.SigmaIsBound, t.SlidePValue, t.SlidePValueIsFloor,
                check.Pairs, t, joint, check.Notes, leap?.Utc, leap, elapsedMs);
        }

        var r = check.Pairs[check.HeadlinePair].Result;
        return new Output(j.Word, j.Reason, SignificanceBand.Word(r.Sigma, r.SigmaIsBound), r.Slides, r.BackgroundSeconds, r.BackgroundCoincidences, r.Louder,
            r.FarHz, r.FarIsBound, r.FarBoundConfidence, r.Fap, r.FapIsBound, r.Sigma, r.SigmaIsBound, r.SlidePValue, r.SlidePValueIsFloor,
            check.Pairs, check.Triple, null, check.Notes, leap?.Utc, leap, elapsedMs);
    }
}
