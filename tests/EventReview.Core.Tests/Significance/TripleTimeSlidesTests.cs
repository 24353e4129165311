using EventReview.Core.Significance;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Significance;

public class TripleTimeSlidesTests
{
    [Fact]
    public void Triples_match_a_brute_force_search_over_all_slides_and_trigger_triples()
    {
        long total = 0;
        for (var seed = 0; seed < 40; seed++)
        {
            var rng = new Random(seed);
            const long origin = 1_300_000_000L * GpsTime.NanosecondsPerSecond;
            var step = (long)rng.Next(200, 1000);
            var w = (long)rng.Next(20, (int)(step / 2) - 1);
            var k = rng.Next(1, 10);
            var span = (2 * ((2 * k * step) + w)) + rng.Next(1, 3000);
            var sites = new[] { "AA", "BB", "CC" }.Select(code => SiteTriggers.Create(
                code,
                Enumerable.Range(0, rng.Next(5, 60)).Select(_ => new Trigger(new GpsTime(origin + rng.NextInt64(0, span)), 5 + (rng.NextDouble() * 5))),
                [new Segment(new GpsTime(origin), new GpsTime(origin + span))])).ToArray();
            var options = new TimeSlideOptions { WindowNs = w, StepNs = step, Slides = k, CandidateStatistic = 14 };

            var result = TripleTimeSlides.Run(sites[0], sites[1], sites[2], options);

            long count = 0, louder = 0;
            for (var s = -k; s <= k; s++)
            {
                if (s == 0)
                {
                    continue;
                }

                foreach (var a in sites[0].Triggers)
                {
                    foreach (var b in sites[1].Triggers)
                    {
                        foreach (var c in sites[2].Triggers)
                        {
                            var ta = a.Time.Nanoseconds - origin;
                            var tb = b.Time.Nanoseconds - origin + (s * step);
                            var tc = c.Time.Nanoseconds - origin + (2 * s * step);
                            if (Ring(ta - tb, span) <= w && Ring(ta - tc, span) <= w && Ring(tb - tc, span) <= w)
                            {
                                count++;
                                if (Math.Sqrt((a.Snr * a.Snr) + (b.Snr * b.Snr) + (c.Snr * c.Snr)) >= 14)
                                {
                                    louder++;
                                }
                            }
                        }
                    }
                }
            }

            Assert.Equal(count, result.Figures.BackgroundCoincidences);
            Assert.Equal(louder, result.Figures.Louder);
            Assert.Equal(2 * k * span / 1e9, result.BackgroundSeconds, 1e-12);
            total += count;
        }

        Assert.True(total > 50, $"only {total} triples: the random cases are too sparse to test anything");
    }

