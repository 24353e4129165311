using System.CommandLine;
using System.Globalization;
using EventReview.Core.Signal.TimeFrequency;

namespace EventReview.Cli.Commands;

/// <summary><c>eventreview chirp</c>: chirp track and leading-order chirp mass of one site.</summary>
public static class ChirpCommand
{
    public static Command Build()
    {
        var a = new Option<string>("--a") { Description = "strain text file (gps_time value per line)", Required = true };
        var center = new Option<string>("--center") { Description = "candidate GPS time (decimal seconds)", Required = true };
        var before = new Option<double>("--before-s") { Description = "seconds of data before the centre to map", DefaultValueFactory = _ => 2 };
        var after = new Option<double>("--after-s") { Description = "seconds of data after the centre to map", DefaultValueFactory = _ => 0.2 };
        var json = new Option<bool>("--json") { Description = "write the result as JSON" };
        var command = new Command("chirp", "Time-frequency ridge of one site and its leading-order chirp-mass fit.");
        foreach (var o in new Option[] { a, center, before, after, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parse =>
        {
            try
            {
                var c = StrainInput.Center(parse.GetValue(center)!);
                var strain = StrainInput.Read(parse.GetValue(a)!, "--a");
                var (_, fit) = ChirpAnalysis.Run(strain, c, parse.GetValue(before), parse.GetValue(after));
                double? mc = fit.ChirpMassMsun;
                double? sigma = fit.ChirpMassSigmaMsun;
                if (parse.GetValue(json))
                {
                    CliOutput.WriteJson(new { chirpMassMsun = mc, chirpMassSigmaMsun = sigma, chirpLike = fit.ChirpLike });
                }
                else
                {
                    Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                        $"chirp mass {(mc is { } m ? m.ToString("F2", CultureInfo.InvariantCulture) : "n/a")} +- {(sigma is { } s ? s.ToString("F2", CultureInfo.InvariantCulture) : "n/a")} solar masses; chirp-like: {(fit.ChirpLike ? "yes" : "no")} ({fit.Reason})"));
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
