using System.Globalization;
using EventReview.Core.Dossier;
using PdfSharp.Drawing;
using PdfSharp.Pdf;

namespace EventReview.Dossier;

/// <summary>
/// Writes <c>summary.pdf</c>: a few A4 pages with the case summary, the item table (state, verdict, signers, stale marks)
/// and the configuration freeze. Deterministic for a given document: creation and modification dates are the case's
/// last update time, and the random ids PDFsharp writes are replaced by values derived from the chain head
/// (<see cref="PdfStabilizer"/>).
/// </summary>
public static class DossierPdf
{
    private const double Margin = 50;
    private const double LineHeight = 14;

    /// <summary>Renders the PDF bytes of <paramref name="doc"/>.</summary>
    public static byte[] Render(DossierDocument doc)
    {
        ArgumentNullException.ThrowIfNull(doc);
        DejaVuFontResolver.EnsureInstalled();
        using var pdf = new PdfDocument();
        var stamp = new DateTime(doc.Case.UpdatedAtUtcTicks, DateTimeKind.Utc);
        pdf.Info.Title = "Review dossier " + doc.Case.CandidateId;
        pdf.Info.Subject = "Summary of the review of candidate " + doc.Case.CandidateId;
        pdf.Info.Creator = $"{doc.Generator.Name} {doc.Generator.Version}";
        pdf.Info.CreationDate = stamp;
        pdf.Info.ModificationDate = stamp;
        var writer = new PageWriter(pdf);
        var c = doc.Case;
        writer.Title($"Review dossier: {c.CandidateId}");
        writer.Line($"GPS time {c.Gps} s   search {c.Search}   state {c.State}" + (c.Outcome is null ? string.Empty : $"   outcome {c.Outcome}"));
        writer.Line($"Coordinator {c.CoordinatorName}   checklist {c.ChecklistName} v{c.ChecklistVersion}");
        writer.Line(string.Create(CultureInfo.InvariantCulture, $"Network SNR {c.NetworkSnr:F2}   items {c.ItemCount}, signed {c.SignedItemCount}, stale {c.StaleItemCount}"));
        writer.Line($"Opened {c.CreatedAtUtc}   last change {c.UpdatedAtUtc}");
        foreach (var a in doc.Arrivals)
        {
            writer.Line(string.Create(CultureInfo.InvariantCulture, $"  arrival at {a.SiteCode}: GPS {a.ArrivalGps} s, SNR {a.Snr:F2}"));
        }

        writer.Wrap(c.Summary);
        if (c.ClosingStatement is not null)
        {
            writer.Wrap("Decision: " + c.ClosingStatement);
        }

        writer.Heading("Items");
        writer.Row(true, "Item", "State", "Verdict", "Signed by");
        foreach (var i in doc.Items)
        {
            var signers = string.Join(", ", i.SignOffs.Select(s => s.SignerName + (s.IsStale ? " (stale)" : string.Empty)));
            writer.Row(false, i.Key, i.State, i.LatestVerdict ?? "-", signers.Length == 0 ? "-" : signers);
        }

        var frozen = doc.Configurations.Where(s => s.IsFrozen).ToList();
        if (doc.Configurations.Count > 0)
        {
            writer.Heading("Configuration");
            foreach (var s in frozen)
            {
                writer.Line($"{s.SiteCode} frozen {s.FreezeFromUtc} to {s.FreezeUntilUtc} by {s.FrozenByName}: {s.Items.Count} items");
                writer.Line($"  fingerprint {s.Fingerprint}");
            }

            foreach (var s in doc.Configurations.Where(s => s.Drift is not null))
            {
                writer.Wrap($"{s.SiteCode} snapshot '{s.Label}' ({s.CapturedAtUtc}): {s.Drift!.Verdict}. {s.Drift.Summary}");
            }
        }

        writer.Heading("Integrity");
        writer.Line($"Timeline entries {doc.Timeline.Count}; chain head");
        writer.Line("  " + doc.ChainHead);
        writer.Line("Verify offline: eventreview dossier verify <file.zip>");
        writer.Finish();

        using var ms = new MemoryStream();
        pdf.Save(ms, false);
        return PdfStabilizer.Stabilize(ms.ToArray(), doc.Case.CandidateId + "/" + doc.ChainHead);
    }

