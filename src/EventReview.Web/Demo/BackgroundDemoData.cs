using System.Globalization;
using System.Text;
using EventReview.Core.Time;

namespace EventReview.Web.Demo;

/// <summary>
/// Simulated single-site trigger lists and analysed-time segments for the demo background check: per site a Poisson
/// stream of noise triggers (SNR 5.5 + exponential tail, plus a rare population of louder glitches) over a few days,
/// a few segments with gaps, and the candidate's own trigger at its arrival time. Fixed seeds: the same lists every time
/// (relative to the candidate's time).
/// </summary>
public static class BackgroundDemoData
{
    /// <summary>Noise trigger rate per site in Hz.</summary>
    public const double RateHz = 0.015;

    /// <summary>SNR threshold of the simulated search.</summary>
    public const double Threshold = 5.5;

    /// <summary>One site's simulated files (CSV text).</summary>
    public sealed record SiteFiles(string Code, string TriggersCsv, string SegmentsCsv, int Triggers, int Segments);

    /// <summary>Simulates one site over [start, end) with the candidate's trigger at <paramref name="arrival"/> (SNR <paramref name="arrivalSnr"/>).</summary>
    public static SiteFiles Simulate(string code, int seed, GpsTime start, GpsTime end, GpsTime arrival, double arrivalSnr)
    {
        var rng = new Random(seed);
        var spanS = (end.Nanoseconds - start.Nanoseconds) / 1e9;

        // three gaps of 20-180 min, never within 15 min of the candidate
        var gaps = new List<(double From, double To)>();
        var arrivalS = (arrival.Nanoseconds - start.Nanoseconds) / 1e9;
        while (gaps.Count < 3)
        {
            var from = rng.NextDouble() * spanS * 0.95;
            var to = Math.Min(spanS, from + (60 * (20 + (160 * rng.NextDouble()))));
            if (to < arrivalS - 900 || from > arrivalS + 900)
            {
                if (!gaps.Any(g => from < g.To + 600 && to > g.From - 600))
                {
                    gaps.Add((Math.Round(from), Math.Round(to)));
                }
            }
        }

        gaps.Sort();
        var segments = new StringBuilder("# simulated analysed time (demo), half-open [start, end)\nstart_gps,end_gps\n");
        var cursor = 0.0;
        foreach (var (from, to) in gaps.Append((Math.Round(spanS), Math.Round(spanS))))
        {
            if (from > cursor)
            {
                segments.Append(Gps(start, cursor)).Append(',').Append(Gps(start, from)).Append('\n');
            }

            cursor = to;
        }

        // noise triggers over the whole span (the search ran in the gaps too: those triggers are dropped by the check)
        var triggers = new StringBuilder("# simulated single-site triggers (demo): Poisson noise, SNR 5.5 + exponential tail, rare louder glitches\ngps_time,snr,chirp_mass\n");
        var count = 0;
        var t = 0.0;
        while (true)
        {
            t += -Math.Log(1 - rng.NextDouble()) / RateHz;
            if (t >= spanS)
            {
                break;
            }

            var glitch = rng.NextDouble() < 0.003;
            var snr = Threshold - ((glitch ? 2.5 : 0.9) * Math.Log(1 - rng.NextDouble()));
            var mc = 1.0 + (30 * rng.NextDouble());
            triggers.Append(Gps(start, t)).Append(',').Append(snr.ToString("F3", CultureInfo.InvariantCulture)).Append(',')
                .Append(mc.ToString("F2", CultureInfo.InvariantCulture)).Append('\n');
            count++;
        }

        // the candidate's own trigger, at its arrival time
        triggers.Append(Gps(arrival)).Append(',').Append(arrivalSnr.ToString("F3", CultureInfo.InvariantCulture)).Append(",12.40\n");
        return new SiteFiles(code, triggers.ToString(), segments.ToString(), count + 1, gaps.Count + 1);
    }

    private static string Gps(GpsTime start, double offsetSeconds) => Gps(new GpsTime(start.Nanoseconds + (long)Math.Round(offsetSeconds * 1e6) * 1000));

    private static string Gps(GpsTime t) => string.Create(CultureInfo.InvariantCulture, $"{t.Nanoseconds / 1_000_000_000}.{t.Nanoseconds % 1_000_000_000:D9}");
}
