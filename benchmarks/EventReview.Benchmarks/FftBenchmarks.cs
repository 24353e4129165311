using BenchmarkDotNet.Attributes;
using EventReview.Core.Signal.Spectra;
using MathNet.Numerics;
using MathNet.Numerics.IntegralTransforms;

namespace EventReview.Benchmarks;

/// <summary>
/// Why the project keeps its own real-input FFT (<see cref="RealFft"/>): a forward transform of 16,384 real samples
/// (4 s at 4096 Hz, a typical Welch segment or overlap window) by the cached plan, against the general library's
/// real transform (MathNet.Numerics <c>Fourier.ForwardReal</c>, the test oracle) and its complex transform on the
/// same data. Single-threaded, as the app runs the library.
/// Run: dotnet run -c Release --project benchmarks/EventReview.Benchmarks -- --filter '*Fft*' --job short
/// </summary>
[MemoryDiagnoser]
public class FftBenchmarks
{
    private const int N = 16384;
    private double[] _x = null!;
    private double[] _re = null!;
    private double[] _im = null!;
    private double[] _packed = null!;
    private System.Numerics.Complex[] _complex = null!;

    [GlobalSetup]
    public void Setup()
    {
        Control.UseSingleThread();
        var random = new Random(7);
        _x = Enumerable.Range(0, N).Select(_ => random.NextDouble() - 0.5).ToArray();
        _re = new double[N / 2 + 1];
        _im = new double[N / 2 + 1];
        _packed = new double[N + 2];
        _complex = new System.Numerics.Complex[N];
        RealFft.For(N); // the plan is made once and cached, as in the app
    }

    [Benchmark(Baseline = true)]
    public double ProjectRealFft()
    {
        RealFft.For(N).Forward(_x, _re, _im);
        return _re[1];
    }

    [Benchmark]
    public double LibraryForwardReal()
    {
        Array.Copy(_x, _packed, N);
        Fourier.ForwardReal(_packed, N, FourierOptions.NoScaling);
        return _packed[2];
    }

    [Benchmark]
    public double LibraryComplexForward()
    {
        for (int i = 0; i < N; i++)
        {
            _complex[i] = new System.Numerics.Complex(_x[i], 0);
        }

        Fourier.Forward(_complex, FourierOptions.NoScaling);
        return _complex[1].Real;
    }
}