    [Fact]
    public void Triples_with_a_window_per_pair_and_the_candidate_removed_match_a_brute_force_search()
    {
        var checkedRemoval = 0;
        for (var seed = 100; seed < 140; seed++)
        {
            var rng = new Random(seed);
            const long origin = 1_300_000_000L * GpsTime.NanosecondsPerSecond;
            var step = (long)rng.Next(300, 1000);
            long[] w = [rng.Next(10, (int)(step / 2) - 1), rng.Next(10, (int)(step / 2) - 1), rng.Next(10, (int)(step / 2) - 1)];
            var k = rng.Next(1, 10);
            var span = (2 * ((2 * k * step) + w.Max())) + rng.Next(1, 3000);
            var sites = new[] { "AA", "BB", "CC" }.Select(code => SiteTriggers.Create(
                code,
                Enumerable.Range(0, rng.Next(20, 70)).Select(_ => new Trigger(new GpsTime(origin + rng.NextInt64(0, span)), 5 + (rng.NextDouble() * 5))),
                [new Segment(new GpsTime(origin), new GpsTime(origin + span))])).ToArray();
            var options = new TimeSlideOptions { WindowNs = 1, StepNs = step, Slides = k, CandidateStatistic = 14, RemoveCandidateTriggers = true };

            var result = TripleTimeSlides.Run(sites[0], sites[1], sites[2], options, windows: new TripleWindows(w[0], w[1], w[2]));

            var c = result.Candidate;
            long count = 0, louder = 0, countWithout = 0, louderWithout = 0;
            var slides = new HashSet<int>();
            for (var s = -k; s <= k; s++)
            {
                foreach (var a in sites[0].Triggers)
                {
                    foreach (var b in sites[1].Triggers)
                    {
                        foreach (var t in sites[2].Triggers)
                        {
                            var ta = a.Time.Nanoseconds - origin;
                            var tb = b.Time.Nanoseconds - origin + (s * step);
                            var tc = t.Time.Nanoseconds - origin + (2 * s * step);
                            var d = s == 0 ? (Math.Abs(ta - tb), Math.Abs(ta - tc), Math.Abs(tb - tc)) : (Ring(ta - tb, span), Ring(ta - tc, span), Ring(tb - tc, span));
                            if (s == 0 || d.Item1 > w[0] || d.Item2 > w[1] || d.Item3 > w[2])
                            {
                                continue;
                            }

                            var loud = Math.Sqrt((a.Snr * a.Snr) + (b.Snr * b.Snr) + (t.Snr * t.Snr)) >= 14;
                            count++;
                            louder += loud ? 1 : 0;
                            if (loud)
                            {
                                slides.Add(s);
                            }

                            var shares = c is not null && (a.Time.Nanoseconds == c.TimesNs[0] || b.Time.Nanoseconds == c.TimesNs[1] || t.Time.Nanoseconds == c.TimesNs[2]);
                            if (!shares)
                            {
                                countWithout++;
                                louderWithout += loud ? 1 : 0;
                            }
                        }
                    }
                }
            }

            Assert.Equal(count, result.Figures.BackgroundCoincidences);
            Assert.Equal(louder, result.Figures.Louder);
            Assert.Equal(slides.Count, result.SlidesWithLouder);
            Assert.Equal((slides.Count + 1.0) / ((2 * k) + 1), result.SlidePValue, 1e-15);
            Assert.Equal([w[0] / 1e6, w[1] / 1e6, w[2] / 1e6], result.WindowsMs);
            if (c is not null)
            {
                Assert.Equal(countWithout, result.WithoutCandidateTriggers!.BackgroundCoincidences);
                Assert.Equal(louderWithout, result.WithoutCandidateTriggers.Louder);
                checkedRemoval++;
            }
        }

        Assert.True(checkedRemoval > 5, $"only {checkedRemoval} cases had a zero-lag triple to remove");
    }

    [Fact]
    public void A_loud_zero_lag_triple_becomes_the_candidate_and_is_not_background()
    {
        var rng = new Random(1);
        const long origin = 1_300_000_000L * GpsTime.NanosecondsPerSecond;
        var loud = origin + 40_000_000_000_000;
        var sites = new[] { 0L, 2_000_000, -1_000_000 }.Select((offset, i) => SiteTriggers.Create(
            $"S{i}",
            TimeSlideBackgroundTests.PoissonTriggers(rng, 0.2, 1e5).Append(new Trigger(new GpsTime(loud + offset), 40)),
            [new Segment(new GpsTime(origin), new GpsTime(origin + 100_000_000_000_000))])).ToArray();
        var options = new TimeSlideOptions { WindowNs = 10_000_000, StepNs = 3 * GpsTime.NanosecondsPerSecond, Slides = 1000 };

        var result = TripleTimeSlides.Run(sites[0], sites[1], sites[2], options);

        Assert.Equal(Math.Sqrt(3 * 1600.0), result.CandidateStatistic, 1e-12);
        Assert.Equal(1, result.ZeroLagTriples);
        Assert.Equal(0, result.Figures.Louder);
        Assert.True(result.Figures.FarIsBound);
        Assert.DoesNotContain(result.Loudest, t => t.Slide == 0);
    }

    private static long Ring(long d, long span)
    {
        var r = ((d % span) + span) % span;
        return Math.Min(r, span - r);
    }
}
