using EventReview.Core.Signal.Simulation;
using EventReview.Core.Signal.TimeFrequency;

namespace EventReview.Core.Tests.Signal.TimeFrequency;

public class ChirpTrackTests
{
    [Theory]
    [InlineData(8.0, 1)]
    [InlineData(8.0, 2)]
    [InlineData(15.0, 3)]
    [InlineData(8.0, 5)] // a column whose loudest tile is noise at ~400 Hz sits on this track: the fit must leave it out
    public void Chirp_mass_of_a_simulated_chirp_is_recovered_within_ten_percent(double mc, int seed)
    {
        var sim = SimulatedPair.Make(seed, snr: 40, chirpMass: mc);
        var r = ChirpAnalysis.Run(SimulatedPair.A(sim), SimulatedPair.Coalescence(), 2, 0.2);
        Assert.True(r.Fit.ChirpLike, r.Fit.Reason);
        // truth from the simulator; 10 % as asked by the issue
        Assert.True(Math.Abs(r.Fit.ChirpMassMsun!.Value - mc) <= 0.1 * mc, $"fitted {r.Fit.ChirpMassMsun} +- {r.Fit.ChirpMassSigmaMsun}");
        Assert.True(r.Fit.ChirpMassSigmaMsun > 0);
        Assert.Equal(r.Map.TimesSeconds.Length, r.Map.Energy.Length);
        Assert.True(r.Zoom.TimesSeconds[0] >= r.Map.TimesSeconds[0] - 0.01 && r.Zoom.TimesSeconds[^1] <= r.Map.TimesSeconds[^1] + 0.01);
        Assert.Contains(r.Fit.Scope!, s => s.StartsWith("can tell", StringComparison.Ordinal));
        Assert.DoesNotContain(r.Fit.Scope!, s => s.StartsWith("high chirp mass", StringComparison.Ordinal));
    }

    [Fact]
    public void A_high_mass_chirp_is_short_in_band_and_the_fit_says_what_it_cannot_tell()
    {
        // Invented heavy system: chirp mass 45 (above the 30 solar-mass limit of the issue) spends well under a second above 20 Hz.
        var sim = SimulatedPair.Make(4, snr: 60, chirpMass: 45);
        var r = ChirpAnalysis.Run(SimulatedPair.A(sim), SimulatedPair.Coalescence(), 1, 0.2);

        var scope = string.Join(" | ", r.Fit.Scope!);
        if (r.Fit.ChirpLike)
        {
            Assert.True(r.Fit.ChirpMassMsun > 30, scope);
            Assert.Contains("high chirp mass", scope);
            Assert.Contains("indicative only", scope);
        }
        else
        {
            Assert.Contains("no chirp", scope);
        }

        Assert.Contains(r.Fit.Scope!, s => s.StartsWith("can", StringComparison.Ordinal) || s.StartsWith("no chirp", StringComparison.Ordinal));
    }

    [Fact]
    public void A_sine_gaussian_glitch_is_not_chirp_like()
    {
        var start = SimulatedPair.Start;
        var glitch = new GlitchSpec("KX", start.AddSeconds(8), GlitchKind.SineGaussian, 120, 20, 3e-21);
        var sim = NetworkSimulator.Simulate(SimulatedPair.Sites, new SimulationOptions(start, 16, 4096, 4, null, null, null, Glitches: [glitch]));
        var r = ChirpAnalysis.Run(sim.Sites[0].Strain, start.AddSeconds(8), 1, 0.5);
        Assert.False(r.Fit.ChirpLike);
        Assert.False(string.IsNullOrWhiteSpace(r.Fit.Reason));
    }

    [Fact]
    public void Noise_alone_is_not_chirp_like()
    {
        var sim = SimulatedPair.Make(6, snr: 0);
        var r = ChirpAnalysis.Run(SimulatedPair.A(sim), SimulatedPair.Coalescence(), 2, 0.2);
        Assert.False(r.Fit.ChirpLike, r.Fit.Reason);
        // results are stored as JSON: no NaN may reach the serialiser
        System.Text.Json.JsonSerializer.Serialize(r.Fit);
    }
}
