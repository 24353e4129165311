using EventReview.Core.Significance;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Significance;

public class TimeSlideBackgroundTests
{
    private const long Origin = 1_300_000_000L * GpsTime.NanosecondsPerSecond;

    [Fact]
    public void Poisson_streams_give_the_accidental_rate_two_tau_r1_r2()
    {
        const double r1 = 0.01, r2 = 0.02, tau = 0.010, span = 1e6;
        var rng = new Random(11);
        var a = PoissonSite("KX", rng, r1, span);
        var b = PoissonSite("MV", rng, r2, span);
        var options = new TimeSlideOptions { WindowNs = 10_000_000, StepNs = 100 * GpsTime.NanosecondsPerSecond, Slides = 1000, CandidateStatistic = 1e9 };
        var result = TimeSlideBackground.Run(a, b, options);

        Assert.Equal(2000 * span, result.BackgroundSeconds, 1e-3); // one full-span segment each: every slide overlaps fully
        var expected = 2 * tau * r1 * r2;                           // Knoll, coincidence chapter (from memory): 4.0e-6 Hz
        Assert.Equal(4.0e-6, expected, 1e-18);
        var measured = result.BackgroundCoincidences / result.BackgroundSeconds;
        var expectedCount = expected * result.BackgroundSeconds;

        // statistical error: Poisson on the count plus the spread of the realised trigger numbers
        var relative = Math.Sqrt((1 / expectedCount) + (1 / (r1 * span)) + (1 / (r2 * span)));
        Assert.InRange(measured, expected * (1 - (3 * relative)), expected * (1 + (3 * relative)));
        Assert.True(result.FarIsBound);
    }

    [Fact]
    public void Background_time_past_the_range_of_a_long_nanosecond_count_is_summed_exactly()
    {
        // one full 30-day segment per site: on the ring every slide overlaps the whole span, so T_bg = 2K x span
        const long span = 30L * 86_400 * GpsTime.NanosecondsPerSecond;
        Segment[] segments = [new Segment(new GpsTime(Origin), new GpsTime(Origin + span))];
        var a = SiteTriggers.Create("KX", [new Trigger(new GpsTime(Origin + 1_000_000_000), 8)], segments);
        var b = SiteTriggers.Create("MV", [new Trigger(new GpsTime(Origin + 2_000_000_000), 8)], segments);
        var options = new TimeSlideOptions { WindowNs = 15_000_000, StepNs = 5 * GpsTime.NanosecondsPerSecond, Slides = 5_000, CandidateStatistic = 20 };

        var result = TimeSlideBackground.Run(a, b, options);

        Assert.Equal(10_000 * 30.0 * 86_400, result.BackgroundSeconds, 1e-3); // 2.592e10 s = 2.592e19 ns > long.MaxValue (9.2e18)
        Assert.Equal(2.302585092994046 / result.BackgroundSeconds, result.FarHz, 1e-25); // 90 % bound, -ln(0.1) / T_bg (Gehrels 1986)
    }

