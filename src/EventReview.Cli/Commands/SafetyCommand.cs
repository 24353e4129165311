using System.CommandLine;
using System.Globalization;
using EventReview.Core.Environment;
using EventReview.Core.Injections;

namespace EventReview.Cli.Commands;

/// <summary><c>eventreview safety</c>: veto safety of every channel against performed hardware injections.</summary>
public static class SafetyCommand
{
    public static Command Build()
    {
        var triggers = new Option<string>("--triggers") { Description = "Triggers CSV: site,channel,gps_time,snr[,frequency_hz,duration_s].", Required = true };
        var injections = new Option<string>("--injections") { Description = "Injection log CSV: site,start_gps,end_gps,kind,waveform_ref,status.", Required = true };
        var window = new Option<double>("--window-s") { Description = "Coincidence half window, seconds.", Required = true };
        var threshold = new Option<double>("--threshold") { Description = "Unsafe below this Poisson probability.", DefaultValueFactory = _ => 1e-3 };
        var liveTime = new Option<double?>("--live-time-s") { Description = "Observation time for channel rates, seconds (default: span of each site's triggers)." };
        var json = new Option<bool>("--json") { Description = "Write the result as JSON." };
        var command = new Command("safety", "Test which channels respond to hardware injections (unsafe to use as vetoes).");
        foreach (var o in new Option[] { triggers, injections, window, threshold, liveTime, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parse => LocalCausesInput.Guard(() =>
        {
            var trig = LocalCausesInput.Read(parse.GetValue(triggers)!, "--triggers", r => AuxiliaryTriggerCsv.Parse(r, null));
            var log = LocalCausesInput.Read(parse.GetValue(injections)!, "--injections", r => InjectionLogCsv.Parse(r, null));
            var report = VetoSafety.Evaluate(trig, log, new VetoSafetyOptions(parse.GetValue(window), parse.GetValue(threshold), parse.GetValue(liveTime)));
            if (parse.GetValue(json))
            {
                CliOutput.WriteJson(report);
                return CliOutput.Success;
            }

            foreach (var c in report.Channels)
            {
                Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"{c.Site} {c.Channel}: {c.Coincident}/{c.Injections} coincident, expected {c.Expected:G3}, P {c.Probability:G3}, {(c.Safe is null ? "untested" : c.Safe.Value ? "safe" : "UNSAFE")}"));
            }

            return CliOutput.Success;
        }));
        return command;
    }
}
