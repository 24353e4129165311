using EventReview.Core.Environment;
using EventReview.Core.Injections;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Environment;

public class EnvironmentLookupTests
{
    private static readonly GpsTime Case = GpsTime.FromSeconds(1_300_000_000m);

    private static AuxiliaryTrigger Trig(string site, string channel, double offset, double snr = 10, double? f = null) =>
        new(site, channel, Case.AddSeconds(offset), snr, f, null);

    private static readonly Sensor[] Sensors =
    [
        new("KX", "SEIS_X", SensorKind.Seismic, "corner", null),
        new("KX", "MAG_Z", SensorKind.Magnetic, "vault", null),
        new("M2", "MAG_Z", SensorKind.Magnetic, "vault", null),
    ];

    [Fact]
    public void A_trigger_in_the_window_raises_a_concern_with_offset_from_the_site_arrival()
    {
        var arrivals = new Dictionary<string, GpsTime> { ["KX"] = Case.AddSeconds(0.004) };
        // Background of the same channel: 5 more triggers within the hour, one far outside it.
        var triggers = new List<AuxiliaryTrigger> { Trig("KX", "SEIS_X", 0.304) };
        triggers.AddRange(new[] { 100, 200, -300, -900, 1700 }.Select(o => Trig("KX", "SEIS_X", o)));
        triggers.Add(Trig("KX", "SEIS_X", 5000));
        var input = new EnvironmentLookupInput(Case, arrivals, ["KX", "M2"], [], triggers, Sensors);

        var report = EnvironmentLookup.Run(input);

        var hit = Assert.Single(report.Hits);
        Assert.Equal(0.300, hit.OffsetSeconds, 1e-9);
        Assert.Equal("seismic", hit.Kind);
        Assert.Equal(6 / 3600.0, hit.ChannelRateHz, 1e-15);
        // Poisson formula: 1 - exp(-2 w R)
        Assert.Equal(1 - Math.Exp(-2 * 1.0 * 6 / 3600.0), hit.ChanceProbability, 1e-15);
        Assert.Null(hit.Safe);
        Assert.Equal("concern", report.Verdict);
        Assert.Equal("concern", report.Sites.Single(s => s.Site == "KX").Verdict);
        var m2 = report.Sites.Single(s => s.Site == "M2");
        Assert.Equal("clear", m2.Verdict);
        Assert.False(m2.FromArrival);
        Assert.Equal(Case.Seconds, m2.Gps);
    }

    [Fact]
    public void Per_kind_windows_and_unsafe_channels_are_respected()
    {
        var triggers = new[] { Trig("KX", "SEIS_X", 1.5), Trig("KX", "MAG_Z", 0.2) };
        var safety = new VetoSafetyReport([new ChannelSafety("KX", "MAG_Z", 50, 40, 0.1, 1e-30, false, 0.001)], 1, 1e-3, []);
        var input = new EnvironmentLookupInput(Case, new Dictionary<string, GpsTime>(), ["KX"], [], triggers, Sensors, safety);
        var options = new EnvironmentLookupOptions(WindowSecondsByKind: new Dictionary<SensorKind, double> { [SensorKind.Seismic] = 2.0 });

        var report = EnvironmentLookup.Run(input, options);

        Assert.Equal(2, report.Hits.Count);
        Assert.Equal(2.0, report.Hits.Single(h => h.Channel == "SEIS_X").WindowSeconds);
        var mag = report.Hits.Single(h => h.Channel == "MAG_Z");
        Assert.False(mag.Safe);
        Assert.False(mag.Concern);
        Assert.True(report.Hits.Single(h => h.Channel == "SEIS_X").Concern);
    }

    [Fact]
    public void Only_unsafe_hits_and_no_segment_give_a_clear_verdict()
    {
        var triggers = new[] { Trig("KX", "MAG_Z", 0.2) };
        var safety = new VetoSafetyReport([new ChannelSafety("KX", "MAG_Z", 50, 40, 0.1, 1e-30, false, 0.001)], 1, 1e-3, []);
        var segments = new[] { new DataQualitySegment("KX", "FAR_AWAY", Case.AddSeconds(10), Case.AddSeconds(20), null) };
        var input = new EnvironmentLookupInput(Case, new Dictionary<string, GpsTime>(), ["KX"], segments, triggers, Sensors, safety);
        var report = EnvironmentLookup.Run(input);
        Assert.Equal("clear", report.Verdict);
        Assert.Empty(report.Segments);
    }

    [Fact]
    public void An_active_data_quality_segment_raises_a_concern()
    {
        var segments = new[] { new DataQualitySegment("M2", "WIND_HIGH", Case.AddSeconds(-50), Case.AddSeconds(0.5), "gusts") };
        var input = new EnvironmentLookupInput(Case, new Dictionary<string, GpsTime>(), ["KX", "M2"], segments, [], Sensors);
        var report = EnvironmentLookup.Run(input);
        var seg = Assert.Single(report.Segments);
        Assert.Equal("WIND_HIGH", seg.Flag);
        Assert.Equal("concern", report.Sites.Single(s => s.Site == "M2").Verdict);
        Assert.Equal("concern", report.Verdict);
    }

