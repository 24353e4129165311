using System.Xml.Linq;
using EventReview.Core.Antenna;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Time;
using EventReview.Core.Timing;

namespace EventReview.Core.Tests.Timing;

public class SkyMapSvgTests
{
    [Fact]
    public void The_map_is_well_formed_svg_with_rings_solutions_cells_and_a_caption()
    {
        Site[] sites =
        [
            new("KX", "Site KX", 44, -101, 100, 62, 152, 1e-4),
            new("MV", "Site MV", 19, -71, 0, 117, 207, 1e-4),
            new("TQ", "Site TQ", -12, -52, 400, 148, 238, 2e-4),
        ];
        var t0 = GpsTime.FromSeconds(1400000000m);
        var n = new Vector3(0.2, -0.7, 0.5).Normalized();
        var arrivals = NetworkProjection.Project(sites, n, 0).Select(p => new SiteArrival(p.Code, t0.AddSeconds(p.DelaySeconds))).ToArray();
        var result = TimingCheck.Run(sites, arrivals, TimingOptions.Default);
        var cells = AntennaSkyRegion.AllowedCells(sites[0], sites[1], new AntennaObservation(-1, 1.0), result.GmstDegrees, 10);

        var svg = SkyMapSvg.Render(sites, result, cells);
        var doc = XDocument.Parse(svg);
        XNamespace ns = "http://www.w3.org/2000/svg";

        Assert.Equal(3, doc.Descendants(ns + "g").Count(g => (string?)g.Attribute("class") == "ring"));
        Assert.Equal(2, doc.Descendants(ns + "g").Count(g => (string?)g.Attribute("class") == "solution"));
        Assert.Equal(cells.Count, doc.Descendants(ns + "rect").Count(r => (string?)r.Attribute("class") == "allowed"));
        Assert.Contains("mean-of-date", svg);
        Assert.Contains("declination (degrees)", svg);
        Assert.DoesNotContain("<script", svg);
        Assert.DoesNotContain("http://www.w3.org/2000/svg\"", svg.Replace("xmlns=\"http://www.w3.org/2000/svg\"", string.Empty));
    }
}
