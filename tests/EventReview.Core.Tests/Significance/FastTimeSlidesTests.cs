using EventReview.Core.Significance;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Significance;

public class FastTimeSlidesTests
{
    [Fact]
    public void Fast_and_naive_finders_give_identical_coincidence_lists_on_random_inputs()
    {
        long total = 0, seam = 0, edge = 0;
        for (var seed = 0; seed < 300; seed++)
        {
            var (pair, options) = RandomCase(seed);
            var fast = new CoincidenceListSink(pair);
            var naive = new CoincidenceListSink(pair);
            FastTimeSlides.Find(pair, options, fast);
            NaiveTimeSlides.Find(pair, options, naive);
            var f = fast.Sorted();
            var n = naive.Sorted();
            Assert.Equal(n.Count, f.Count);
            Assert.Equal(n, f); // integer ns times, slide and indices: exact
            total += f.Count;
            foreach (var c in f)
            {
                var linear = c.TimeANs - (c.TimeBNs + (c.Slide * options.StepNs));
                if (Math.Abs(linear) > options.WindowNs)
                {
                    seam++; // only possible by going round the ring
                }

                var ring = RingDistance(linear, pair.SpanNs);
                Assert.True(Math.Abs(ring) <= options.WindowNs);
                if (Math.Abs(ring) == options.WindowNs)
                {
                    edge++;
                }
            }
        }

        // the random cases must exercise what they claim to
        Assert.True(total > 1000, $"only {total} coincidences");
        Assert.True(seam > 10, $"only {seam} seam-crossing coincidences");
        Assert.True(edge > 10, $"only {edge} coincidences exactly on the window edge");
    }

    [Fact]
    public void A_pair_exactly_on_the_window_edge_is_coincident_and_one_ns_beyond_is_not()
    {
        const long step = 1_000_000, w = 10_000;
        var a = Site("AA", [5_000_000], 100_000_000);
        var b = Site("BB", [5_000_000 - (3 * step) + w, 5_000_000 - (2 * step) - w - 1], 100_000_000);
        var pair = new TimeSlidePair(a, b);
        var options = new TimeSlideOptions { WindowNs = w, StepNs = step, Slides = 5 };
        var sink = new CoincidenceListSink(pair);
        FastTimeSlides.Find(pair, options, sink);
        var c = Assert.Single(sink.Items);
        Assert.Equal(3, c.Slide);
        Assert.Equal(0, c.IndexA);
        Assert.Equal(0, c.IndexB); // the partner 1 ns beyond the edge at k = 2 is not there
    }

    [Fact]
    public void A_coincidence_across_the_ring_seam_is_found_by_both_finders()
    {
        const long step = 1_000_000, span = 100_000_000;
        var a = Site("AA", [500], span);                 // just after the ring start
        var b = Site("BB", [span - (2 * step) + 100], span); // moved by +2 steps it lands at span + 100 = ring position 100
        var pair = new TimeSlidePair(a, b);
        var options = new TimeSlideOptions { WindowNs = 1000, StepNs = step, Slides = 3 };
        var fast = new CoincidenceListSink(pair);
        var naive = new CoincidenceListSink(pair);
        FastTimeSlides.Find(pair, options, fast);
        NaiveTimeSlides.Find(pair, options, naive);
        Assert.Equal(2, Assert.Single(fast.Items).Slide);
        Assert.Equal(fast.Sorted(), naive.Sorted());
    }

