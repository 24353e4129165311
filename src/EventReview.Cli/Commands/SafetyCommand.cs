using System.CommandLine;
using System.Globalization;
using EventReview.Core.Environment;
using EventReview.Core.Injections;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview safety</c>: veto safety of every channel against performed hardware injections (Core's <see cref="VetoSafety"/>:
/// the binomial statistic, the rate measured away from the injections, and the deadtime a veto would cost).
/// </summary>
public static class SafetyCommand
{
    public static Command Build()
    {
        var triggers = new Option<string>("--triggers") { Description = "Triggers CSV: site,channel,gps_time,snr[,frequency_hz,duration_s].", Required = true };
        var injections = new Option<string>("--injections") { Description = "Injection log CSV: site,start_gps,end_gps,kind,waveform_ref,status.", Required = true };
        var window = new Option<double>("--window-s") { Description = "Coincidence half window w around each injection's span, seconds.", Required = true };
        var threshold = new Option<double>("--threshold") { Description = "Unsafe below this binomial tail probability P(K >= coincident).", DefaultValueFactory = _ => 1e-3 };
        var liveTime = new Option<double?>("--live-time-s") { Description = "Observation time for channel rates, seconds (default: span of each site's triggers)." };
        var vetoWindow = new Option<double?>("--veto-window-s") { Description = "Half window a veto would remove around each trigger, for the deadtime (default: --window-s)." };
        var json = new Option<bool>("--json") { Description = "Write the result as JSON (channels[].safe, binomialProbability, chanceProbabilityPerInjection, verdict)." };
        var command = new Command("safety", "Test which channels respond to hardware injections (unsafe to use as vetoes), with the deadtime each veto would cost.");
        foreach (var o in new Option[] { triggers, injections, window, threshold, liveTime, vetoWindow, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parse => LocalCausesInput.Guard(() =>
        {
            var trig = LocalCausesInput.Read(parse.GetValue(triggers)!, "--triggers", r => AuxiliaryTriggerCsv.Parse(r, null));
            var log = LocalCausesInput.Read(parse.GetValue(injections)!, "--injections", r => InjectionLogCsv.Parse(r, null));
            var report = VetoSafety.Evaluate(trig, log, new VetoSafetyOptions(parse.GetValue(window), parse.GetValue(threshold), parse.GetValue(liveTime), parse.GetValue(vetoWindow)));
            if (parse.GetValue(json))
            {
                CliOutput.WriteJsonWithVerdicts(report);
                return CliOutput.Success;
            }

            foreach (var c in report.Channels)
            {
                Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"{ChannelName.Qualified(c.Site, c.Channel)}: {c.Coincident}/{c.Injections} coincident, expected {c.Expected:G3} (q {c.ChanceProbabilityPerInjection:G3}, R {c.RateHz:G3} Hz away from injections), binomial P {c.BinomialProbability:G3}, deadtime {c.DeadtimeSeconds:G4} s ({c.DeadtimeFraction:P2}): {c.Judgement.Word}"));
            }

            Console.Out.WriteLine($"verdict: {report.Judgement.Word} ({report.Judgement.Reason})");
            return CliOutput.Success;
        }));
        return command;
    }
}
