using System.Diagnostics;
using System.Text;
using EventReview.Core.Dossier;
using EventReview.Core.Plots;
using EventReview.Dossier.Plots;
using PdfSharp.Pdf;

namespace EventReview.Dossier.Tests;

/// <summary>The committee's summary.pdf, read back with poppler's pdftotext (an outside reader, installed by test.sh).</summary>
public class DossierPdfTests
{
    internal static async Task<string> PdfToTextAsync(byte[] pdf, bool layout = false)
    {
        var path = Path.Combine(Path.GetTempPath(), "er-dossier-" + Guid.NewGuid().ToString("N") + ".pdf");
        await File.WriteAllBytesAsync(path, pdf);
        try
        {
            var psi = new ProcessStartInfo("pdftotext", layout ? ["-layout", path, "-"] : [path, "-"]) { RedirectStandardOutput = true, UseShellExecute = false };
            using var p = Process.Start(psi)!;
            var text = await p.StandardOutput.ReadToEndAsync();
            await p.WaitForExitAsync();
            Assert.Equal(0, p.ExitCode);
            return text;
        }
        finally
        {
            File.Delete(path);
        }
    }

    private static async Task<string> SummaryTextAsync(SampleCase s) =>
        await PdfToTextAsync(DossierExporterTests.Entries(await DossierExporterTests.ExportAsync(s))["summary.pdf"]);

    [Fact]
    public async Task The_cover_shows_the_case_its_decision_status_and_headline_numbers()
    {
        var text = await SummaryTextAsync(SampleCase.Build());
        Assert.Contains("ER-C-0314", text);
        Assert.Contains("Decision status", text);
        Assert.Contains("Open: the review is", text);
        Assert.Contains("Network SNR", text);
        Assert.Contains("Check runs recorded: 2", text);
        Assert.Matches(@"= \d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2} UTC, search", Flat(text)); // the candidate time in UTC to the second beside GPS
        Assert.Matches(@"Opened \d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2} UTC \(GPS \d+ s\)", Flat(text));
        Assert.Contains("Figures: 3 (the review progress and every check picture)", text);
    }

    [Fact]
    public async Task Sections_show_item_titles_signers_with_statements_and_times_to_the_second_in_UTC_and_GPS()
    {
        var s = SampleCase.Build();
        var text = await SummaryTextAsync(s);
        var doc = DossierBuilder.Build(s.Case, s.Sites, s.Snapshots);
        var sign = doc.Items.Single(i => i.Key == "timing.delay").SignOffs.Single();
        Assert.Contains("Arrival delays", text);
        Assert.Contains("Section 1.", text);
        Assert.Contains("Statement: Delays checked.", text);
        Assert.Contains(new DateTime(sign.SignedAtUtcTicks, DateTimeKind.Utc).ToString("yyyy-MM-dd HH:mm:ss", System.Globalization.CultureInfo.InvariantCulture) + " UTC", text);
        Assert.Contains("GPS 1615248600 s", text);
        Assert.Contains("STALE since", text);
        Assert.DoesNotContain(sign.SignedAtUtc, text); // not the 7-digit stored form
    }

    [Fact]
    public async Task Figures_are_numbered_with_captions_and_drawn_with_their_axis_text()
    {
        var text = await SummaryTextAsync(SampleCase.Build());
        Assert.Contains("Figure 1. Review progress:", text);
        Assert.Contains("Figure 2. Delay between the sites against the light travel time", text);
        Assert.Contains("delay (ms)", text);
        Assert.Contains("measured delay ± 1σ", text);
        Assert.Contains("Figure 3. pictures/2.svg (drawn before the plot model", text); // a picture the model did not write is named, not redrawn
    }

    [Fact]
    public async Task Every_figure_number_and_its_caption_are_in_the_text_once_and_in_order()
    {
        var s = SampleCase.Build();
        var doc = DossierBuilder.Build(s.Case, s.Sites, s.Snapshots);
        var text = Flat(await SummaryTextAsync(s));
        var expected = new List<string> { "Figure 1. " + Flat(DossierProgress.Figure(doc).Caption) };
        foreach (var (key, n) in DossierPdfSections.FigureNumbers(doc).OrderBy(kv => kv.Value))
        {
            var caption = PlotSvg.Read(doc.PictureSvgs[key.Picture])?.Caption;
            expected.Add($"Figure {n}. " + Flat(caption ?? key.Picture));
        }

        int at = 0;
        for (int k = 0; k < expected.Count; k++)
        {
            int found = text.IndexOf(expected[k], at, StringComparison.Ordinal);
            Assert.True(found >= 0, $"'{expected[k]}' not found after position {at}");
            Assert.Equal(-1, text.IndexOf($"Figure {k + 1}. ", found + 1, StringComparison.Ordinal));
            at = found + 1;
        }

        Assert.DoesNotContain($"Figure {expected.Count + 1}. ", text);
    }