    [Fact]
    public void Options_that_would_let_slides_wrap_onto_each_other_are_rejected()
    {
        var pair = new TimeSlidePair(Site("AA", [1], 1_000_000), Site("BB", [2], 1_000_000));
        var options = new TimeSlideOptions { WindowNs = 10, StepNs = 100_000, Slides = 5 };
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => FastTimeSlides.Find(pair, options, new CoincidenceListSink(pair)));
        Assert.Equal("Slides", ex.ParamName);
        var tooWide = options with { Slides = 1, WindowNs = 50_000 };
        Assert.Equal("StepNs", Assert.Throws<ArgumentOutOfRangeException>(() => NaiveTimeSlides.Find(pair, tooWide, new CoincidenceListSink(pair))).ParamName);
    }

    internal static long RingDistance(long d, long span)
    {
        var r = ((d % span) + span) % span;
        return r > span / 2 ? r - span : r;
    }

    internal static SiteTriggers Site(string code, long[] times, long spanNs, double snr = 6.0) =>
        SiteTriggers.Create(
            code,
            times.Select(t => new Trigger(new GpsTime(1_000_000_000_000_000_000 + t), snr)),
            [new Segment(new GpsTime(1_000_000_000_000_000_000), new GpsTime(1_000_000_000_000_000_000 + spanNs))]);

    private static (TimeSlidePair Pair, TimeSlideOptions Options) RandomCase(int seed)
    {
        var rng = new Random(seed);
        const long origin = 1_300_000_000L * GpsTime.NanosecondsPerSecond;
        var step = (long)rng.Next(200, 2000);
        var w = (long)rng.Next(0, (int)((step - 1) / 2));
        var k = rng.Next(1, 30);
        var span = (2 * ((k * step) + w)) + rng.Next(1, 20_000);
        var segA = RandomSegments(rng, span);
        var segB = RandomSegments(rng, span);
        segA[0] = segA[0] with { Start = 0 }; // so the ring starts and ends at well-known places
        segB[^1] = segB[^1] with { End = span };
        var timesA = RandomTimes(rng, segA, rng.Next(0, 120));
        var timesB = RandomTimes(rng, segB, rng.Next(0, 120));

        // triggers exactly at segment edges (a start is in, an end is out and dropped)
        timesA.AddRange(segA.SelectMany(s => new[] { s.Start, s.End, s.End - 1 }));
        timesB.AddRange(segB.SelectMany(s => new[] { s.Start, s.End, s.End - 1 }));

        // partners exactly on the window edge, some of them across the seam
        foreach (var ta in timesA.Take(40).ToList())
        {
            var kk = rng.Next(1, k + 1) * (rng.Next(2) == 0 ? 1 : -1);
            var tb = ta - (kk * step) + (rng.Next(2) == 0 ? w : -w) + (rng.Next(4) == 0 ? 1 : 0);
            timesB.Add(((tb % span) + span) % span);
        }

        timesA.Add(rng.NextInt64(0, 50));          // ring start
        timesB.Add(span - rng.NextInt64(1, 50));    // ring end
        var a = SiteTriggers.Create("AA", timesA.Select(t => new Trigger(new GpsTime(origin + t), 5 + rng.NextDouble() * 10, rng.Next(3) == 0 ? null : 1 + rng.NextDouble())), segA.Select(s => new Segment(new GpsTime(origin + s.Start), new GpsTime(origin + s.End))));
        var b = SiteTriggers.Create("BB", timesB.Select(t => new Trigger(new GpsTime(origin + t), 5 + rng.NextDouble() * 10, rng.Next(3) == 0 ? null : 1 + rng.NextDouble())), segB.Select(s => new Segment(new GpsTime(origin + s.Start), new GpsTime(origin + s.End))));
        var options = new TimeSlideOptions
        {
            WindowNs = w,
            StepNs = step,
            Slides = k,
            ChirpMassRelativeTolerance = rng.Next(3) == 0 ? 0.3 : null,
        };
        return (new TimeSlidePair(a, b), options);
    }

    private static List<(long Start, long End)> RandomSegments(Random rng, long span)
    {
        var cuts = Enumerable.Range(0, 2 * rng.Next(1, 5)).Select(_ => rng.NextInt64(0, span)).Distinct().Order().ToList();
        if (cuts.Count % 2 == 1)
        {
            cuts.RemoveAt(cuts.Count - 1);
        }

        var list = new List<(long, long)>();
        for (var i = 0; i + 1 < cuts.Count; i += 2)
        {
            list.Add((cuts[i], cuts[i + 1]));
        }

        return list.Count > 0 ? list : [(0, span)];
    }

    private static List<long> RandomTimes(Random rng, List<(long Start, long End)> segments, int count)
    {
        var list = new List<long>();
        for (var i = 0; i < count; i++)
        {
            var s = segments[rng.Next(segments.Count)];
            list.Add(rng.NextInt64(s.Start, s.End));
        }

        return list;
    }
}
