using System.Globalization;
using System.Numerics;
using System.Text;
using EventReview.Core.Chain;
using EventReview.Core.Environment;
using EventReview.Core.Injections;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Filters;
using EventReview.Core.Signal.Io;
using EventReview.Core.Time;

namespace EventReview.Web.Demo;

/// <summary>
/// Invented input files for the local-causes checks (environment, injections, data chain): background triggers of a
/// few channels per site at fixed rates, data-quality segments away from the candidate, a sensor inventory with one
/// coupling function, an injection log with performed injections (to which each site's actuator readback responds), an
/// optional coincident magnetic and mains disturbance at one site with the magnetometer's own series, and one data-chain
/// stage whose residual is its quantisation noise.
/// Deterministic for a given seed.
/// </summary>
public static class LocalCausesDemoFiles
{
    /// <summary>The disturbed site's magnetometer (channel name after the site code, see <see cref="ChannelName"/>).</summary>
    public const string Magnetometer = "env/magnetometer-electronics-vault/x";

    /// <summary>The mains monitor that sees the same disturbance.</summary>
    private const string MainsMonitor = "env/mains-monitor-feed-a";

    /// <summary>Frequency of the demo sites' invented mains supply, Hz.</summary>
    private const double MainsHz = 50;

    /// <summary>Channels per site (names in our own scheme, after the site code): name, kind, location, background triggers per hour.</summary>
    private static readonly (string Channel, string Kind, string Location, double PerHour)[] Channels =
    [
        ("env/seismometer-central-hall-floor/z", "seismic", "central hall floor", 60),
        ("env/microphone-laser-room", "acoustic", "laser room", 18),
        (Magnetometer, "magnetic", "electronics vault", 12),
        (MainsMonitor, "power", "mains feed A", 6),
        ("env/anemometer-roof-mast", "weather", "roof mast", 20),
        ("inst/actuator-readback", "instrument", "actuator readback", 2),
    ];

    /// <summary>Offsets (s from the case time) of the performed hardware injections, all sites, 8 s each.</summary>
    private static readonly double[] InjectionOffsets = [-3300, -2500, -1700, -900, 1500];

    /// <summary>Name of the coupling function file the inventory names for the disturbed site's magnetometer.</summary>
    public static string CouplingFileName(string site) => $"coupling-{site}-magnetometer-electronics-vault-x.csv";

    /// <summary>Name of the magnetometer's own series the inventory names for the disturbed site (its noise is read from it).</summary>
    public static string SensorDataFileName(string site) => $"data-{site}-magnetometer-electronics-vault-x.txt";

    /// <summary>Data-quality segments: a few flags per site, none within a minute of the candidate; two overlapping rows (merged on import).</summary>
    public static string Segments(GpsTime t, IEnumerable<string> sites)
    {
        var sb = new StringBuilder("site,flag,start_gps,end_gps,comment\n");
        foreach (var s in sites)
        {
            sb.Append(Row(s, "calibration-tone-paused", t.AddSeconds(-5000), t.AddSeconds(-4700), "calibration tone paused for a measurement"));
            sb.Append(Row(s, "gusty-wind", t.AddSeconds(2000), t.AddSeconds(2600), "gusts above 15 m/s"));
            sb.Append(Row(s, "gusty-wind", t.AddSeconds(2500), t.AddSeconds(2900), "gusts continued"));
        }

        return sb.ToString();

        static string Row(string site, string flag, GpsTime a, GpsTime b, string comment) => $"{site},{flag},{a},{b},{comment}\n";
    }

