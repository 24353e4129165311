using EventReview.Core.Signal;
using EventReview.Core.Signal.Simulation;
using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Tests.Signal.Simulation;

public class NetworkSimulatorTests
{
    [Fact]
    public void The_same_seed_gives_the_same_data_and_another_seed_does_not()
    {
        var a = SimulatedPair.Make(7, duration: 8);
        var b = SimulatedPair.Make(7, duration: 8);
        var c = SimulatedPair.Make(8, duration: 8);
        Assert.Equal(a.Sites[1].Strain.Samples, b.Sites[1].Strain.Samples);
        Assert.NotEqual(a.Sites[1].Strain.Samples, c.Sites[1].Strain.Samples);
    }

    [Fact]
    public void Simulated_noise_has_the_requested_psd()
    {
        var shape = new AsdShape();
        var x = NoiseSimulator.Generate(shape.Evaluate, 4096, 1 << 18, new Random(3));
        var psd = Welch.Estimate(x, 4096, new WelchOptions(4096));
        // identity: the Welch PSD of noise made from S(f) is S(f) within the scatter of 127 averaged segments (~9 % per bin, averaged over 50 bins)
        foreach (var f in new[] { 50.0, 150, 400, 1000 })
        {
            int k = (int)f;
            double mean = psd.Values.Skip(k - 25).Take(50).Average();
            double expected = Enumerable.Range(k - 25, 50).Average(j => Math.Pow(shape.Evaluate(j), 2));
            Assert.Equal(1.0, mean / expected, 0.05);
        }
    }

    [Fact]
    public void Signal_is_scaled_to_the_requested_network_snr_and_truth_is_reported()
    {
        var sim = SimulatedPair.Make(1, snr: 25, duration: 16);
        // definition: network SNR = sqrt(sum of site SNR^2)
        Assert.Equal(25, sim.Truth.NetworkSnr, 1e-9);
        var k1 = sim.Truth.Sites[0];
        var mv = sim.Truth.Sites[1];
        Assert.Equal(1, k1.SignRelativeToFirst);
        Assert.Equal(-1, mv.SignRelativeToFirst);
        Assert.Equal(SimulatedPair.Coalescence().AddSeconds(0.0124).ToString(), mv.ArrivalGps);
        // the realised SNR, recomputed from the noiseless signal, is the reported one
        var clean = NetworkSimulator.Simulate(SimulatedPair.Sites, new SimulationOptions(SimulatedPair.Start, 16, 4096, 1, new ChirpParameters(8, InclinationRad: 0.3), null, 25, AddNoise: false));
        double snr = SignalToNoise.Optimal(clean.Sites[0].Strain.Samples, 4096, new AsdShape().Evaluate, 10);
        Assert.Equal(k1.Snr, snr, 1e-9);
    }

    [Fact]
    public void A_glitch_on_an_unknown_site_is_refused()
    {
        var g = new GlitchSpec("ZZ", SimulatedPair.Start.AddSeconds(1), GlitchKind.ShortSymmetric, 100, 1, 1e-21);
        Assert.Throws<ArgumentException>(() => NetworkSimulator.Simulate(SimulatedPair.Sites, new SimulationOptions(SimulatedPair.Start, Glitches: [g])));
    }
}
