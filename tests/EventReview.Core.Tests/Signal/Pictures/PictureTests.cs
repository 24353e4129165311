using System.Xml.Linq;
using EventReview.Core.Signal.Overlap;
using EventReview.Core.Signal.Pictures;
using EventReview.Core.Signal.TimeFrequency;

namespace EventReview.Core.Tests.Signal.Pictures;

public class PictureTests
{
    [Fact]
    public void Overlap_and_time_frequency_pictures_are_small_well_formed_svg_with_labels_and_caption()
    {
        var sim = SimulatedPair.Make(4, snr: 30);
        var r = OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), new OverlapOptions(SimulatedPair.Coalescence(), 0.2, SimulatedPair.MaxLagSeconds, OffSourceCount: 200));
        var q = ChirpAnalysis.Run(SimulatedPair.A(sim), SimulatedPair.Coalescence());
        var pictures = new Dictionary<string, string>
        {
            ["overlay"] = OverlapPictures.Overlay(r, "KX", "MV"),
            ["curve"] = OverlapPictures.CorrelationCurve(r),
            ["histogram"] = OverlapPictures.OffSourceHistogram(r),
            ["map"] = QMapPicture.Draw(q.Map, q.Fit, "KX"),
            ["zoom"] = QMapPicture.Draw(q.Zoom, null, "KX", "last part of the signal"),
        };
        foreach (var (name, svg) in pictures)
        {
            var doc = XDocument.Parse(svg);
            Assert.Equal("svg", doc.Root!.Name.LocalName);
            Assert.True(svg.Length < 200_000, $"{name}: {svg.Length} characters");
            File.WriteAllText(Path.Combine(Path.GetTempPath(), $"er-picture-{name}.svg"), svg);
            var texts = doc.Descendants().Where(e => e.Name.LocalName == "text").Select(e => e.Value).ToList();
            Assert.True(texts.Count(s => s.EndsWith(")")) >= 2, name); // two axis labels with units in brackets
            Assert.DoesNotContain(",", string.Join(" ", doc.Descendants().Where(e => e.Name.LocalName == "rect").Select(e => (string?)e.Attribute("width") ?? "")));
        }

        Assert.Contains("chirp mass", pictures["map"]);
        Assert.Contains("power / median", pictures["map"]);
        Assert.Contains("log scale", pictures["zoom"]);
        foreach (var svg in pictures.Values)
        {
            // 12 px minimum text: the root sets 12 and no element sets a smaller size
            Assert.DoesNotContain("font-size=\"1", svg.Replace("font-size=\"12\"", string.Empty, StringComparison.Ordinal).Replace("font-size=\"13\"", string.Empty, StringComparison.Ordinal).Replace("font-size=\"14\"", string.Empty, StringComparison.Ordinal));
        }
        Assert.Contains("p = ", pictures["histogram"]);
    }
}

public class QMapPictureSizeTests
{
    [Fact]
    public void A_map_where_every_cell_is_loud_stays_under_200_kb()
    {
        var times = Enumerable.Range(0, 240).Select(i => i / 128.0).ToArray();
        var freqs = Enumerable.Range(0, 120).Select(k => 20 * Math.Pow(25, k / 119.0)).ToArray();
        var random = new Random(1);
        var energy = times.Select(_ => freqs.Select(_ => 20 + (80 * random.NextDouble())).ToArray()).ToArray();
        var q = times.Select(_ => freqs.Select(_ => 8.0).ToArray()).ToArray();
        var svg = QMapPicture.Draw(new QMap("0", times, freqs, energy, q, [8.0], 0.2), null, "KX");
        Assert.True(svg.Length < 200_000, $"{svg.Length} characters");
        XDocument.Parse(svg);
    }
}