    /// <summary>
    /// Triggers over ±1 h of the case time: Poisson background per channel (kept out of ±12 s of each site's arrival),
    /// the actuator readback at every performed injection, and, at <paramref name="disturbedSite"/>, a magnetic and a mains
    /// trigger 0.18 s before its arrival.
    /// </summary>
    public static string Triggers(GpsTime t, IReadOnlyDictionary<string, GpsTime> arrivals, string? disturbedSite, int seed)
    {
        var random = new Random(seed);
        var rows = new List<(GpsTime Time, string Line)>();
        foreach (var (site, arrival) in arrivals.OrderBy(a => a.Key, StringComparer.Ordinal))
        {
            foreach (var (channel, kind, _, perHour) in Channels)
            {
                if (kind == "instrument")
                {
                    foreach (var o in InjectionOffsets)
                    {
                        Add(site, channel, t.AddSeconds(o + 4 + random.NextDouble()), 25 + (10 * random.NextDouble()), 140);
                    }
                }

                for (var time = -3600.0; ; )
                {
                    time += -Math.Log(1 - random.NextDouble()) * 3600 / perHour; // exponential gaps: a Poisson stream
                    if (time > 3600)
                    {
                        break;
                    }

                    var at = t.AddSeconds(time);
                    if (Math.Abs(at.SecondsSince(arrival)) > 12)
                    {
                        Add(site, channel, at, 5.5 + (-Math.Log(1 - random.NextDouble()) * 3), 2 + (random.NextDouble() * 200));
                    }
                }
            }

            if (site == disturbedSite)
            {
                Add(site, Magnetometer, arrival.AddSeconds(-0.182), 23.5, 75);
                Add(site, MainsMonitor, arrival.AddSeconds(-0.176), 11.2, MainsHz);
            }
        }

        var sb = new StringBuilder("site,channel,gps_time,snr,frequency_hz,duration_s\n");
        foreach (var r in rows.OrderBy(r => r.Time))
        {
            sb.Append(r.Line);
        }

        return sb.ToString();

        void Add(string site, string channel, GpsTime at, double snr, double f) =>
            rows.Add((at, string.Create(CultureInfo.InvariantCulture, $"{site},{ChannelName.Qualified(site, channel)},{at.ToString(4)},{snr:0.00},{f:0.0},0.2\n")));
    }

    /// <summary>The sensor inventory; the magnetometer of <paramref name="couplingSite"/> names its coupling file.</summary>
    public static string Inventory(IEnumerable<string> sites, string? couplingSite)
    {
        var sb = new StringBuilder("site,channel,kind,location,coupling_file,data_file\n");
        foreach (var s in sites)
        {
            foreach (var (channel, kind, location, _) in Channels)
            {
                var ours = s == couplingSite && channel == Magnetometer;
                sb.Append(CultureInfo.InvariantCulture, $"{s},{ChannelName.Qualified(s, channel)},{kind},{location},{(ours ? CouplingFileName(s) : string.Empty)},{(ours ? SensorDataFileName(s) : string.Empty)}\n");
            }
        }

        return sb.ToString();
    }

    /// <summary>
    /// The disturbed site's magnetometer around the candidate: 32 s at 512 Hz of white noise of 1e-11 T RMS (fixed seed) with
    /// the disturbance that made its trigger, a 20 ms burst 0.182 s before the arrival. Text "gps_time value" per line.
    /// </summary>
    public static string MagnetometerSeries(GpsTime t, GpsTime arrival, int seed)
    {
        const double fs = 512;
        var start = new GpsTime(t.WholeSeconds * GpsTime.NanosecondsPerSecond).AddSeconds(-16);
        var random = new Random(seed);
        var x = new double[32 * (int)fs];
        var burst = arrival.AddSeconds(-0.182).SecondsSince(start);
        for (var i = 0; i < x.Length; i++)
        {
            var dt = (i / fs) - burst;
            x[i] = (1e-11 * Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble()))
                + (2.3e-10 * Math.Exp(-dt * dt / (2 * 0.01 * 0.01)) * Math.Sin(2 * Math.PI * 75 * dt));
        }

