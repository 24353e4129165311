using System.Xml.Linq;
using EventReview.Core.Environment;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Environment;

public class EnvironmentTimelineSvgTests
{
    [Fact]
    public void Timeline_is_well_formed_svg_with_a_marker_per_hit_and_a_bar_per_segment()
    {
        var t = GpsTime.FromSeconds(1000m);
        var triggers = new[]
        {
            new AuxiliaryTrigger("KX", "env/seismometer<x>", t.AddSeconds(0.2), 12, null, null),
            new AuxiliaryTrigger("KX", "env/seismometer<x>", t.AddSeconds(-0.5), 7, null, null),
            new AuxiliaryTrigger("MV", "env/magnetometer", t.AddSeconds(0.1), 30, null, null),
        };
        var segs = new[] { new DataQualitySegment("MV", "gusty-wind", t.AddSeconds(-10), t.AddSeconds(0.3), null) };
        var report = EnvironmentLookup.Run(new EnvironmentLookupInput(t, new Dictionary<string, GpsTime>(), ["KX", "MV"], segs, triggers, []));

        var svg = EnvironmentTimelineSvg.Render(report, 1.0);

        var doc = XDocument.Parse(svg);
        XNamespace ns = "http://www.w3.org/2000/svg";
        Assert.Equal(3, doc.Descendants(ns + "circle").Count());
        Assert.Contains(doc.Descendants(ns + "text"), e => e.Value.Contains("env/seismometer<x>"));
        Assert.Contains(doc.Descendants(ns + "text"), e => e.Value == "SNR 30");
        Assert.Contains("3 trigger(s) and 1 data-quality segment(s)", svg);
        Assert.Contains("overall verdict concern", svg);
    }
}
