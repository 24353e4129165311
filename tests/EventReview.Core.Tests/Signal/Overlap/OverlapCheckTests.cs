using System.Text.Json;
using EventReview.Core.Signal.Overlap;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Signal.Overlap;

public class OverlapCheckTests
{
    private static OverlapOptions Options(int offSource = 0) => new(SimulatedPair.Coalescence(), 0.2, SimulatedPair.MaxLagSeconds, OffSourceCount: offSource);

    [Fact]
    public void Overlap_recovers_lag_within_its_uncertainty_and_never_claims_the_wrong_sign_of_a_flipped_chirp()
    {
        int inside = 0, determined = 0;
        for (int seed = 1; seed <= 12; seed++)
        {
            var sim = SimulatedPair.Make(seed, snr: 30);
            var r = OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), Options());

            // truth from the simulator: arrival(A) - arrival(B) = -12.4 ms; B = -0.75 A (same F+/Fx ratio): phase 180°, sign -1
            Assert.NotNull(r.LagUncertaintySeconds);
            Assert.True(Math.Abs(r.RefinedLagSeconds + 0.0124) <= 3 * r.LagUncertaintySeconds, $"seed {seed}: lag {r.RefinedLagSeconds} ± {r.LagUncertaintySeconds}");
            inside += Math.Abs(r.RefinedLagSeconds + 0.0124) <= r.LagUncertaintySeconds ? 1 : 0;
            Assert.Equal(-1, sim.Truth.Sites[1].SignRelativeToFirst);
            if (r.SignDetermined == true)
            {
                determined++;
                Assert.Equal(-1, r.Sign);
            }

            Assert.True(Math.Abs(Math.Abs(r.PhaseRadians!.Value) - Math.PI) <= 3 * r.PhaseUncertaintyRadians!.Value, $"seed {seed}: phase {r.PhaseRadians} ± {r.PhaseUncertaintyRadians}");
            Assert.True(r.Overlap > 0.3, $"seed {seed}: overlap {r.Overlap}");
            Assert.False(r.AtSearchEdge);
        }

        Assert.InRange(inside, 5, 12); // about two thirds inside one sigma
        Assert.True(determined >= 1, $"sign determined in {determined} of 12"); // at network SNR 30 the phase is often too uncertain
    }

    [Fact]
    public void A_loud_flipped_chirp_has_a_determined_sign()
    {
        for (int seed = 1; seed <= 4; seed++)
        {
            var sim = SimulatedPair.Make(seed, snr: 120);
            var r = OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), Options());
            Assert.True(r.SignDetermined, $"seed {seed}: phase {r.PhaseRadians} ± {r.PhaseUncertaintyRadians}");
            Assert.Equal(-1, r.Sign);
        }
    }

    [Fact]
    public void Off_source_overlaps_give_a_small_p_value_for_a_loud_signal_and_serialise_to_json()
    {
        var sim = SimulatedPair.Make(3, snr: 40);
        var r = OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), Options(500));
        Assert.Equal(500, r.OffSourceOverlaps.Length);
        // empirical p-value (1 + #louder) / (1 + N): a loud coherent signal beats all time-slid noise windows
        Assert.Equal(1.0 / 501, r.PValue!.Value, 12);
        Assert.True(r.PlotA.Length <= 2000 && r.PlotA.Length == r.PlotB.Length);
        Assert.Equal(r.LagsSeconds.Length, r.Correlation.Length);
        Assert.Equal(r.LagsSeconds.Length, r.Envelope!.Length);
        Assert.True(r.LagsSeconds[0] < r.LagsSeconds[^1]);
        var json = JsonSerializer.Serialize(r, new JsonSerializerOptions(JsonSerializerDefaults.Web));
        Assert.Contains("\"lagUncertaintySeconds\"", json);
        Assert.Contains("\"phaseRadians\"", json);
        Assert.Contains("\"atSearchEdge\"", json);
    }

    [Fact]
    public void Noise_only_gives_an_unremarkable_p_value()
    {
        var sim = SimulatedPair.Make(8, snr: 0);
        var r = OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), Options(300));
        // noise against noise: the on-source window is one more draw from the same distribution
        Assert.True(r.PValue > 0.01, $"p {r.PValue}");
    }

    [Fact]
    public void A_centre_near_the_edge_is_refused_with_a_clear_message()
    {
        var sim = SimulatedPair.Make(1);
        var ex = Assert.Throws<ArgumentException>(() =>
            OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), new OverlapOptions(SimulatedPair.Start.AddSeconds(0.1), 0.2, SimulatedPair.MaxLagSeconds)));
        Assert.Contains("does not fit", ex.Message);
    }

    [Fact]
    public void Different_rates_in_an_integer_ratio_are_resampled_and_others_refused()
    {
        var sim = SimulatedPair.Make(2, snr: 40);
        var b2 = Core.Signal.Resampling.Decimate(SimulatedPair.B(sim), 2);
        var r = OverlapCheck.Run(SimulatedPair.A(sim), b2, Options());
        Assert.Equal(2048, r.SampleRateHz);
        Assert.Contains("decimated by 2", r.ResamplingNote);
        Assert.True(Math.Abs(r.RefinedLagSeconds + 0.0124) <= 3 * r.LagUncertaintySeconds!.Value);
        var odd = new Core.Signal.TimeSeries(GpsTime.FromSeconds(1300000000m), 3000, new double[3000 * 16]);
        Assert.Throws<ArgumentException>(() => OverlapCheck.Run(SimulatedPair.A(sim), odd, Options()));
    }
}

