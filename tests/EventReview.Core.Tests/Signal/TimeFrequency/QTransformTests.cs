using EventReview.Core.Signal;
using EventReview.Core.Signal.Simulation;
using EventReview.Core.Signal.TimeFrequency;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Signal.TimeFrequency;

public class QTransformTests
{
    private static readonly QTransformOptions Defaults = new();

    [Fact]
    public void Q_planes_are_spaced_by_the_papers_step_in_mismatch()
    {
        // Chatterji et al. 2004 (CQG 21 S1809), section 4, from memory: step δ = 2 sqrt(μ/3); along Q the metric length is
        // ln(Qmax/Qmin)/√2, cut into the fewest equal steps ≤ δ, planes at the step centres.
        var planes = QTiling.Planes(Defaults, 8, 4096);
        double step = QTiling.Step(0.2);
        double length = Math.Log(64.0 / 4) / Math.Sqrt(2);

        Assert.Equal(2 * Math.Sqrt(0.2 / 3), step, 1e-15);
        Assert.Equal((int)Math.Ceiling(length / step), planes.Count);
        Assert.Equal(4 * Math.Exp(Math.Sqrt(2) * (length / planes.Count) * 0.5), planes[0].Q, 1e-12);
        for (int i = 1; i < planes.Count; i++)
        {
            double metric = Math.Log(planes[i].Q / planes[i - 1].Q) / Math.Sqrt(2);
            Assert.Equal(length / planes.Count, metric, 1e-12);
            Assert.True(metric <= step + 1e-12);
        }
    }

    [Fact]
    public void Frequency_rows_and_time_tiles_never_lie_further_apart_than_one_step()
    {
        const double seconds = 8, fs = 4096;
        double step = QTiling.Step(0.2);
        foreach (var plane in QTiling.Planes(Defaults, seconds, fs))
        {
            double q = plane.Q;
            Assert.True(plane.Rows[^1].FrequencyHz * (1 + (Math.Sqrt(11) / q)) <= fs / 2, "window below Nyquist");
            for (int j = 1; j < plane.Rows.Count; j++)
            {
                // frequency metric: sqrt(2 + Q²)/2 × ln(f2/f1)
                double metric = Math.Sqrt(2 + (q * q)) / 2 * Math.Log(plane.Rows[j].FrequencyHz / plane.Rows[j - 1].FrequencyHz);
                Assert.True(metric <= step + 1e-12, $"Q {q:F1}: rows {metric:F3} apart");
            }

            foreach (var row in plane.Rows)
            {
                // time metric: 2π f / Q × Δτ, Δτ = T / tiles; tile counts are powers of two
                Assert.True(2 * Math.PI * row.FrequencyHz / q * (seconds / row.TileCount) <= step + 1e-12);
                Assert.Equal(0, row.TileCount & (row.TileCount - 1));
                Assert.Equal(row.FrequencyHz * Math.Sqrt(11) / q, row.HalfBandwidthHz, 1e-12);
            }
        }
    }

    [Fact]
    public void No_point_of_the_space_lies_further_than_the_allowed_mismatch_from_a_tile()
    {
        // The point of the tiling: with the diagonal metric, every (τ, f, Q) inside the tiled region has a tile within μ = 0.2.
        const double seconds = 4, fs = 2048;
        var planes = QTiling.Planes(Defaults, seconds, fs);
        var random = new Random(3);
        for (int trial = 0; trial < 2000; trial++)
        {
            var plane = planes[random.Next(planes.Count)];
            double qLo = plane.Q / Math.Exp(Math.Log(planes.Count > 1 ? planes[1].Q / planes[0].Q : 1.1) / 2);
            double q = qLo * Math.Exp(random.NextDouble() * Math.Log(plane.Q / qLo) * 2);
            double f = plane.Rows[0].FrequencyHz * Math.Exp(random.NextDouble() * Math.Log(plane.Rows[^1].FrequencyHz / plane.Rows[0].FrequencyHz));
            double tau = random.NextDouble() * seconds;
            double best = double.PositiveInfinity;
            foreach (var p in planes)
            {
                foreach (var row in p.Rows)
                {
                    double dt = seconds / row.TileCount;
                    double nearest = Math.Round(tau / dt) * dt;
                    best = Math.Min(best, QTiling.DistanceSquared(tau, f, q, nearest, row.FrequencyHz, p.Q));
                }
            }

            Assert.True(best <= 0.2 + 1e-9, $"({tau:F3} s, {f:F1} Hz, Q {q:F1}): nearest tile at mismatch {best:F3}");
        }
    }

    [Fact]
    public void White_noise_gives_exponential_tile_energies_of_median_one_and_mean_one_over_ln_two()
    {
        // Gaussian noise: each tile's coefficient is complex Gaussian, so |c|² is exponential; divided by its median the mean is
        // 1 / ln 2 = 1.4427 (identity of the exponential distribution). Checked on the tiles of one row, directly.
        var random = new Random(17);
        const int n = 8192;
        var x = Enumerable.Range(0, n).Select(_ => NoiseSimulator.Gaussian(random)).ToArray();
        var fft = Core.Signal.Spectra.RealFft.For(n);
        var re = new double[fft.Bins];
        var im = new double[fft.Bins];
        fft.Forward(x, re, im);
        var row = new QRow(200, 200 * Math.Sqrt(11) / 8, 512);

        var e = QTransform.RowEnergy(re, im, row, n / 2048.0);

        Assert.Equal(1 / Math.Log(2), e.Average(), 0.12);
        Assert.Equal(0.5, e.Count(v => v <= 1) / (double)e.Length, 0.01);
    }

    [Fact]
    public void A_sine_gaussian_lights_the_tile_at_its_time_frequency_and_q()
    {
        var start = GpsTime.FromSeconds(1300000000m);
        var glitch = new GlitchSpec("KX", start.AddSeconds(8.0), GlitchKind.SineGaussian, 150, 12, 4e-21);
        var sim = NetworkSimulator.Simulate(SimulatedPair.Sites, new SimulationOptions(start, 16, 4096, 5, null, null, null, Glitches: [glitch]));
        var white = Conditioning.Condition(sim.Sites[0].Strain, new ConditioningOptions(20, 500));

        var map = QTransform.Compute(white.Data, start.AddSeconds(7), start.AddSeconds(9), start.AddSeconds(8));
        var loudest = map.Loudest();

        Assert.True(loudest.Energy > 50, $"{loudest.Energy}");
        Assert.Equal(0, loudest.TimeSeconds, 0.02);
        Assert.Equal(150, loudest.FrequencyHz, 15.0);
        Assert.InRange(loudest.Q, 6, 24); // injected Q 12; planes are about a factor 1.6 apart
        double cap = map.Percentile(0.995);
        Assert.Equal(0.995, map.Energy.SelectMany(r => r).Count(v => v <= cap) / (double)(map.TimesSeconds.Length * map.FrequenciesHz.Length), 0.002);
    }
}