    [Fact]
    public void Same_kind_hits_at_two_sites_within_the_light_travel_window_are_reported()
    {
        var arrivals = new Dictionary<string, GpsTime> { ["KX"] = Case, ["M2"] = Case.AddSeconds(0.006) };
        var triggers = new[] { Trig("KX", "MAG_Z", 0.100), Trig("M2", "MAG_Z", 0.104), Trig("KX", "SEIS_X", 0.101) };
        var input = new EnvironmentLookupInput(Case, arrivals, [], [], triggers, Sensors);
        var report = EnvironmentLookup.Run(input, new EnvironmentLookupOptions(LightTravelWindowSeconds: 0.010));
        var c = Assert.Single(report.Coincidences);
        Assert.Equal("magnetic", c.Kind);
        Assert.Equal(("KX", "M2"), (c.SiteA, c.SiteB));
        Assert.Equal(0.004, c.SeparationSeconds, 1e-6);
        Assert.Equal(0.098, report.Hits.Single(h => h.Site == "M2").OffsetSeconds, 1e-9);
    }

    [Fact]
    public void Veto_safety_marks_a_channel_coupled_to_injections_unsafe_and_an_uncoupled_one_safe()
    {
        var random = new Random(7);
        var start = 1_300_000_000.0;
        const double span = 1e6;
        var injections = Enumerable.Range(0, 100)
            .Select(i => start + 5000 + (i * 9000.0) + (random.NextDouble() * 100))
            .Select(t => new InjectionRecord("KX", GpsTime.FromSeconds(t), GpsTime.FromSeconds(t + 0.2), "burst", "w.txt", InjectionStatus.Performed))
            .ToList();
        var triggers = new List<AuxiliaryTrigger>();
        foreach (var channel in new[] { "COUPLED", "UNCOUPLED" })
        {
            var t = start;
            while ((t += -Math.Log(1 - random.NextDouble()) / 0.002) < start + span)
            {
                triggers.Add(new AuxiliaryTrigger("KX", channel, GpsTime.FromSeconds(t), 6, null, null));
            }
        }

        // The coupled channel sees 60 % of the injections, 0.1 s after their start.
        triggers.AddRange(injections.Where((_, i) => i % 5 < 3)
            .Select(inj => new AuxiliaryTrigger("KX", "COUPLED", inj.Start.AddSeconds(0.1), 20, null, null)));
        // An aborted injection must not count.
        injections.Add(new InjectionRecord("KX", GpsTime.FromSeconds(start + 10), GpsTime.FromSeconds(start + 10), "burst", "w", InjectionStatus.Aborted));

        var report = VetoSafety.Evaluate(triggers, injections, new VetoSafetyOptions(WindowSeconds: 0.5, LiveTimeSeconds: span));

        var coupled = report.Channels.Single(c => c.Channel == "COUPLED");
        var uncoupled = report.Channels.Single(c => c.Channel == "UNCOUPLED");
        Assert.Equal(100, coupled.Injections);
        Assert.InRange(coupled.Coincident, 60, 65);
        Assert.False(coupled.Safe);
        Assert.True(uncoupled.Safe);
        // Expected count = R x sum(2 w + duration) = R x 100 x 1.2 s.
        Assert.Equal(1.0, uncoupled.Expected / (uncoupled.RateHz * 100 * 1.2), 1e-6); // durations are rounded to the nanosecond
        Assert.Equal(EventReview.Core.Statistics.Poisson.AtLeast(uncoupled.Coincident, uncoupled.Expected), uncoupled.Probability, 1e-15);
    }

    [Fact]
    public void Veto_safety_expected_count_is_n_inj_times_two_w_r_for_short_injections()
    {
        var t0 = GpsTime.FromSeconds(1000m);
        var triggers = Enumerable.Range(0, 10).Select(i => new AuxiliaryTrigger("KX", "C", t0.AddSeconds(i * 100), 5, null, null)).ToList();
        var injections = Enumerable.Range(0, 4).Select(i => new InjectionRecord("KX", t0.AddSeconds(50 + (i * 200)), t0.AddSeconds(50 + (i * 200)), "b", "w", InjectionStatus.Performed)).ToList();
        var report = VetoSafety.Evaluate(triggers, injections, new VetoSafetyOptions(WindowSeconds: 2, LiveTimeSeconds: 1000));
        var c = Assert.Single(report.Channels);
        Assert.Equal(4 * 2 * 2 * (10 / 1000.0), c.Expected, 1e-12);
        Assert.Equal(0, c.Coincident);
        Assert.Equal(1.0, c.Probability);
        Assert.True(c.Safe);
    }

    [Fact]
    public void Veto_safety_leaves_a_channel_untested_when_its_rate_cannot_be_measured()
    {
        var t0 = GpsTime.FromSeconds(1000m);
        var triggers = new[] { new AuxiliaryTrigger("KX", "C", t0, 5, null, null) };
        var injections = new[] { new InjectionRecord("KX", t0, t0, "b", "w", InjectionStatus.Performed) };
        var c = Assert.Single(VetoSafety.Evaluate(triggers, injections).Channels);
        Assert.Equal(1, c.Coincident);
        Assert.Null(c.Safe);
        Assert.Contains("live time", c.Note);
    }

    [Fact]
    public void Hits_outside_the_observing_segments_are_reported_as_warnings()
    {
        var triggers = new[] { Trig("KX", "SEIS_X", 0.2) };
        var observing = new[] { new DataQualitySegment("KX", "OBSERVING", Case.AddSeconds(-100), Case.AddSeconds(0.1), null) };
        var input = new EnvironmentLookupInput(Case, new Dictionary<string, GpsTime>(), ["KX"], [], triggers, Sensors, ObservingSegments: observing);
        Assert.Contains(EnvironmentLookup.Run(input).Warnings, w => w.Contains("outside every observing segment"));
    }
}
