using EventReview.Core.Environment;
using EventReview.Core.Injections;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Tests.Environment;

public class EnvironmentLookupTests
{
    private static readonly GpsTime Case = GpsTime.FromSeconds(1_300_000_000m);

    private static AuxiliaryTrigger Trig(string site, string channel, double offset, double snr = 10, double? f = null) =>
        new(site, channel, Case.AddSeconds(offset), snr, f, null);

    // A safety report in which KX/env/magnetometer-vault/z responded to 40 of 50 injections (made by hand, not computed).
    private static VetoSafetyReport UnsafeMagnetometer() => new(
        [new ChannelSafety("KX", "env/magnetometer-vault/z", 50, 40, 0.1, 0.002, 1e-30, false, 0.001, 10, 1e4, 20, 2e-3, new Judgement(Verdict.VetoUnsafe, "by hand"))],
        1, 1e-3, 1, new Judgement(Verdict.VetoUnsafe, "by hand"), []);

    private static readonly Sensor[] Sensors =
    [
        new("KX", "env/seismometer-hall/x", SensorKind.Seismic, "corner", null),
        new("KX", "env/magnetometer-vault/z", SensorKind.Magnetic, "vault", null),
        new("MV", "env/magnetometer-vault/z", SensorKind.Magnetic, "vault", null),
    ];

    [Fact]
    public void A_trigger_in_the_window_raises_a_concern_with_offset_from_the_site_arrival()
    {
        var arrivals = new Dictionary<string, GpsTime> { ["KX"] = Case.AddSeconds(0.004) };
        // Background of the same channel: 5 more triggers within the hour, one far outside it.
        var triggers = new List<AuxiliaryTrigger> { Trig("KX", "env/seismometer-hall/x", 0.304) };
        triggers.AddRange(new[] { 100, 200, -300, -900, 1700 }.Select(o => Trig("KX", "env/seismometer-hall/x", o)));
        triggers.Add(Trig("KX", "env/seismometer-hall/x", 5000));
        var input = new EnvironmentLookupInput(Case, arrivals, ["KX", "MV"], [], triggers, Sensors);

        var report = EnvironmentLookup.Run(input);

        var hit = Assert.Single(report.Hits);
        Assert.Equal(0.300, hit.OffsetSeconds, 1e-9);
        Assert.Equal("seismic", hit.Kind);
        Assert.Equal(6 / 3600.0, hit.ChannelRateHz, 1e-15);
        // Poisson formula: 1 - exp(-2 w R)
        Assert.Equal(1 - Math.Exp(-2 * 1.0 * 6 / 3600.0), hit.ChanceProbability, 1e-15);
        Assert.Null(hit.Safe);
        Assert.Equal("concern", report.Judgement.Word);
        Assert.Equal("concern", report.Sites.Single(s => s.Site == "KX").Judgement.Word);
        var mv = report.Sites.Single(s => s.Site == "MV");
        Assert.Equal("clear", mv.Judgement.Word);
        Assert.False(mv.FromArrival);
        Assert.Equal(Case.Seconds, mv.Gps);
    }

    [Fact]
    public void Per_kind_windows_and_unsafe_channels_are_respected()
    {
        var triggers = new[] { Trig("KX", "env/seismometer-hall/x", 1.5), Trig("KX", "env/magnetometer-vault/z", 0.2) };
        var safety = UnsafeMagnetometer();
        var input = new EnvironmentLookupInput(Case, new Dictionary<string, GpsTime>(), ["KX"], [], triggers, Sensors, safety);
        var options = new EnvironmentLookupOptions(WindowSecondsByKind: new Dictionary<SensorKind, double> { [SensorKind.Seismic] = 2.0 });

        var report = EnvironmentLookup.Run(input, options);

        Assert.Equal(2, report.Hits.Count);
        Assert.Equal(2.0, report.Hits.Single(h => h.Channel == "env/seismometer-hall/x").WindowSeconds);
        var mag = report.Hits.Single(h => h.Channel == "env/magnetometer-vault/z");
        Assert.False(mag.Safe);
        Assert.False(mag.Concern);
        Assert.True(report.Hits.Single(h => h.Channel == "env/seismometer-hall/x").Concern);
    }

    [Fact]
    public void Only_unsafe_hits_and_no_segment_give_a_clear_verdict()
    {
        var triggers = new[] { Trig("KX", "env/magnetometer-vault/z", 0.2) };
        var safety = UnsafeMagnetometer();
        var segments = new[] { new DataQualitySegment("KX", "calibration-tone-paused", Case.AddSeconds(10), Case.AddSeconds(20), null) };
        var input = new EnvironmentLookupInput(Case, new Dictionary<string, GpsTime>(), ["KX"], segments, triggers, Sensors, safety);
        var report = EnvironmentLookup.Run(input);
        Assert.Equal("clear", report.Judgement.Word);
        Assert.Empty(report.Segments);
    }

    [Fact]
    public void An_active_data_quality_segment_raises_a_concern()
    {
        var segments = new[] { new DataQualitySegment("MV", "gusty-wind", Case.AddSeconds(-50), Case.AddSeconds(0.5), "gusts") };
        var input = new EnvironmentLookupInput(Case, new Dictionary<string, GpsTime>(), ["KX", "MV"], segments, [], Sensors);
        var report = EnvironmentLookup.Run(input);
        var seg = Assert.Single(report.Segments);
        Assert.Equal("gusty-wind", seg.Flag);
        Assert.Equal("concern", report.Sites.Single(s => s.Site == "MV").Judgement.Word);
        Assert.Equal("concern", report.Judgement.Word);
    }

    [Fact]
    public void Same_kind_hits_at_two_sites_within_the_light_travel_window_are_reported()
    {
        var arrivals = new Dictionary<string, GpsTime> { ["KX"] = Case, ["MV"] = Case.AddSeconds(0.006) };
        var triggers = new[] { Trig("KX", "env/magnetometer-vault/z", 0.100), Trig("MV", "env/magnetometer-vault/z", 0.104), Trig("KX", "env/seismometer-hall/x", 0.101) };
        var input = new EnvironmentLookupInput(Case, arrivals, [], [], triggers, Sensors);
        var report = EnvironmentLookup.Run(input, new EnvironmentLookupOptions(LightTravelWindowSeconds: 0.013));
        var c = Assert.Single(report.Coincidences);
        Assert.Equal("magnetic", c.Kind);
        Assert.Equal(("KX", "MV"), (c.SiteA, c.SiteB));
        Assert.Equal(0.004, c.SeparationSeconds, 1e-6);
        Assert.Equal(0.098, report.Hits.Single(h => h.Site == "MV").OffsetSeconds, 1e-9);
    }

    [Fact]
    public void Hits_outside_the_observing_segments_are_reported_as_warnings()
    {
        var triggers = new[] { Trig("KX", "env/seismometer-hall/x", 0.2) };
        var observing = new[] { new DataQualitySegment("KX", "observing", Case.AddSeconds(-100), Case.AddSeconds(0.1), null) };
        var input = new EnvironmentLookupInput(Case, new Dictionary<string, GpsTime>(), ["KX"], [], triggers, Sensors, ObservingSegments: observing);
        Assert.Contains(EnvironmentLookup.Run(input).Warnings, w => w.Contains("outside every observing segment"));
    }
}
