using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Engines;
using EventReview.Core.Significance;
using EventReview.Core.Time;

namespace EventReview.Benchmarks;

/// <summary>
/// Two sites x 1,000,000 Poisson triggers over 30 days of analysed time (four segments each), window 15 ms,
/// step 5 s, K = 5,000 (10,000 slides): the fast one-pass finder against the per-slide merge, both through
/// the full <see cref="TimeSlideBackground.Run"/> (zero lag, background time, FAR, curve).
/// Run: dotnet run -c Release --project benchmarks/EventReview.Benchmarks -- --filter '*TimeSlide*'
/// </summary>
[MemoryDiagnoser]
[SimpleJob(RunStrategy.Monitoring, launchCount: 1, warmupCount: 0, iterationCount: 2)]
public class TimeSlideBenchmarks
{
    private const long Origin = 1_400_000_000L * GpsTime.NanosecondsPerSecond;
    private const long Day = 86_400L * GpsTime.NanosecondsPerSecond;
    private SiteTriggers _a = null!;
    private SiteTriggers _b = null!;
    private TimeSlideOptions _options = null!;

    [GlobalSetup]
    public void Setup()
    {
        _a = MakeSite("KP", new Random(1), hourOffset: 0);
        _b = MakeSite("AB", new Random(2), hourOffset: 2);
        _options = new TimeSlideOptions
        {
            WindowNs = 15_000_000,
            StepNs = 5 * GpsTime.NanosecondsPerSecond,
            Slides = 5_000,
            CandidateStatistic = 20,
        };
    }

    [Benchmark(Baseline = true)]
    public long Fast() => TimeSlideBackground.Run(_a, _b, _options).BackgroundCoincidences;

    [Benchmark]
    public long Naive() => TimeSlideBackground.Run(_a, _b, _options with { Algorithm = TimeSlideAlgorithm.Naive }).BackgroundCoincidences;

    /// <summary>Four 7.5-day segments separated by one-hour gaps (shifted by a few hours between sites), 1e6 triggers in them.</summary>
    private static SiteTriggers MakeSite(string code, Random rng, int hourOffset)
    {
        const int n = 1_000_000;
        var hour = Day / 24;
        var segments = new List<Segment>();
        var start = Origin + (hourOffset * hour);
        for (var i = 0; i < 4; i++)
        {
            var end = start + (Day * 15 / 2);
            segments.Add(new Segment(new GpsTime(start), new GpsTime(end)));
            start = end + hour;
        }

        // a Poisson process of n expected events over the 30 analysed days, laid into the segments
        var live = 30 * Day;
        var rate = n / (double)live;
        var triggers = new List<Trigger>(n + 5000);
        var t = 0.0;
        while (true)
        {
            t += -Math.Log(1 - rng.NextDouble()) / rate;
            if (t >= live)
            {
                break;
            }

            var ns = (long)t;
            var seg = segments[(int)(ns / (Day * 15 / 2))];
            triggers.Add(new Trigger(new GpsTime(seg.Start.Nanoseconds + (ns % (Day * 15 / 2))), 5.5 - (1.5 * Math.Log(1 - rng.NextDouble()))));
        }

        return SiteTriggers.Create(code, triggers, segments);
    }
}