    private sealed class PageWriter(PdfDocument pdf)
    {
        private readonly XFont _regular = new(DejaVuFontResolver.FamilyName, 9.5, XFontStyleEx.Regular);
        private readonly XFont _bold = new(DejaVuFontResolver.FamilyName, 10, XFontStyleEx.Bold);
        private readonly XFont _title = new(DejaVuFontResolver.FamilyName, 16, XFontStyleEx.Bold);
        private readonly double[] _columns = [0, 150, 250, 330];
        private XGraphics? _gfx;
        private PdfPage? _page;
        private double _y;

        public void Title(string text)
        {
            Ensure(30);
            _gfx!.DrawString(Fit(text, _title, Width), _title, XBrushes.Black, new XPoint(Margin, _y + 16));
            _y += 28;
        }

        public void Heading(string text)
        {
            Ensure(3 * LineHeight);
            _y += 6;
            _gfx!.DrawString(text, _bold, XBrushes.Black, new XPoint(Margin, _y + 10));
            _y += LineHeight + 2;
        }

        public void Line(string text)
        {
            Ensure(LineHeight);
            _gfx!.DrawString(Fit(text, _regular, Width), _regular, XBrushes.Black, new XPoint(Margin, _y + 10));
            _y += LineHeight;
        }

        public void Wrap(string text)
        {
            foreach (var paragraph in text.ReplaceLineEndings("\n").Split('\n'))
            {
                var line = string.Empty;
                foreach (var word in paragraph.Split(' ', StringSplitOptions.RemoveEmptyEntries))
                {
                    var next = line.Length == 0 ? word : line + " " + word;
                    if (line.Length > 0 && _gfx is not null && Measure(next, _regular) > Width)
                    {
                        Line(line);
                        line = word;
                    }
                    else
                    {
                        line = next;
                    }
                }

                if (line.Length > 0)
                {
                    Line(line);
                }
            }
        }

        public void Row(bool header, params string[] cells)
        {
            Ensure(LineHeight);
            var font = header ? _bold : _regular;
            for (var k = 0; k < cells.Length; k++)
            {
                var width = (k + 1 < _columns.Length ? _columns[k + 1] : Width) - _columns[k] - 6;
                _gfx!.DrawString(Fit(cells[k], font, width), font, XBrushes.Black, new XPoint(Margin + _columns[k], _y + 10));
            }

            _y += LineHeight;
        }

        public void Finish() => _gfx?.Dispose();

        private double Width => (_page?.Width.Point ?? 595) - 2 * Margin;

        private void Ensure(double height)
        {
            if (_gfx is null || _y + height > _page!.Height.Point - Margin)
            {
                _gfx?.Dispose();
                _page = pdf.AddPage();
                _page.Size = PdfSharp.PageSize.A4;
                _gfx = XGraphics.FromPdfPage(_page);
                _y = Margin;
                _gfx.DrawString($"page {pdf.PageCount}", _regular, XBrushes.Gray, new XPoint(_page.Width.Point - Margin - 40, _page.Height.Point - 25));
            }
        }

        private double Measure(string text, XFont font) => _gfx!.MeasureString(text, font).Width;

        private string Fit(string text, XFont font, double width)
        {
            text = text.ReplaceLineEndings(" ");
            if (_gfx is null || Measure(text, font) <= width)
            {
                return text;
            }

            var lo = 0;
            var hi = text.Length;
            while (lo < hi)
            {
                var mid = (lo + hi + 1) / 2;
                if (Measure(text[..mid] + "...", font) <= width)
                {
                    lo = mid;
                }
                else
                {
                    hi = mid - 1;
                }
            }

            return text[..lo] + "...";
        }
    }
}
