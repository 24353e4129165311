using System.Text.Json;
using EventReview.Core.Signal.Overlap;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Signal.Overlap;

public class OverlapCheckTests
{
    [Fact]
    public void Overlap_recovers_lag_and_sign_of_a_shifted_flipped_chirp_across_seeds()
    {
        for (int seed = 1; seed <= 12; seed++)
        {
            var sim = SimulatedPair.Make(seed, snr: 30);
            // chirp mass 8 (default of the builder): lag scatter ~0.5 sample rms at network SNR 30; heavier chirps scatter more
            var r = OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), new OverlapOptions(SimulatedPair.Coalescence()));
            // truth from the simulator: arrival(A) - arrival(B) = 0 - 7.1 ms, flip -1; tolerance one sample (1/4096 s)
            Assert.True(Math.Abs(r.RefinedLagSeconds - (-0.0071)) <= 1.0 / 4096, $"seed {seed}: lag {r.RefinedLagSeconds}");
            Assert.Equal(sim.Truth.Sites[1].SignRelativeToFirst, r.Sign);
            Assert.Equal(-1, r.Sign);
            Assert.True(r.Overlap > 0.3, $"seed {seed}: overlap {r.Overlap}");
        }
    }

    [Fact]
    public void Off_source_overlaps_give_a_small_p_value_for_a_loud_signal_and_serialise_to_json()
    {
        var sim = SimulatedPair.Make(3, snr: 40);
        var r = OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), new OverlapOptions(SimulatedPair.Coalescence(), OffSourceCount: 500));
        Assert.Equal(500, r.OffSourceOverlaps.Length);
        // empirical p-value (1 + #louder) / (1 + N): a loud coherent signal beats all time-slid noise windows
        Assert.Equal(1.0 / 501, r.PValue!.Value, 12);
        Assert.True(r.PlotA.Length <= 2000 && r.PlotA.Length == r.PlotB.Length);
        Assert.Equal(r.LagsSeconds.Length, r.Correlation.Length);
        Assert.True(r.LagsSeconds[0] < r.LagsSeconds[^1]);
        var json = JsonSerializer.Serialize(r, new JsonSerializerOptions(JsonSerializerDefaults.Web));
        Assert.Contains("\"refinedLagSeconds\"", json);
    }

    [Fact]
    public void Noise_only_gives_an_unremarkable_p_value()
    {
        var sim = SimulatedPair.Make(8, snr: 0);
        var r = OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), new OverlapOptions(SimulatedPair.Coalescence(), OffSourceCount: 300));
        // noise against noise: the on-source window is one more draw from the same distribution
        Assert.True(r.PValue > 0.01, $"p {r.PValue}");
    }

    [Fact]
    public void A_centre_near_the_edge_is_refused_with_a_clear_message()
    {
        var sim = SimulatedPair.Make(1);
        var ex = Assert.Throws<ArgumentException>(() =>
            OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), new OverlapOptions(SimulatedPair.Start.AddSeconds(0.1))));
        Assert.Contains("does not fit", ex.Message);
    }

    [Fact]
    public void Different_rates_in_an_integer_ratio_are_resampled_and_others_refused()
    {
        var sim = SimulatedPair.Make(2, snr: 40);
        var b2 = Core.Signal.Resampling.Decimate(SimulatedPair.B(sim), 2);
        var r = OverlapCheck.Run(SimulatedPair.A(sim), b2, new OverlapOptions(SimulatedPair.Coalescence()));
        Assert.Equal(2048, r.SampleRateHz);
        Assert.Contains("decimated by 2", r.ResamplingNote);
        Assert.True(Math.Abs(r.RefinedLagSeconds + 0.0071) <= 1.0 / 2048);
        var odd = new Core.Signal.TimeSeries(GpsTime.FromSeconds(1300000000m), 3000, new double[3000 * 16]);
        Assert.Throws<ArgumentException>(() => OverlapCheck.Run(SimulatedPair.A(sim), odd, new OverlapOptions(SimulatedPair.Coalescence())));
    }
}

public class OverlapCorrelationOracleTests
{
    [Fact]
    public void Correlation_curve_matches_a_plain_double_loop()
    {
        var sim = SimulatedPair.Make(9, snr: 30);
        var cond = new Core.Signal.ConditioningOptions();
        var ca = Core.Signal.Conditioning.Condition(SimulatedPair.A(sim), cond);
        var cb = Core.Signal.Conditioning.Condition(SimulatedPair.B(sim), cond);
        var options = new OverlapOptions(SimulatedPair.Coalescence());
        var r = OverlapCheck.Compare(ca, cb, options);
        double fs = 4096;
        int w = (int)Math.Round(0.2 * fs);
        int c = (int)Math.Round(SimulatedPair.Coalescence().SecondsSince(ca.Data.Start) * fs);
        int a0 = c - (w / 2);
        var x = ca.Data.Samples;
        var y = cb.Data.Samples;
        for (int i = 0; i < r.LagsSeconds.Length; i++)
        {
            // oracle: lag L seconds means B's sample at A's time minus L
            int k = -(int)Math.Round(r.LagsSeconds[i] * fs);
            double dot = 0, sa = 0, sb = 0;
            for (int n = 0; n < w; n++)
            {
                dot += x[a0 + n] * y[a0 + n + k];
                sa += x[a0 + n] * x[a0 + n];
                sb += y[a0 + n + k] * y[a0 + n + k];
            }

            Assert.Equal(dot / Math.Sqrt(sa * sb), r.Correlation[i], 1e-9);
        }
    }
}

public class OverlapCancellationTests
{
    [Fact]
    public void A_cancelled_run_stops_with_operation_cancelled()
    {
        var sim = SimulatedPair.Make(1);
        using var cts = new CancellationTokenSource();
        cts.Cancel();
        Assert.ThrowsAny<OperationCanceledException>(() =>
            OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), new OverlapOptions(SimulatedPair.Coalescence(), OffSourceCount: 100), null, cts.Token));
    }
}