    [Fact]
    public void A_loud_injected_zero_lag_coincidence_is_not_counted_in_the_background()
    {
        var rng = new Random(5);
        var triggersA = PoissonTriggers(rng, 0.05, 1e5).Append(new Trigger(new GpsTime(Origin + 50_000_000_000_000), 50)).ToList();
        var triggersB = PoissonTriggers(rng, 0.05, 1e5).Append(new Trigger(new GpsTime(Origin + 50_000_000_000_000 + 3_000_000), 50)).ToList();
        var a = SiteTriggers.Create("KX", triggersA, [new Segment(new GpsTime(Origin), new GpsTime(Origin + 100_000_000_000_000))]);
        var b = SiteTriggers.Create("MV", triggersB, [new Segment(new GpsTime(Origin), new GpsTime(Origin + 100_000_000_000_000))]);
        var options = new TimeSlideOptions { WindowNs = 10_000_000, StepNs = 7 * GpsTime.NanosecondsPerSecond, Slides = 500, RemoveCandidateTriggers = true };

        var result = TimeSlideBackground.Run(a, b, options);

        Assert.Equal(Math.Sqrt(5000), result.CandidateStatistic, 1e-12); // taken from the loudest zero-lag coincidence
        Assert.NotNull(result.Candidate);
        Assert.Equal(0, result.Candidate!.Slide);
        Assert.Equal(0, result.Louder);
        Assert.True(result.FarIsBound);
        Assert.True(result.FapIsBound);
        Assert.Equal(0.9, result.FarBoundConfidence);
        Assert.Equal(2.302585092994046 / result.BackgroundSeconds, result.FarHz, 1e-20); // 90 % bound (CHECKS.md, Gehrels 1986)
        Assert.Equal(0, result.SlidesWithLouder);
        Assert.True(result.SlidePValueIsFloor);
        Assert.Equal(1 / 1001.0, result.SlidePValue, 1e-15); // floor 1 / (2K + 1)
        Assert.DoesNotContain(result.Loudest, c => c.Slide == 0);
        Assert.True(result.BackgroundCoincidences > 100);

        // with a lower threshold, the candidate's own loud triggers make louder background; removing them leaves none
        var lower = TimeSlideBackground.Run(a, b, options with { CandidateStatistic = 45 });
        Assert.True(lower.Louder > 0);
        Assert.InRange(lower.SlidesWithLouder, 1, lower.Louder);
        Assert.Equal((lower.SlidesWithLouder + 1) / 1001.0, lower.SlidePValue, 1e-15);
        Assert.Equal(0, lower.WithoutCandidateTriggers!.Louder);
        Assert.True(lower.WithoutCandidateTriggers.FarIsBound);
        Assert.True(lower.WithoutCandidateTriggers.BackgroundCoincidences < lower.BackgroundCoincidences);
    }

    [Fact]
    public void Fast_and_naive_runs_give_the_same_figures()
    {
        var rng = new Random(3);
        var a = PoissonSite("KX", rng, 0.2, 2e4, gapEvery: 3000);
        var b = PoissonSite("MV", rng, 0.3, 2e4, gapEvery: 2300);
        var options = new TimeSlideOptions { WindowNs = 15_000_000, StepNs = 5 * GpsTime.NanosecondsPerSecond, Slides = 300, CandidateStatistic = 12 };
        var fast = TimeSlideBackground.Run(a, b, options);
        var naive = TimeSlideBackground.Run(a, b, options with { Algorithm = TimeSlideAlgorithm.Naive });
        Assert.Equal(naive.BackgroundCoincidences, fast.BackgroundCoincidences);
        Assert.Equal(naive.Louder, fast.Louder);
        Assert.Equal(naive.SlidesWithLouder, fast.SlidesWithLouder);
        var all = TimeSlideBackground.Run(a, b, options with { LoudestCount = (int)fast.Louder }); // keep every louder one: count their slides by hand
        Assert.Equal(all.Loudest.Where(l => l.Statistic >= 12).Select(l => l.Slide).Distinct().Count(), fast.SlidesWithLouder);
        Assert.Equal(naive.Curve, fast.Curve);
        Assert.Equal(naive.Loudest.Select(l => l.Statistic), fast.Loudest.Select(l => l.Statistic));
        Assert.True(fast.Curve.Count is > 10 and <= 502);
        Assert.All(fast.Curve.Zip(fast.Curve.Skip(1)), p => Assert.True(p.Second.Statistic > p.First.Statistic && p.Second.Count < p.First.Count));
        Assert.InRange(fast.Louder, 1, fast.BackgroundCoincidences - 1);
        Assert.Equal(fast.BackgroundCoincidences, fast.Curve[0].Count); // the lowest point counts everything
    }

    [Fact]
    public void Background_time_is_the_exact_overlap_after_the_shift_round_the_ring()
    {
        var a = SiteTriggers.Create("KX", [], [new Segment(new GpsTime(0), new GpsTime(40))]);
        var b = SiteTriggers.Create("MV", [], [new Segment(new GpsTime(60), new GpsTime(100))]);
        var pair = new TimeSlidePair(a, b);
        Assert.Equal(100, pair.SpanNs);
        Assert.Equal(0, pair.ZeroLagOverlapNanoseconds());
        Assert.Equal(30, pair.OverlapNanoseconds(50));   // B -> [110, 150) = [10, 50) on the ring
        Assert.Equal(40, pair.OverlapNanoseconds(-60));  // B -> [0, 40)
        Assert.Equal(20, pair.OverlapNanoseconds(20));   // B -> [80, 100) + [0, 20)
    }

