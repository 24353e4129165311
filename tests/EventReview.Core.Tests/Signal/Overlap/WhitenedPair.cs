using EventReview.Core.Signal;
using EventReview.Core.Signal.Filters;
using EventReview.Core.Signal.Simulation;
using EventReview.Core.Signal.Spectra;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Signal.Overlap;

/// <summary>
/// Test data builder: two sites' already whitened data (white Gaussian noise) with a leading-order chirp that reaches B
/// <c>delay</c> seconds later and with a constant phase <c>phase</c> relative to A (what differently oriented sites see from an
/// inclined binary), both with the spectrum |H(f)|² of the check's own zero-phase band-pass. Built in the frequency domain (one
/// inverse FFT per site; the chirp template is made once) so a Monte Carlo of hundreds of pairs stays fast. The template is
/// face-on h+ (chirp mass 8, from 20 Hz), its coalescence in the middle of the record.
/// </summary>
internal sealed class WhitenedPair
{
    public static readonly GpsTime Start = GpsTime.FromSeconds(1300000000m);

    public static readonly ConditioningOptions Band = new(25, 400);

    private readonly double _fs;
    private readonly int _n;
    private readonly double[] _gain;
    private readonly double[] _templateRe;
    private readonly double[] _templateIm;
    private readonly double _templateNorm;

    public WhitenedPair(double fs = 2048, double durationSeconds = 16, double chirpMass = 8)
    {
        _fs = fs;
        _n = (int)Math.Round(durationSeconds * fs);
        var fft = RealFft.For(_n);
        var (hp, _) = ChirpWaveform.Generate(new ChirpParameters(chirpMass, LowFrequencyHz: 20), fs, _n, -durationSeconds / 2);
        _templateRe = new double[fft.Bins];
        _templateIm = new double[fft.Bins];
        fft.Forward(hp, _templateRe, _templateIm);
        var sections = Conditioning.Sections(Band, fs);
        _gain = new double[fft.Bins];
        double energy = 0;
        for (int k = 0; k < fft.Bins; k++)
        {
            double g = FrequencyResponse.Magnitude(sections, k * fs / _n, fs);
            _gain[k] = g * g; // forward-backward filtering: |H|²
            energy += (k == 0 || k == fft.Bins - 1 ? 1 : 2) * _gain[k] * _gain[k] * ((_templateRe[k] * _templateRe[k]) + (_templateIm[k] * _templateIm[k]));
        }

        _templateNorm = Math.Sqrt(energy / _n); // Parseval: Σ x² = (1/n) Σ_k |X_k|² over all bins
    }

    public GpsTime Centre => Start.AddSeconds(_n / _fs / 2);

    /// <summary>Site A (template as is) and site B (template delayed by <paramref name="delaySeconds"/>, phase turned by <paramref name="phaseRad"/>), each with band-passed SNR² = Σ s² = snr² against unit-variance white noise.</summary>
    public (ConditionedSeries A, ConditionedSeries B) Make(int seed, double delaySeconds, double phaseRad, double snrPerSite)
    {
        var random = new Random(seed);
        return (Site(0, 0, snrPerSite, random), Site(delaySeconds, phaseRad, snrPerSite, random));
    }

    private ConditionedSeries Site(double delay, double phase, double snr, Random random)
    {
        var fft = RealFft.For(_n);
        var re = new double[fft.Bins];
        var im = new double[fft.Bins];
        double scale = snr / _templateNorm;
        for (int k = 1; k < fft.Bins - 1; k++)
        {
            // unit-variance white noise: each bin's real and imaginary parts have variance n / 2
            double noiseSd = Math.Sqrt(_n / 2.0);
            double nr = noiseSd * NoiseSimulator.Gaussian(random), ni = noiseSd * NoiseSimulator.Gaussian(random);
            var (s, c) = Math.SinCos(phase - (2 * Math.PI * k * delay * _fs / _n));
            double tr = (_templateRe[k] * c) - (_templateIm[k] * s), ti = (_templateRe[k] * s) + (_templateIm[k] * c);
            re[k] = _gain[k] * (nr + (scale * tr));
            im[k] = _gain[k] * (ni + (scale * ti));
        }

        var data = new double[_n];
        fft.Inverse(re, im, data);
        int margin = (int)Math.Round(0.5 * _fs);
        return new ConditionedSeries(new TimeSeries(Start, _fs, data), new Psd(_fs / 2, [2 / _fs, 2 / _fs], _fs, 0), margin, _n - margin);
    }
}
