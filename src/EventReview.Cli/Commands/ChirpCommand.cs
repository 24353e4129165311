using System.CommandLine;
using System.Globalization;
using EventReview.Core.Signal.TimeFrequency;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview chirp</c>: the Q map of one site, its chirp track and leading-order chirp mass, with what the fit can and cannot tell
/// (the same Core code as the overlap check's maps). A measurement, not a check: it has no verdict.
/// </summary>
public static class ChirpCommand
{
    public static Command Build()
    {
        var a = new Option<string>("--a") { Description = "strain text file (gps_time value per line)", Required = true };
        var center = new Option<string>("--center") { Description = "candidate GPS time (decimal seconds)", Required = true };
        var before = new Option<double>("--before-s") { Description = "seconds of data before the centre to map", DefaultValueFactory = _ => 2 };
        var after = new Option<double>("--after-s") { Description = "seconds of data after the centre to map", DefaultValueFactory = _ => 0.2 };
        var svg = new Option<string?>("--svg") { Description = "write the Q map and its zoom on the last part of the signal as SVG files with this path prefix" };
        var json = new Option<bool>("--json") { Description = "write the result as JSON" };
        var command = new Command("chirp", "Multi-resolution Q map of one site, its ridge and leading-order chirp-mass fit, and what the fit can tell.");
        foreach (var o in new Option[] { a, center, before, after, svg, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parse =>
        {
            try
            {
                var c = StrainInput.Center(parse.GetValue(center)!);
                var strain = StrainInput.Read(parse.GetValue(a)!, "--a");
                var r = ChirpAnalysis.Run(strain, c, parse.GetValue(before), parse.GetValue(after));
                var fit = r.Fit;
                var loudest = r.Map.Loudest();
                if (parse.GetValue(svg) is { } prefix)
                {
                    File.WriteAllText(prefix + "-map.svg", Core.Plots.PlotSvg.Write(Core.Plots.Figures.QMapFigure.Build(r.Map, fit, "site")));
                    File.WriteAllText(prefix + "-zoom.svg", Core.Plots.PlotSvg.Write(Core.Plots.Figures.QMapFigure.Build(r.Zoom, fit, "site", "zoom on the last part of the signal")));
                }

                if (parse.GetValue(json))
                {
                    CliOutput.WriteJson(new
                    {
                        chirpMassMsun = fit.ChirpMassMsun,
                        chirpMassSigmaMsun = fit.ChirpMassSigmaMsun,
                        chirpLike = fit.ChirpLike,
                        reason = fit.Reason,
                        scope = fit.Scope,
                        trackPoints = fit.TrackTimesSeconds.Length,
                        loudest = new { powerOverMedian = loudest.Energy, timeSeconds = loudest.TimeSeconds, frequencyHz = loudest.FrequencyHz, q = loudest.Q },
                        qPlanes = r.Map.QPlanes,
                    });
                }
                else
                {
                    Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                        $"chirp mass {(fit.ChirpMassMsun is { } m ? m.ToString("F2", CultureInfo.InvariantCulture) : "n/a")} +- {(fit.ChirpMassSigmaMsun is { } s ? s.ToString("F2", CultureInfo.InvariantCulture) : "n/a")} solar masses; chirp-like: {(fit.ChirpLike ? "yes" : "no")} ({fit.Reason})"));
                    foreach (var line in fit.Scope ?? [])
                    {
                        Console.Out.WriteLine(line);
                    }
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
