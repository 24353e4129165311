using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using EventReview.Core.Network;
using EventReview.Core.Signal.Io;
using EventReview.Core.Signal.Simulation;
using EventReview.Core.Time;
using EventReview.Core.Inputs;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview simulate</c>: simulated strain for every site of a network file (coloured Gaussian noise plus a projected
/// leading-order chirp), one text file per site and <c>truth.json</c> with what was injected. Deterministic for a seed.
/// </summary>
public static class SimulateCommand
{
    /// <summary>Default chirp mass of the simulated signal, solar masses: a value of our own, long enough in band for every check.</summary>
    public const double DefaultChirpMassMsun = 12;

    public static Command Build()
    {
        var network = new Option<string>("--network") { Description = "network file (JSON) with the sites to simulate", Required = true };
        var outDir = new Option<string>("--out") { Description = "output folder (created if missing)", Required = true };
        var seed = new Option<int>("--seed") { Description = "random seed: the same seed gives the same files", Required = true };
        var mass = new Option<double>("--chirp-mass") { Description = "chirp mass in solar masses (default 12, an invented mid-range value: about 3 s above 20 Hz)", DefaultValueFactory = _ => DefaultChirpMassMsun };
        var snr = new Option<double>("--snr") { Description = "network optimal SNR of the injected chirp", DefaultValueFactory = _ => 20 };
        var gps = new Option<string>("--gps") { Description = "GPS time of coalescence at the Earth's centre (decimal seconds)", DefaultValueFactory = _ => "1300000000" };
        var duration = new Option<double>("--duration-s") { Description = "length of each series in seconds, centred on --gps", DefaultValueFactory = _ => 32 };
        var rate = new Option<double>("--sample-rate") { Description = "sample rate in Hz", DefaultValueFactory = _ => 4096 };
        var ra = new Option<double?>("--ra") { Description = "right ascension of the source in degrees (default: drawn from the seed)" };
        var dec = new Option<double?>("--dec") { Description = "declination of the source in degrees (default: drawn from the seed)" };
        var psi = new Option<double?>("--psi") { Description = "polarisation angle in degrees (default: drawn from the seed)" };
        var inclination = new Option<double>("--inclination-deg") { Description = "inclination of the orbit in degrees (0 face-on, 90 edge-on: then every site sees the same waveform up to sign)", DefaultValueFactory = _ => 0 };
        var json = new Option<bool>("--json") { Description = "write the truth record to standard output as JSON" };
        var command = new Command("simulate", "Simulated strain for every site of a network: noise plus a projected chirp; one text file per site and truth.json.");
        foreach (var o in new Option[] { network, outDir, seed, mass, snr, gps, duration, rate, ra, dec, psi, inclination, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parse =>
        {
            try
            {
                var truth = Run(parse.GetValue(network)!, parse.GetValue(outDir)!, parse.GetValue(seed), parse.GetValue(mass), parse.GetValue(snr),
                    parse.GetValue(gps)!, parse.GetValue(duration), parse.GetValue(rate), parse.GetValue(ra), parse.GetValue(dec), parse.GetValue(psi), parse.GetValue(inclination));
                if (parse.GetValue(json))
                {
                    CliOutput.WriteJson(truth);
                }
                else
                {
                    Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                        $"wrote {truth.Sites.Count} strain files and truth.json to {parse.GetValue(outDir)}: chirp mass {truth.ChirpMassMsun:G} Msun, network SNR {truth.NetworkSnr:0.0}, RA {truth.RaDegrees:0.00} deg, Dec {truth.DecDegrees:0.00} deg (mean of date), psi {truth.PsiDegrees:0.0} deg"));
                    foreach (var w in truth.Warnings)
                    {
                        Console.Error.WriteLine("warning: " + w);
                    }
                }

                return CliOutput.Success;
            }
            catch (Exception ex) when (ex is FormatException or ArgumentException or IOException or UnauthorizedAccessException)
            {
                return CliOutput.Fail(UserMessage.From(ex));
            }
        });
        return command;
    }

    /// <summary>What <c>truth.json</c> holds.</summary>
    public sealed record Truth(
        string Network,
        int Seed,
        string CoalescenceGps,
        double RaDegrees,
        double DecDegrees,
        double PsiDegrees,
        double InclinationDegrees,
        double GmstDegrees,
        double? ChirpMassMsun,
        double NetworkSnr,
        double SampleRateHz,
        double DurationSeconds,
        IReadOnlyList<TruthSite> Sites,
        IReadOnlyList<string> Assumptions,
        IReadOnlyList<string> Warnings);

    /// <summary>One site in <c>truth.json</c>: file, arrival, delay from the Earth's centre, antenna response, sign, phase offset (rad) and amplitude.</summary>
    public sealed record TruthSite(string Code, string File, string ArrivalGps, double DelaySeconds, double FPlus, double FCross,
        int SignRelativeToFirst, double PhaseOffsetRad, double AmplitudeFactor, double Snr, double PeakStrain);

    private static Truth Run(string networkPath, string outDir, int seed, double chirpMass, double snr, string gpsText, double duration, double rate,
        double? ra, double? dec, double? psiDeg, double inclinationDeg)
    {
        Positive(chirpMass, "--chirp-mass", "solar masses");
        Positive(snr, "--snr", "");
        Positive(duration, "--duration-s", "seconds");
        Positive(rate, "--sample-rate", "Hz");
        if (ra is { } r && !(r >= 0 && r < 360))
        {
            throw new FormatException($"--ra {r} must be in [0, 360) degrees.");
        }

        if (dec is { } d && !(d >= -90 && d <= 90))
        {
            throw new FormatException($"--dec {d} must be in [-90, 90] degrees.");
        }

        if (psiDeg is { } p && !double.IsFinite(p))
        {
            throw new FormatException("--psi must be a finite number of degrees.");
        }

        if (!(inclinationDeg >= 0 && inclinationDeg <= 180))
        {
            throw new FormatException($"--inclination-deg {inclinationDeg.ToString(CultureInfo.InvariantCulture)} must be in [0, 180] degrees.");
        }

        if (!GpsTime.TryParse(gpsText, out var tc))
        {
            throw new FormatException($"--gps '{gpsText}' is not a GPS time in decimal seconds.");
        }

        if (!File.Exists(networkPath))
        {
            throw new FormatException($"--network file '{networkPath}' does not exist.");
        }

        var net = NetworkFile.Read(networkPath);

        // Sky position and polarisation drawn from the seed (isotropic: uniform RA, uniform sin(Dec); uniform psi), from a
        // generator of their own so the noise stays the same whatever is given by hand.
        var sky = new Random(unchecked(seed * 7919) ^ 0x5eed);
        double raDeg = ra ?? (360 * sky.NextDouble());
        double decDeg = dec ?? (Math.Asin((2 * sky.NextDouble()) - 1) * 180 / Math.PI);
        double psi = psiDeg is { } pd ? pd * Math.PI / 180 : Math.PI * sky.NextDouble();
        var utc = GpsUtc.ToUtc(tc);
        var gmst = Sidereal.GreenwichMeanSiderealDegrees(utc);
        var n = SkyFrame.ToEcef(raDeg, decDeg, gmst);
        var projections = NetworkProjection.Project(net.Sites, n, psi)
            .Select(x => new Core.Signal.Simulation.SiteProjection(x.Code, x.DelaySeconds, x.FPlus, x.FCross)).ToList();
        var options = new SimulationOptions(tc.AddSeconds(-duration / 2), duration, rate, seed, new ChirpParameters(chirpMass, InclinationRad: inclinationDeg * Math.PI / 180), tc, snr);
        var sim = NetworkSimulator.Simulate(projections, options);

        Directory.CreateDirectory(outDir);
        var sites = new List<TruthSite>();
        foreach (var s in sim.Sites)
        {
            var t = sim.Truth.Sites.First(x => x.Code == s.Code);
            var file = $"{s.Code}-strain.txt";
            StrainTextWriter.WriteFile(Path.Combine(outDir, file), s.Strain,
            [
                $"simulated strain of site {s.Code} (invented data), seed {seed}",
                string.Create(CultureInfo.InvariantCulture, $"injected chirp mass {chirpMass:G} Msun; site SNR {t.Snr:0.00}; arrival {t.ArrivalGps}"),
            ]);
            sites.Add(new TruthSite(s.Code, file, t.ArrivalGps, t.DelaySeconds, t.FPlus, t.FCross, t.SignRelativeToFirst, t.PhaseOffsetRad, t.AmplitudeFactor, t.Snr, t.PeakStrain));
        }

        var assumptions = sim.Truth.Assumptions.Concat(
        [
            "delays are relative to the coalescence time at the Earth's centre: arrival = --gps + delay",
            "signRelativeToFirst: the sign an overlap check should find for each site against the first site of the network file",
            string.Create(CultureInfo.InvariantCulture, $"sky direction: RA/Dec in the mean-of-date frame (not ICRS: at this date they differ from J2000 / ICRS by up to {Precession.OffsetDegrees(new EquatorialDirection(raDeg, decDeg), Precession.CenturiesSinceJ2000(utc.DateTimeUtc)):0.00}° for this direction) turned into Earth-fixed coordinates with Greenwich mean sidereal time (UTC used for UT1)"),
            string.Create(CultureInfo.InvariantCulture, $"inclination {inclinationDeg:G} deg, phase 0 at coalescence; unless edge-on (90 deg), sites with different F+/Fx ratios see waveforms that differ by a phase (phaseOffsetRad), not just a sign, which moves the best-overlap lag by up to a quarter cycle"),
        ]).ToList();
        var truth = new Truth(net.Name, seed, tc.ToString(), raDeg, decDeg, psi * 180 / Math.PI, inclinationDeg, gmst, sim.Truth.ChirpMassMsun, sim.Truth.NetworkSnr,
            rate, duration, sites, assumptions, LeapSecondWarnings.For(LeapSecondTable.Bundled, utc.DateTimeUtc, TimeProvider.System.GetUtcNow().UtcDateTime));
        File.WriteAllText(Path.Combine(outDir, "truth.json"), JsonSerializer.Serialize(truth, CliOutput.Json));
        return truth;
    }

    private static void Positive(double value, string name, string unit)
    {
        if (!(value > 0) || !double.IsFinite(value))
        {
            throw new FormatException($"{name} {value.ToString(CultureInfo.InvariantCulture)} must be a positive number{(unit.Length > 0 ? " of " + unit : string.Empty)}.");
        }
    }
}