        using var w = new StringWriter(CultureInfo.InvariantCulture);
        StrainTextWriter.Write(w, new TimeSeries(start, fs, x), ["magnetometer, electronics vault, tesla (invented demo data)"]);
        return w.ToString();
    }

    /// <summary>An invented magnetic coupling function (strain per tesla), falling with frequency.</summary>
    public static string MagneticCoupling() =>
        "frequency_hz,coupling\n10,3e-12\n30,5e-13\n75,1.2e-13\n100,6e-14\n300,1e-14\n1000,3e-15\n";

    /// <summary>The injection log: five performed injections per site away from the candidate, one aborted and one scheduled later.</summary>
    public static string InjectionLog(GpsTime t, IEnumerable<string> sites)
    {
        var sb = new StringBuilder("site,start_gps,end_gps,kind,waveform_ref,status\n");
        foreach (var s in sites)
        {
            for (var i = 0; i < InjectionOffsets.Length; i++)
            {
                sb.Append(CultureInfo.InvariantCulture, $"{s},{t.AddSeconds(InjectionOffsets[i])},{t.AddSeconds(InjectionOffsets[i] + 8)},cbc,hw-cbc-{i + 1:00},performed\n");
            }

            sb.Append(CultureInfo.InvariantCulture, $"{s},{t.AddSeconds(2400)},{t.AddSeconds(2408)},burst,hw-burst-01,aborted\n");
            sb.Append(CultureInfo.InvariantCulture, $"{s},{t.AddSeconds(5400)},{t.AddSeconds(5408)},cbc,hw-cbc-06,scheduled\n");
        }

        return sb.ToString();
    }

    /// <summary>A blind-injection record (canonical bytes, no final newline) with one injection days before the candidate.</summary>
    public static byte[] BlindRecord(GpsTime t) => Encoding.UTF8.GetBytes(
        $"site,start_gps,end_gps,kind,waveform_ref,status\nSM,{t.AddSeconds(-3 * 86400 + 1234)},{t.AddSeconds(-3 * 86400 + 1246)},cbc,blind-07,performed");

    /// <summary>The stage model of the demo data chain: a two-pole low-pass at 100 Hz (Butterworth), unit DC gain, no delay.</summary>
    public static ChainStageModel StageModel()
    {
        var r = 100 / Math.Sqrt(2);
        return new ChainStageModel([], [new Complex(-r, r), new Complex(-r, -r)], Math.Pow(2 * Math.PI * 100, 2));
    }

    /// <summary>Quantisation step of the demo stage's recorded output.</summary>
    public const double QuantisationStep = 1e-4;

    /// <summary>
    /// The stage model as JSON in the chain model format, with the residual expected when nothing is wrong: the output's
    /// quantisation noise, step / sqrt 12 (Widrow's uniform-quantisation model).
    /// </summary>
    public static string StageModelJson()
    {
        var m = StageModel();
        var poles = string.Join(", ", m.PolesHz.Select(p => string.Create(CultureInfo.InvariantCulture, $"[{p.Real:R}, {p.Imaginary:R}]")));
        var noise = QuantisationStep / Math.Sqrt(12);
        return string.Create(CultureInfo.InvariantCulture, $"{{\"stages\": [{{\"zerosHz\": [], \"polesHz\": [{poles}], \"gain\": {m.Gain:R}, \"delaySeconds\": 0, \"prewarpHz\": null, \"expectedNoiseRms\": {noise:G6}}}]}}\n");
    }

    /// <summary>
    /// One stage over 32 s around the case time at 512 Hz: the input is white noise, the output is the stage filter applied to
    /// it and quantised to steps of 1e-4 (its residual is the quantisation noise). Returns the two files' text.
    /// </summary>
    public static (string Input, string Output) ChainStage(GpsTime t, int seed, Action<double[], double>? tamper = null)
    {
        const double fs = 512;
        var start = new GpsTime(t.WholeSeconds * GpsTime.NanosecondsPerSecond).AddSeconds(-16);
        var random = new Random(seed);
        var x = new double[32 * (int)fs];
        for (var i = 0; i < x.Length; i++)
        {
            x[i] = Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble()); // Box-Muller
        }

        var y = SosFilter.Apply(SecondOrderSections.FromZpk(DataChainCheck.Discretise(StageModel(), fs)), x);
        tamper?.Invoke(y, fs);
        for (var i = 0; i < y.Length; i++)
        {
            y[i] = Math.Round(y[i] / QuantisationStep) * QuantisationStep;
        }

        return (Write(new TimeSeries(start, fs, x), "stage 1 input (invented demo data)"), Write(new TimeSeries(start, fs, y), "stage 1 output (invented demo data)"));

        static string Write(TimeSeries s, string comment)
        {
            using var w = new StringWriter(CultureInfo.InvariantCulture);
            StrainTextWriter.Write(w, s, [comment]);
            return w.ToString();
        }
    }
}
