using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using EventReview.Core.Significance;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview background</c>: time-slide background of a two-site candidate, its false-alarm rate,
/// probability and sigma.
/// </summary>
public static class BackgroundCommand
{
    /// <summary>The JSON written with --json.</summary>
    public sealed record Output(int Slides, double BackgroundSeconds, long BackgroundCoincidences, long Louder, double FarHz, bool FarIsBound, double Fap, double Sigma, long ElapsedMs);

    public static Command Build()
    {
        var triggers = new Option<string[]>("--triggers") { Description = "Trigger list of one site as CODE=FILE (CSV: gps_time,snr[,chirp_mass,frequency_hz]); give it once per site, the second site slides.", AllowMultipleArgumentsPerToken = false };
        var segments = new Option<string[]>("--segments") { Description = "Analysed time of one site as CODE=FILE (CSV: start_gps,end_gps); once per site." };
        var window = new Option<double?>("--window-ms") { Description = "Coincidence window in ms (light-travel time plus tolerance)." };
        var step = new Option<double?>("--step-s") { Description = "Slide step in s (longer than twice the window)." };
        var slides = new Option<int?>("--slides") { Description = "K: slides k = ±1..±K (2K slides)." };
        var candidate = new Option<double?>("--candidate-stat") { Description = "Ranking statistic (network SNR) of the candidate." };
        var observing = new Option<double?>("--observing-time-s") { Description = "Observing time for the false-alarm probability, in s (default: zero-lag coincident analysed time)." };
        var chirp = new Option<double?>("--chirp-mass-tolerance") { Description = "Optional relative chirp-mass agreement cut (e.g. 0.1)." };
        var json = new Option<bool>("--json") { Description = "Write the result as JSON." };
        var command = new Command("background", "Time-slide background: FAR, false-alarm probability and sigma of a two-site candidate.");
        foreach (var o in new Option[] { triggers, segments, window, step, slides, candidate, observing, chirp, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parseResult =>
        {
            try
            {
                var watch = Stopwatch.StartNew();
                var trig = Pairs(parseResult.GetValue(triggers), "--triggers");
                var segs = Pairs(parseResult.GetValue(segments), "--segments");
                if (trig.Count != 2)
                {
                    return CliOutput.Fail($"--triggers must be given for exactly two sites (got {trig.Count}).");
                }

                var sites = new List<SiteTriggers>();
                foreach (var (code, file) in trig)
                {
                    var seg = segs.FirstOrDefault(s => string.Equals(s.Code, code, StringComparison.OrdinalIgnoreCase));
                    if (seg.File is null)
                    {
                        return CliOutput.Fail($"--segments is missing for site {code}.");
                    }

                    sites.Add(SiteTriggers.Create(code, TriggerCsv.Load(file), SegmentCsv.Load(seg.File).Segments));
                }

                var windowMs = Require(parseResult.GetValue(window), "--window-ms");
                var stepS = Require(parseResult.GetValue(step), "--step-s");
                var k = parseResult.GetValue(slides) ?? throw new ArgumentException("--slides is required.");
                var stat = Require(parseResult.GetValue(candidate), "--candidate-stat");
                if (!(windowMs >= 0) || !(stepS > 0) || !double.IsFinite(stat))
                {
                    return CliOutput.Fail("--window-ms must be >= 0, --step-s > 0 and --candidate-stat finite.");
                }

                var options = TimeSlideOptions.Create(windowMs, stepS, k) with
                {
                    CandidateStatistic = stat,
                    ObservingTimeSeconds = parseResult.GetValue(observing),
                    ChirpMassRelativeTolerance = parseResult.GetValue(chirp),
                };
                var result = TimeSlideBackground.Run(sites[0], sites[1], options);
                var output = new Output(result.Slides, result.BackgroundSeconds, result.BackgroundCoincidences, result.Louder, result.FarHz, result.FarIsBound, result.Fap, result.Sigma, watch.ElapsedMilliseconds);
                if (parseResult.GetValue(json))
                {
                    CliOutput.WriteJson(output);
                }
                else
                {
                    WriteText(result, output);
                }

                return CliOutput.Success;
            }
            catch (Exception ex) when (ex is FormatException or ArgumentException or IOException or UnauthorizedAccessException)
            {
                return CliOutput.Fail(ex.Message);
            }
        });
        return command;
    }

    private static double Require(double? value, string name) => value ?? throw new ArgumentException($"{name} is required.");

    private static List<(string Code, string File)> Pairs(string[]? values, string option)
    {
        if (values is null || values.Length == 0)
        {
            throw new ArgumentException($"{option} is required (CODE=FILE, once per site).");
        }

        var list = new List<(string, string)>();
        foreach (var v in values)
        {
            var eq = v.IndexOf('=', StringComparison.Ordinal);
            if (eq <= 0 || eq == v.Length - 1)
            {
                throw new ArgumentException($"{option} expects CODE=FILE, got '{v}'.");
            }

            var code = v[..eq].Trim();
            if (list.Any(p => string.Equals(p.Item1, code, StringComparison.OrdinalIgnoreCase)))
            {
                throw new ArgumentException($"{option} names site {code} twice.");
            }

            list.Add((code, v[(eq + 1)..]));
        }

        return list;
    }

    private static void WriteText(BackgroundResult r, Output o)
    {
        var inv = CultureInfo.InvariantCulture;
        Console.Out.WriteLine(string.Create(inv, $"sites {r.SiteA} (fixed) and {r.SiteB} (sliding), {o.Slides} slides"));
        Console.Out.WriteLine(string.Create(inv, $"background time {o.BackgroundSeconds:G6} s, {o.BackgroundCoincidences} background coincidences, {o.Louder} at least as loud as {r.CandidateStatistic:G6}"));
        Console.Out.WriteLine(string.Create(inv, $"FAR {(o.FarIsBound ? "< " : string.Empty)}{o.FarHz:G4} Hz, FAP {o.Fap:G4} over {r.ObservingTimeSeconds:G6} s, {o.Sigma:F2} sigma ({o.ElapsedMs} ms)"));
        foreach (var a in r.Assumptions)
        {
            Console.Out.WriteLine("  " + a);
        }
    }
}