    /// <summary>Text with every run of white space as one space (pdftotext breaks wrapped captions into lines).</summary>
    private static string Flat(string text) => System.Text.RegularExpressions.Regex.Replace(text, @"\s+", " ");

    [Fact]
    public void Matrix_headings_never_break_inside_a_word()
    {
        string[] kinds = ["background", "chain", "configuration", "environment", "injections", "overlap", "timing"];
        // A column 40 units wide that fits 7 characters: the long words are shortened with a dot, each heading stays distinct.
        var headers = DossierPdf.MatrixHeaders(kinds, h => h.Length <= 7);
        Assert.Equal(["backgr.", "chain", "config.", "enviro.", "inject.", "overlap", "timing"], headers);
        Assert.Equal(headers.Count, headers.Distinct().Count());
        var clash = DossierPdf.MatrixHeaders(["environmentA", "environmentB"], h => h.Length <= 5);
        Assert.Equal(2, clash.Distinct().Count());
    }

    [Fact]
    public async Task The_verdict_matrix_the_configuration_and_the_integrity_facts_are_there()
    {
        var s = SampleCase.Build();
        var text = await SummaryTextAsync(s);
        var doc = DossierBuilder.Build(s.Case, s.Sites, s.Snapshots);
        Assert.Contains("Verdict matrix", text);
        Assert.Contains("consistent", text);
        Assert.Contains("daq.firmware = 4.2.1", text);
        Assert.Contains(doc.ChainHead, text);
        Assert.Contains("carry no record-key signature", text); // the sample's timeline is written without a record key
    }

    [Fact]
    public async Task A_keyed_record_names_its_signing_key_fingerprint()
    {
        var s = SampleCase.Build();
        var doc = DossierBuilder.Build(s.Case, s.Sites, s.Snapshots);
        var keyed = doc with { Timeline = doc.Timeline.Select(t => t with { KeyId = "sha256:0123456789abcdef" }).ToList() };
        var text = await PdfToTextAsync(DossierPdf.Render(keyed));
        Assert.Contains("Signing-key fingerprint of the record", text);
        Assert.Contains("sha256:0123456789abcdef", text);
        Assert.DoesNotContain("carry no record-key signature", text);
    }

    [Fact]
    public async Task The_pdf_back_end_draws_every_text_of_the_svg_drawing()
    {
        var svg = PlotSvg.Write(new PlotFigure("both back ends", new PlotAxis("x (s)", 0, 10), new PlotAxis("y (Hz)", 10, 1000, AxisScale.Log),
            [new PlotHeatMap([2.5, 7.5], [20, 200], [[1.0, 2], [3, 4]])]) { ColourBar = new ColourScale("power (dimensionless)", 0, 4) });
        var drawing = PlotSvg.Read(svg)!;
        DejaVuFontResolver.EnsureInstalled();
        using var pdf = new PdfDocument();
        var page = pdf.AddPage();
        using (var gfx = PdfSharp.Drawing.XGraphics.FromPdfPage(page))
        {
            PlotPdf.Draw(gfx, drawing, 40, 40, 500);
        }

        using var ms = new MemoryStream();
        pdf.Save(ms, false);
        var text = await PdfToTextAsync(ms.ToArray());
        foreach (var t in drawing.Marks.OfType<TextMark>())
        {
            Assert.Contains(t.Text.Replace("⁻", "-", StringComparison.Ordinal), text.Replace("⁻", "-", StringComparison.Ordinal));
        }
    }

    [Fact]
    public async Task Index_html_numbers_the_same_figures_with_the_same_captions()
    {
        var html = Encoding.UTF8.GetString(DossierExporterTests.Entries(await DossierExporterTests.ExportAsync(SampleCase.Build()))["index.html"]);
        Assert.Contains("<figcaption>Figure 1. Review progress:", html);
        Assert.Contains("<figcaption>Figure 2. Delay between the sites against the light travel time", html);
        Assert.Contains("<figcaption>Figure 3. pictures/2.svg", html);
        Assert.Contains("@media print", html);
    }
}
