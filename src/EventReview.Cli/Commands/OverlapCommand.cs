using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Overlap;

namespace EventReview.Cli.Commands;

/// <summary><c>eventreview overlap</c>: whitened waveform overlap of two sites after shift and sign flip.</summary>
public static class OverlapCommand
{
    public static Command Build()
    {
        var a = new Option<string>("--a") { Description = "strain text file of site A (gps_time value per line)", Required = true };
        var b = new Option<string>("--b") { Description = "strain text file of site B", Required = true };
        var center = new Option<string>("--center") { Description = "candidate GPS time (decimal seconds)", Required = true };
        var window = new Option<double>("--window-s") { Description = "correlation window length in seconds", DefaultValueFactory = _ => 0.2 };
        var maxLag = new Option<double>("--max-lag-ms") { Description = "largest |lag| searched in ms (light-travel time + tolerance)", DefaultValueFactory = _ => 12 };
        var band = new Option<string>("--band") { Description = "band-pass edges in Hz, low,high", DefaultValueFactory = _ => "30,350" };
        var psdSeg = new Option<double>("--psd-segment-s") { Description = "Welch PSD segment length in seconds", DefaultValueFactory = _ => 4 };
        var offsource = new Option<int>("--offsource") { Description = "number of off-source (time-slid) overlaps for a p-value", DefaultValueFactory = _ => 0 };
        var json = new Option<bool>("--json") { Description = "write the result as JSON" };
        var command = new Command("overlap", "Overlap of two sites' whitened waveforms after shift and sign flip (lag = arrival(A) - arrival(B)).");
        foreach (var o in new Option[] { a, b, center, window, maxLag, band, psdSeg, offsource, json })
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

                var sa = StrainInput.Read(parse.GetValue(a)!, "--a");
                var sb = StrainInput.Read(parse.GetValue(b)!, "--b");
                var options = new OverlapOptions(c, parse.GetValue(window), parse.GetValue(maxLag) / 1e3,
                    new ConditioningOptions(lo, hi, PsdSegmentSeconds: parse.GetValue(psdSeg)), n);
                var sw = Stopwatch.StartNew();
                var r = OverlapCheck.Run(sa, sb, options);
                double ms = sw.Elapsed.TotalMilliseconds;
                if (parse.GetValue(json))
                {
                    CliOutput.WriteJson(new
                    {
                        lagSeconds = r.RefinedLagSeconds,
                        sign = r.Sign,
                        overlap = r.Overlap,
                        pValue = r.PValue,
                        sampleRateHz = r.SampleRateHz,
                        elapsedMs = Math.Round(ms, 3),
                    });
                }
                else
                {
                    Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                        $"lag {r.RefinedLagSeconds * 1e3:F3} ms (arrival A - arrival B), sign {r.Sign:+0;-0}, overlap {r.Overlap:F3}, other sign {r.AlternativeOverlap:F3} at {r.AlternativeLagSeconds * 1e3:F3} ms, p {(r.PValue is { } p ? p.ToString("G3", CultureInfo.InvariantCulture) : "n/a")}, {r.SampleRateHz:G} Hz ({r.ResamplingNote}), {ms:F1} ms"));
                }

                return CliOutput.Success;
            }
            catch (Exception ex) when (ex is FormatException or ArgumentException or IOException)
            {
                return CliOutput.Fail(ex.Message);
            }
        });
        return command;
    }
}
