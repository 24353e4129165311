using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Tests.Signal.Spectra;

public class WelchTests
{
    private static readonly WelchOptions Seg1024 = new(1024);

    private static double[] Sine() => Enumerable.Range(0, 8192).Select(n => Math.Sin(2 * Math.PI * 100 * n / 1024)).ToArray();

    [Fact]
    public void Welch_psd_of_a_sine_matches_the_reference_values()
    {
        var psd = Welch.Estimate(Sine(), 1024, Seg1024);
        Assert.Equal(15, psd.Segments);
        Assert.Equal(1.0, psd.FrequencyStepHz);
        // ref (scipy.signal.welch, periodic Hann, nperseg 1024, 50 % overlap, detrend=False), CHECKS.md
        Assert.Equal(1.0 / 3, psd.Values[100], 1e-9);
        Assert.Equal(1.0 / 12, psd.Values[99], 1e-9);
        Assert.Equal(1.0 / 12, psd.Values[101], 1e-9);
        // ref (Parseval): sum PSD df = mean square = 0.5
        Assert.Equal(0.5, psd.Integral(), 1e-9);
    }

    [Fact]
    public void Welch_psd_of_a_mixed_signal_matches_the_reference_values()
    {
        var x = Enumerable.Range(0, 8192).Select(n =>
            1 + Math.Cos(2 * Math.PI * 100 * n / 1024) + (0.5 * Math.Sin((2 * Math.PI * 237.3 * n / 1024) + 0.3)) + (0.001 * (n % 7))).ToArray();
        var psd = Welch.Estimate(x, 1024, Seg1024);
        // ref (scipy.signal.welch, same settings), CHECKS.md x2 row, 1e-8 relative
        (int Bin, double Value)[] expected =
        [
            (0, 6.706726660165e-01), (1, 3.353363339835e-01), (100, 3.333333317307e-01),
            (146, 1.592817231924e-06), (237, 7.414963262109e-02), (238, 4.336085783438e-02),
        ];
        foreach (var (bin, value) in expected)
        {
            Assert.True(Math.Abs(psd.Values[bin] - value) <= 1e-8 * value, $"bin {bin}: {psd.Values[bin]:R} vs {value:R}");
        }
    }

    [Fact]
    public void White_noise_psd_level_is_two_sigma_squared_over_fs()
    {
        var rng = new Random(11);
        var x = Enumerable.Range(0, 1 << 20).Select(_ => Gaussian(rng)).ToArray();
        var psd = Welch.Estimate(x, 1024, Seg1024);
        double mean = psd.Values.Skip(10).Take(500).Average();
        // textbook: one-sided PSD of unit white noise = 2 sigma^2 / fs = 1.953125e-3 (~1 % statistical)
        Assert.Equal(1.953125e-3, mean, 1.953125e-3 * 0.01);
    }

    [Fact]
    public void Whitening_white_noise_gives_unit_variance()
    {
        var rng = new Random(5);
        double sigma = 3.7;
        var x = Enumerable.Range(0, 1 << 17).Select(_ => sigma * Gaussian(rng)).ToArray();
        var psd = Welch.Estimate(x, 1024, Seg1024);
        var w = Whitening.Whiten(x, 1024, psd, 1024);
        var mid = w.Skip(4096).Take(w.Length - 8192).ToArray();
        double variance = mid.Select(v => v * v).Average();
        // textbook: X / sqrt(S fs / 2) of white noise has unit variance (~1 %)
        Assert.Equal(1.0, variance, 0.015);
    }

    internal static double Gaussian(Random rng)
    {
        double u1 = 1.0 - rng.NextDouble(), u2 = rng.NextDouble();
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }

    private static double[] Mixed(int count) => Enumerable.Range(0, count).Select(n =>
        1 + Math.Cos(2 * Math.PI * 100 * n / 1024) + (0.5 * Math.Sin((2 * Math.PI * 237.3 * n / 1024) + 0.3)) + (0.001 * (n % 7))).ToArray();

    [Theory]
    // ref (scipy.signal.welch 1.10, same settings as the CHECKS.md x2 row, average='median'), 1e-8 relative:
    // 8192 samples = 15 segments (odd), 8704 samples = 16 segments (even: median of the middle two, bias of 15 terms).
    [InlineData(8192, 0, 0.9245915217132435)]
    [InlineData(8192, 1, 0.4622957685568276)]
    [InlineData(8192, 100, 0.4595344067932785)]
    [InlineData(8192, 146, 2.1961396869455393e-06)]
    [InlineData(8192, 237, 0.10222292522184202)]
    [InlineData(8192, 238, 0.059777420345933995)]
    [InlineData(8704, 0, 0.9245915241568263)]
    [InlineData(8704, 100, 0.4595344130983284)]
    [InlineData(8704, 237, 0.10222292548341687)]
    [InlineData(8704, 238, 0.05977742011508837)]
    public void Median_averaged_welch_matches_the_reference_library(int count, int bin, double expected)
    {
        var psd = Welch.Estimate(Mixed(count), 1024, Seg1024 with { Average = WelchAverage.Median });
        Assert.True(Math.Abs(psd.Values[bin] - expected) <= 1e-8 * expected, $"bin {bin}: {psd.Values[bin]:R} vs {expected:R}");
    }

    [Fact]
    public void A_loud_burst_in_one_segment_raises_the_mean_but_not_the_median()
    {
        var rng = new Random(21);
        var x = Enumerable.Range(0, 32 * 1024).Select(_ => Gaussian(rng)).ToArray();
        var clean = (double[])x.Clone();
        for (int n = 0; n < 1024; n++)
        {
            // a loud 120 Hz burst inside one second of data (SNR of hundreds): a glitch, or the candidate itself
            x[10_000 + n] += 40 * Math.Sin(2 * Math.PI * 120 * n / 1024) * Math.Sin(Math.PI * n / 1024);
        }

        double Level(double[] data, WelchAverage average) =>
            Welch.Estimate(data, 1024, Seg1024 with { Average = average }).Values.Skip(115).Take(11).Average();

        // textbook level 2σ²/fs = 1.953125e-3: on clean noise both averages agree (~10 %); with the burst the mean is pulled far up
        // (the old estimate), the median stays.
        Assert.Equal(1.953125e-3, Level(clean, WelchAverage.Mean), 2e-4);
        Assert.Equal(1.953125e-3, Level(clean, WelchAverage.Median), 3e-4);
        Assert.True(Level(x, WelchAverage.Mean) > 10 * 1.953125e-3, $"mean {Level(x, WelchAverage.Mean)}");
        Assert.Equal(1.953125e-3, Level(x, WelchAverage.Median), 4e-4);
    }
}