    [Fact]
    public void Progress_reaches_all_slides_and_cancellation_stops_the_search()
    {
        var rng = new Random(8);
        var a = PoissonSite("KX", rng, 0.5, 1e4);
        var b = PoissonSite("MV", rng, 0.5, 1e4);
        var options = new TimeSlideOptions { WindowNs = 10_000_000, StepNs = GpsTime.NanosecondsPerSecond, Slides = 200, CandidateStatistic = 10 };
        var last = new SynchronousProgress();
        var result = TimeSlideBackground.Run(a, b, options, last);
        Assert.Equal(400, last.Latest.SlidesDone);
        Assert.Equal(result.BackgroundCoincidences, last.Latest.CoincidencesFound);

        using var cts = new CancellationTokenSource();
        cts.Cancel();
        Assert.ThrowsAny<OperationCanceledException>(() => TimeSlideBackground.Run(a, b, options, null, cts.Token));
    }

    [Fact]
    public void The_result_serialises_to_camel_case_json_and_back()
    {
        var rng = new Random(9);
        var a = PoissonSite("KX", rng, 0.2, 1e4);
        var b = PoissonSite("MV", rng, 0.2, 1e4);
        var result = TimeSlideBackground.Run(a, b, new TimeSlideOptions { WindowNs = 10_000_000, StepNs = GpsTime.NanosecondsPerSecond, Slides = 100, CandidateStatistic = 11, RemoveCandidateTriggers = true });
        var json = System.Text.Json.JsonSerializer.Serialize(result, new System.Text.Json.JsonSerializerOptions(System.Text.Json.JsonSerializerDefaults.Web));
        Assert.Contains("\"farHz\":", json, StringComparison.Ordinal);
        Assert.Contains("\"backgroundSeconds\":", json, StringComparison.Ordinal);
        Assert.Contains("\"assumptions\":", json, StringComparison.Ordinal);
        var back = System.Text.Json.JsonSerializer.Deserialize<BackgroundResult>(json, new System.Text.Json.JsonSerializerOptions(System.Text.Json.JsonSerializerDefaults.Web))!;
        Assert.Equal(result.BackgroundCoincidences, back.BackgroundCoincidences);
        Assert.Equal(result.Curve, back.Curve);
        Assert.Equal(200 * 1e4, result.BackgroundSeconds, 1e-6);
    }

    internal static SiteTriggers PoissonSite(string code, Random rng, double rateHz, double spanSeconds, double gapEvery = 0)
    {
        var end = Origin + (long)(spanSeconds * 1e9);
        var segments = new List<Segment>();
        if (gapEvery > 0)
        {
            for (var s = 0.0; s < spanSeconds; s += gapEvery)
            {
                segments.Add(new Segment(new GpsTime(Origin + (long)(s * 1e9)), new GpsTime(Math.Min(end, Origin + (long)((s + (gapEvery * 0.8)) * 1e9)))));
            }
        }
        else
        {
            segments.Add(new Segment(new GpsTime(Origin), new GpsTime(end)));
        }

        return SiteTriggers.Create(code, PoissonTriggers(rng, rateHz, spanSeconds), segments);
    }

    internal static IEnumerable<Trigger> PoissonTriggers(Random rng, double rateHz, double spanSeconds)
    {
        var list = new List<Trigger>();
        for (var t = -Math.Log(1 - rng.NextDouble()) / rateHz; t < spanSeconds; t += -Math.Log(1 - rng.NextDouble()) / rateHz)
        {
            list.Add(new Trigger(new GpsTime(Origin + (long)(t * 1e9)), 5.5 + (-Math.Log(1 - rng.NextDouble()) * 1.5)));
        }

        return list;
    }

    private sealed class SynchronousProgress : IProgress<BackgroundProgress>
    {
        private readonly Lock _gate = new();

        public BackgroundProgress Latest { get; private set; }

        public void Report(BackgroundProgress value)
        {
            lock (_gate)
            {
                if (value.SlidesDone >= Latest.SlidesDone)
                {
                    Latest = value;
                }
            }
        }
    }
}