public class OverlapCorrelationOracleTests
{
    [Fact]
    public void Correlation_and_envelope_match_a_plain_loop_over_the_analytic_signals()
    {
        var sim = SimulatedPair.Make(9, snr: 30);
        var cond = new Core.Signal.ConditioningOptions();
        var ca = Core.Signal.Conditioning.Condition(SimulatedPair.A(sim), cond);
        var cb = Core.Signal.Conditioning.Condition(SimulatedPair.B(sim), cond);
        var r = OverlapCheck.Compare(ca, cb, new OverlapOptions(SimulatedPair.Coalescence(), 0.2, SimulatedPair.MaxLagSeconds));
        var za = Core.Signal.Spectra.AnalyticSignal.Of(ca.Data.Samples);
        var zb = Core.Signal.Spectra.AnalyticSignal.Of(cb.Data.Samples);
        double fs = 4096;
        int w = (int)Math.Round(0.2 * fs);
        int a0 = (int)Math.Round(SimulatedPair.Coalescence().SecondsSince(ca.Data.Start) * fs) - (w / 2);
        (double Re, double Im, double Norm) Window(int k, int split)
        {
            // A's window moves by -split, B's by k - split
            double re = 0, im = 0, pa = 0, pb = 0;
            for (int n = 0; n < w; n++)
            {
                int i = a0 + n - split, j = a0 + n + k - split;
                re += (za.Real[i] * zb.Real[j]) + (za.Imaginary[i] * zb.Imaginary[j]);
                im += (za.Real[i] * zb.Imaginary[j]) - (za.Imaginary[i] * zb.Real[j]);
                pa += (za.Real[i] * za.Real[i]) + (za.Imaginary[i] * za.Imaginary[i]);
                pb += (zb.Real[j] * zb.Real[j]) + (zb.Imaginary[j] * zb.Imaginary[j]);
            }

            return (re, im, Math.Sqrt(pa * pb));
        }

        for (int i = 0; i < r.LagsSeconds.Length; i++)
        {
            // oracle: lag L seconds is a shift k = -L fs of B against A; the windows split it (both splits averaged for odd k)
            int k = -(int)Math.Round(r.LagsSeconds[i] * fs);
            int split = (int)Math.Floor(k / 2.0);
            var z = Window(k, split);
            if ((k & 1) != 0)
            {
                var other = Window(k, split + 1);
                z = (0.5 * (z.Re + other.Re), 0.5 * (z.Im + other.Im), 0);
                double pa = 0.5 * (Power(za, a0 - split) + Power(za, a0 - split - 1));
                double pb = 0.5 * (Power(zb, a0 + k - split) + Power(zb, a0 + k - split - 1));
                z.Norm = Math.Sqrt(pa * pb);
            }

            Assert.Equal(z.Re / z.Norm, r.Correlation[i], 1e-9);
            Assert.Equal(Math.Sqrt((z.Re * z.Re) + (z.Im * z.Im)) / z.Norm, r.Envelope![i], 1e-9);
        }

        double Power(Core.Signal.Spectra.AnalyticSeries s, int start)
        {
            double p = 0;
            for (int n = 0; n < w; n++)
            {
                p += (s.Real[start + n] * s.Real[start + n]) + (s.Imaginary[start + n] * s.Imaginary[start + n]);
            }

            return p;
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
            OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), new OverlapOptions(SimulatedPair.Coalescence(), 0.2, SimulatedPair.MaxLagSeconds, OffSourceCount: 100), null, cts.Token));
    }
}
