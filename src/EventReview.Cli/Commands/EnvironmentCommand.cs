using System.CommandLine;
using System.Globalization;
using EventReview.Core.Environment;
using EventReview.Core.Injections;

namespace EventReview.Cli.Commands;

/// <summary><c>eventreview environment</c>: environment and veto lookup around a candidate.</summary>
public static class EnvironmentCommand
{
    public static Command Build()
    {
        var caseGps = new Option<string>("--case-gps") { Description = "Case GPS time (decimal seconds); used for sites without an arrival.", Required = true };
        var arrival = new Option<string[]>("--arrival") { Description = "Site arrival time CODE=GPS (repeat per site)." };
        var segments = new Option<string>("--segments") { Description = "Data-quality segments CSV: site,flag,start_gps,end_gps[,comment].", Required = true };
        var triggers = new Option<string>("--triggers") { Description = "Triggers CSV: site,channel,gps_time,snr[,frequency_hz,duration_s].", Required = true };
        var inventory = new Option<string?>("--inventory") { Description = "Sensor inventory CSV: site,channel,kind,location[,coupling_file]." };
        var injections = new Option<string?>("--injections") { Description = "Injection log CSV; channels that respond to performed injections (coincidence within --window-s) are marked unsafe." };
        var observing = new Option<string?>("--observing") { Description = "Observing (analysable data) segments CSV, same columns as --segments; hits outside them are reported." };
        var sites = new Option<string?>("--sites") { Description = "Comma-separated known site codes; rows naming other sites are rejected." };
        var window = new Option<double>("--window-s") { Description = "Half window around each arrival, seconds.", DefaultValueFactory = _ => 1.0 };
        var rateWindow = new Option<double>("--rate-window-s") { Description = "Window for channel trigger rates, seconds.", DefaultValueFactory = _ => 3600.0 };
        var lightTravel = new Option<double>("--light-travel-s") { Description = "Cross-site coincidence window, seconds.", DefaultValueFactory = _ => 0.01 };
        var json = new Option<bool>("--json") { Description = "Write the result as JSON." };
        var command = new Command("environment", "Look up environmental and auxiliary triggers and data-quality segments around a candidate.");
        foreach (var o in new Option[] { caseGps, arrival, segments, triggers, inventory, injections, observing, sites, window, rateWindow, lightTravel, json })
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
            var sensors = parse.GetValue(inventory) is { } inv ? LocalCausesInput.Read(inv, "--inventory", r => SensorInventoryCsv.Parse(r, known)) : [];
            var w = parse.GetValue(window);
            VetoSafetyReport? safety = null;
            if (parse.GetValue(injections) is { } inj)
            {
                var log = LocalCausesInput.Read(inj, "--injections", r => InjectionLogCsv.Parse(r, known));
                safety = VetoSafety.Evaluate(trig, log, new VetoSafetyOptions(WindowSeconds: w));
            }

            var obs = parse.GetValue(observing) is { } op ? LocalCausesInput.Read(op, "--observing", r => DataQualitySegmentCsv.Parse(r, known)).Segments : null;
            var siteList = (known ?? []).Concat(seg.Segments.Select(x => x.Site)).Concat(trig.Select(x => x.Site)).Distinct().ToList();
            var input = new EnvironmentLookupInput(t0, arrivals, siteList, seg.Segments, trig, sensors, safety, ObservingSegments: obs);
            var report = EnvironmentLookup.Run(input, new EnvironmentLookupOptions(w, null, parse.GetValue(rateWindow), parse.GetValue(lightTravel)));
            if (parse.GetValue(json))
            {
                CliOutput.WriteJson(new { report.Hits, report.Segments, report.Verdict, report.Coincidences, report.Sites, ImportNotes = seg.Notes, report.Warnings, report.Assumptions });
                return CliOutput.Success;
            }

            foreach (var note in seg.Notes.Concat(report.Warnings))
            {
                Console.Out.WriteLine("note: " + note);
            }

            foreach (var h in report.Hits)
            {
                Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"hit {h.Site} {h.Channel} [{h.Kind}] offset {h.OffsetSeconds:+0.0000;-0.0000} s SNR {h.Snr:G4} chance {h.ChanceProbability:G3} safe {(h.Safe is null ? "unknown" : h.Safe.Value ? "yes" : "no")}"));
            }

            foreach (var sg in report.Segments)
            {
                Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture, $"segment {sg.Site} {sg.Flag} [{sg.StartGps}, {sg.EndGps})"));
            }

            foreach (var v in report.Sites)
            {
                Console.Out.WriteLine($"site {v.Site}: {v.Verdict}");
            }

            Console.Out.WriteLine("verdict: " + report.Verdict);
            return CliOutput.Success;
        }));
        return command;
    }
}
