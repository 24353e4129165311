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
        var r = OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), new OverlapOptions(SimulatedPair.Coalescence(), OffSourceCount: 200));
        var (map, fit) = ChirpAnalysis.Run(SimulatedPair.A(sim), SimulatedPair.Coalescence());
        var pictures = new Dictionary<string, string>
        {
            ["overlay"] = OverlapPictures.Overlay(r, "KX", "M2"),
            ["curve"] = OverlapPictures.CorrelationCurve(r),
            ["histogram"] = OverlapPictures.OffSourceHistogram(r),
            ["map"] = TimeFrequencyPicture.Draw(map, fit, "KX"),
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
        Assert.Contains("p = ", pictures["histogram"]);
    }
}

public class TimeFrequencyPictureSizeTests
{
    [Fact]
    public void A_map_where_every_cell_is_loud_stays_under_200_kb()
    {
        var times = Enumerable.Range(0, 400).Select(i => i / 128.0).ToArray();
        var freqs = Enumerable.Range(10, 240).Select(k => k * 2.0).ToArray();
        var energy = times.Select(_ => freqs.Select(_ => 100.0).ToArray()).ToArray();
        var svg = TimeFrequencyPicture.Draw(new TimeFrequencyMap("0", times, freqs, energy, 8), null, "KX");
        Assert.True(svg.Length < 200_000, $"{svg.Length} characters");
        XDocument.Parse(svg);
    }
}
