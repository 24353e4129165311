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

    [Fact]
    public void A_long_channel_name_widens_the_label_column_instead_of_running_into_the_plot()
    {
        var t = GpsTime.FromSeconds(1000m);
        const string Long = "KX/env/magnetometer-electronics-vault-second-rack/x";
        var triggers = new[]
        {
            new AuxiliaryTrigger("KX", Long, t.AddSeconds(0.1), 9, null, null),
            new AuxiliaryTrigger("MV", "MV/env/mic", t.AddSeconds(0.1), 9, null, null),
        };
        var report = EnvironmentLookup.Run(new EnvironmentLookupInput(t, new Dictionary<string, GpsTime>(), ["KX", "MV"], [], triggers, []));

        var doc = XDocument.Parse(EnvironmentTimelineSvg.Render(report, 1.0));
        XNamespace ns = "http://www.w3.org/2000/svg";

        // The plot starts where its row lines start. Lower-case DejaVu Sans at 11 px averages about 6.5 px a character (our
        // estimate, measured on the rendered demo), so the label drawn from x = 4 needs 6.5 px per character.
        var label = doc.Descendants(ns + "text").Single(e => e.Value.Contains(Long, StringComparison.Ordinal)).Value;
        var plotLeft = doc.Descendants(ns + "line").Select(l => (double)l.Attribute("x1")!).Min();
        Assert.True(plotLeft >= 4 + (6.5 * label.Length), $"plot starts at {plotLeft} px, label of {label.Length} characters");

        // The plot keeps its width (600 px plus the 20 px right margin) whatever the label column.
        var svgWidth = (double)doc.Root!.Attribute("width")!;
        Assert.Equal(600 + 20, svgWidth - plotLeft, 6);
    }
}
