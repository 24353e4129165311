using System.CommandLine;
using System.Globalization;
using EventReview.Core.Environment;
using EventReview.Core.Injections;
using EventReview.Core.Signal;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview environment</c>: environment and veto lookup around a candidate, with the same Core code and verdict as the app
/// (<see cref="EnvironmentLookup"/>, <see cref="VetoSafety"/>, <see cref="CouplingEstimate"/>).
/// </summary>
public static class EnvironmentCommand
{
    /// <summary>Cross-site window used when neither --light-travel-s nor --network is given, seconds (continental-baseline rule of thumb).</summary>
    public const double DefaultLightTravelSeconds = 0.01;

    public static Command Build()
    {
        var caseGps = new Option<string>("--case-gps") { Description = "Case GPS time (decimal seconds); used for sites without an arrival.", Required = true };
        var arrival = new Option<string[]>("--arrival") { Description = "Site arrival time CODE=GPS (repeat per site)." };
        var segments = new Option<string>("--segments") { Description = "Data-quality segments CSV: site,flag,start_gps,end_gps[,comment].", Required = true };
        var triggers = new Option<string>("--triggers") { Description = "Triggers CSV: site,channel,gps_time,snr[,frequency_hz,duration_s].", Required = true };
        var inventory = new Option<string?>("--inventory") { Description = "Sensor inventory CSV: site,channel,kind,location[,coupling_file,data_file]; the files it names are read from its folder." };
        var injections = new Option<string?>("--injections") { Description = "Injection log CSV; channels that respond to performed injections (binomial test, coincidence within --window-s) are marked unsafe." };
        var observing = new Option<string?>("--observing") { Description = "Observing (analysable data) segments CSV, same columns as --segments; hits outside them are reported." };
        var sites = new Option<string?>("--sites") { Description = "Comma-separated known site codes; rows naming other sites are rejected." };
        var window = new Option<double>("--window-s") { Description = "Half window around each arrival, seconds.", DefaultValueFactory = _ => 1.0 };
        var rateWindow = new Option<double>("--rate-window-s") { Description = "Window for channel trigger rates, seconds.", DefaultValueFactory = _ => 3600.0 };
        var network = new Option<string?>("--network") { Description = "Network file: the cross-site window is the largest light-travel time between the sites (unless --light-travel-s is given)." };
        var lightTravel = new Option<double?>("--light-travel-s") { Description = $"Cross-site coincidence window, seconds (overrides --network; default {DefaultLightTravelSeconds} without a network)." };
        var strain = new Option<string[]>("--strain") { Description = "Strain text file of a site, CODE=FILE (gps_time value per line): the candidate's strain amplitude there is read from it (repeat per site)." };
        var candidateStrain = new Option<double?>("--candidate-strain") { Description = "Typed candidate strain amplitude, for sites without --strain (no coupling estimate without either)." };
        var sensorNoise = new Option<double?>("--sensor-noise") { Description = "Typed sensor noise amplitude (RMS in the band, sensor units), for sensors without a data file." };
        var bandLow = new Option<double>("--coupling-band-low") { Description = "Lower edge of the candidate's band, Hz.", DefaultValueFactory = _ => 20.0 };
        var bandHigh = new Option<double>("--coupling-band-high") { Description = "Upper edge of the candidate's band, Hz.", DefaultValueFactory = _ => 500.0 };
        var fraction = new Option<double>("--coupling-fraction") { Description = "Flag a coupling at this fraction of the candidate's strain (common-practice margin).", DefaultValueFactory = _ => 0.1 };
        var json = new Option<bool>("--json") { Description = "Write the result as JSON." };
        var command = new Command("environment", "Look up environmental and auxiliary triggers and data-quality segments around a candidate.");
        foreach (var o in new Option[] { caseGps, arrival, segments, triggers, inventory, injections, observing, sites, window, rateWindow, network, lightTravel, strain, candidateStrain, sensorNoise, bandLow, bandHigh, fraction, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parse => LocalCausesInput.Guard(() =>
        {
            var known = parse.GetValue(sites) is { } s ? s.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries).Select(c => c.ToUpperInvariant()).ToArray() : null;
            var t0 = LocalCausesInput.Gps(parse.GetValue(caseGps)!, "--case-gps");
            var arrivals = LocalCausesInput.Arrivals(parse.GetValue(arrival));
            var seg = LocalCausesInput.Read(parse.GetValue(segments)!, "--segments", r => DataQualitySegmentCsv.Parse(r, known));
            var trig = LocalCausesInput.Read(parse.GetValue(triggers)!, "--triggers", r => AuxiliaryTriggerCsv.Parse(r, known));
            var inventoryPath = parse.GetValue(inventory);
            var sensors = inventoryPath is { } inv ? LocalCausesInput.Read(inv, "--inventory", r => SensorInventoryCsv.Parse(r, known)) : [];
            var w = parse.GetValue(window);
            VetoSafetyReport? safety = null;
            if (parse.GetValue(injections) is { } inj)
            {
                var log = LocalCausesInput.Read(inj, "--injections", r => InjectionLogCsv.Parse(r, known));
                safety = VetoSafety.Evaluate(trig, log, new VetoSafetyOptions(WindowSeconds: w));
            }

            var obs = parse.GetValue(observing) is { } op ? LocalCausesInput.Read(op, "--observing", r => DataQualitySegmentCsv.Parse(r, known)).Segments : null;
            var siteList = (known ?? []).Concat(arrivals.Keys).Concat(seg.Segments.Select(x => x.Site)).Concat(trig.Select(x => x.Site)).Distinct().ToList();
            var (light, lightSource) = parse.GetValue(network) is { } netPath && parse.GetValue(lightTravel) is null
                ? CrossSiteWindow.Choose(LocalCausesInput.Network(netPath, "--network").Sites, siteList, null)
                : parse.GetValue(lightTravel) is { } given ? (given, "given") : (DefaultLightTravelSeconds, "default (a continental-baseline rule of thumb; give --network or --light-travel-s)");
            var notes = new List<string>();
            var folder = Path.GetDirectoryName(Path.GetFullPath(inventoryPath ?? ".")) ?? ".";
            var couplingFunctions = new Dictionary<string, FrequencyTable>(StringComparer.Ordinal);
            var sensorData = new Dictionary<string, TimeSeries>(StringComparer.Ordinal);
            foreach (var sensor in sensors)
            {
                var key = ChannelName.Qualified(sensor.Site, sensor.Channel);
                if (sensor.CouplingFile is { } cf)
                {
                    couplingFunctions[key] = LocalCausesInput.Read(Path.Combine(folder, cf), $"--inventory coupling file of {key}", r => FrequencyTable.Parse(r, "coupling"));
                }

                if (sensor.DataFile is { } df)
                {
                    sensorData[key] = LocalCausesInput.Series(Path.Combine(folder, df), $"--inventory data file of {key}");
                }
            }

            var strainBySite = LocalCausesInput.CodeFiles(parse.GetValue(strain), "--strain").ToDictionary(p => p.Code, p => LocalCausesInput.Series(p.File, $"--strain {p.Code}"));
            CouplingOptions? coupling = null;
            if (parse.GetValue(candidateStrain) is not null || strainBySite.Count > 0)
            {
                var typed = new CouplingOptions(parse.GetValue(candidateStrain), parse.GetValue(bandLow), parse.GetValue(bandHigh), parse.GetValue(fraction), parse.GetValue(sensorNoise));
                (coupling, var read) = CouplingMeasurement.FromData(typed, strainBySite, sensorData, site => arrivals.TryGetValue(site, out var a) ? a : t0);
                notes.AddRange(read);
            }
            else if (couplingFunctions.Count > 0)
            {
                notes.Add("coupling functions found but neither --candidate-strain nor --strain was given: coupling not estimated");
            }

            var input = new EnvironmentLookupInput(t0, arrivals, siteList, seg.Segments, trig, sensors, safety, couplingFunctions.Count > 0 ? couplingFunctions : null, obs);
            var report = EnvironmentLookup.Run(input, new EnvironmentLookupOptions(w, null, parse.GetValue(rateWindow), light, coupling));
            var leap = LocalCausesInput.Leap(t0);
            if (parse.GetValue(json))
            {
                CliOutput.WriteJsonWithVerdicts(new
                {
                    report.Hits,
                    report.Segments,
                    report.Judgement,
                    report.Coincidences,
                    report.Sites,
                    ImportNotes = seg.Notes,
                    report.Warnings,
                    report.Assumptions,
                    Safety = safety,
                    LightTravelSeconds = light,
                    LightTravelSource = lightSource,
                    Notes = notes,
                    CaseUtc = leap.Utc,
                    LeapSeconds = leap,
                });
                return CliOutput.Success;
            }

            LocalCausesInput.WarnLeap(leap);
            foreach (var note in seg.Notes.Concat(report.Warnings).Concat(notes))
            {
                Console.Out.WriteLine("note: " + note);
            }

            Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture, $"case GPS {t0} = UTC {leap.Utc}; cross-site window {light * 1e3:0.###} ms ({lightSource})"));
            foreach (var h in report.Hits)
            {
                Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"hit {ChannelName.Qualified(h.Site, h.Channel)} [{h.Kind}] offset {h.OffsetSeconds:+0.0000;-0.0000} s SNR {h.Snr:G4} chance {h.ChanceProbability:G3} safe {(h.Safe is null ? "unknown" : h.Safe.Value ? "yes" : "no")}{(h.CouplingRatio is { } cr ? $" coupling {cr:P1} ({h.CouplingInputs})" : string.Empty)}"));
            }

            foreach (var sg in report.Segments)
            {
                Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture, $"segment {sg.Site} {sg.Flag} [{sg.StartGps}, {sg.EndGps})"));
            }

            foreach (var v in report.Sites)
            {
                Console.Out.WriteLine($"site {v.Site}: {v.Judgement.Word}");
            }

            Console.Out.WriteLine($"verdict: {report.Judgement.Word} ({report.Judgement.Reason})");
            return CliOutput.Success;
        }));
        return command;
    }
}
