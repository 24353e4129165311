using EventReview.Core.Plots;
using EventReview.Dossier.Plots;
using PdfSharp.Drawing;
using PdfSharp.Pdf;

namespace EventReview.Dossier;

/// <summary>
/// Flows text, tables and figures down A4 pages for <see cref="DossierPdf"/>: wraps long text instead of cutting it,
/// starts a new page when the next block does not fit, numbers the pages in the footer.
/// </summary>
internal sealed class PdfPageWriter(PdfDocument pdf, string footer)
{
    public const double Margin = 48;
    private readonly XFont _regular = new(DejaVuFontResolver.FamilyName, 9.5, XFontStyleEx.Regular);
    private readonly XFont _small = new(DejaVuFontResolver.FamilyName, 8, XFontStyleEx.Regular);
    private readonly XFont _bold = new(DejaVuFontResolver.FamilyName, 10, XFontStyleEx.Bold);
    private readonly XFont _heading = new(DejaVuFontResolver.FamilyName, 13, XFontStyleEx.Bold);
    private readonly XFont _title = new(DejaVuFontResolver.FamilyName, 20, XFontStyleEx.Bold);
    private XGraphics? _gfx;
    private PdfPage? _page;
    private double _y;

    public double Width => 595.28 - (2 * Margin);

    public void NewPage()
    {
        _gfx?.Dispose();
        _page = pdf.AddPage();
        _page.Size = PdfSharp.PageSize.A4;
        _gfx = XGraphics.FromPdfPage(_page);
        _y = Margin;
        _gfx.DrawString(footer, _small, XBrushes.Gray, new XPoint(Margin, _page.Height.Point - 24));
        var number = $"page {pdf.PageCount}";
        _gfx.DrawString(number, _small, XBrushes.Gray, new XPoint(_page.Width.Point - Margin - _gfx.MeasureString(number, _small).Width, _page.Height.Point - 24));
    }

    public void Title(string text)
    {
        Ensure(34);
        foreach (var line in Lines(text, _title, Width))
        {
            Ensure(26);
            _gfx!.DrawString(line, _title, XBrushes.Black, new XPoint(Margin, _y + 20));
            _y += 26;
        }

        _y += 6;
    }

    public void Heading(string text)
    {
        Ensure(60);
        _y += 8;
        foreach (var line in Lines(text, _heading, Width))
        {
            _gfx!.DrawString(line, _heading, new XSolidBrush(PlotPdf.Colour(PlotPalette.Ink, 1)), new XPoint(Margin, _y + 13));
            _y += 18;
        }

        _y += 2;
    }

    public void Bold(string text, double indent = 0) => Flow(text, _bold, indent, 14);

    public void Line(string text, double indent = 0) => Flow(text, _regular, indent, 13);

    public void Small(string text, double indent = 0) => Flow(text, _small, indent, 11);

    public void Space(double points) => _y += points;

    /// <summary>A table row: cells at the given column offsets, each wrapped within its column (long words broken).</summary>
    public void Row(double[] columns, bool header, double size, params string[] cells)
    {
        var font = new XFont(DejaVuFontResolver.FamilyName, size, header ? XFontStyleEx.Bold : XFontStyleEx.Regular);
        Ensure(size + 5);
        var wrapped = cells.Select((c, k) => Lines(c.ReplaceLineEndings(" "), font, (k + 1 < columns.Length ? columns[k + 1] : Width) - columns[k] - 4)).ToList();
        var lines = wrapped.Max(l => l.Count);
        Ensure((lines * (size + 2)) + 3);
        for (var k = 0; k < wrapped.Count; k++)
        {
            for (var j = 0; j < wrapped[k].Count; j++)
            {
                _gfx!.DrawString(wrapped[k][j], font, XBrushes.Black, new XPoint(Margin + columns[k], _y + size + (j * (size + 2))));
            }
        }

        _y += (lines * (size + 2)) + 3;
        _gfx!.DrawLine(new XPen(PlotPdf.Colour(PlotPalette.Grey, 0.5), 0.4), Margin, _y - 1.5, Margin + Width, _y - 1.5);
    }

    /// <summary>Whether <paramref name="text"/> at <paramref name="size"/> pt (bold when asked) fits on one line of <paramref name="width"/> pt.</summary>
    public bool Fits(string text, double size, bool bold, double width)
    {
        Ensure(0);
        return Measure(text, new XFont(DejaVuFontResolver.FamilyName, size, bold ? XFontStyleEx.Bold : XFontStyleEx.Regular)) <= width;
    }

    /// <summary>Draws a figure full width with "Figure N. caption" under it, on a new page if it does not fit.</summary>
    public void Figure(PlotDrawing drawing, string caption)
    {
        var lines = Lines(caption, _regular, Width);
        double height = ((drawing.Height - 26) * Width / drawing.Width) + 6 + (lines.Count * 13);
        Ensure(height);
        _y += PlotPdf.Draw(_gfx!, drawing, Margin, _y, Width) + 4;
        foreach (var line in lines)
        {
            _gfx!.DrawString(line, _regular, XBrushes.Black, new XPoint(Margin, _y + 10));
            _y += 13;
        }

        _y += 8;
    }

    public void Finish() => _gfx?.Dispose();

    private void Flow(string text, XFont font, double indent, double height)
    {
        foreach (var line in Lines(text, font, Width - indent))
        {
            Ensure(height);
            _gfx!.DrawString(line, font, XBrushes.Black, new XPoint(Margin + indent, _y + height - 3));
            _y += height;
        }
    }

    private void Ensure(double height)
    {
        if (_gfx is null || _y + height > _page!.Height.Point - Margin)
        {
            NewPage();
        }
    }

    /// <summary>Splits <paramref name="text"/> into lines no wider than <paramref name="width"/> (words longer than a line are broken).</summary>
    private List<string> Lines(string text, XFont font, double width)
    {
        Ensure(0);
        var lines = new List<string>();
        foreach (var paragraph in text.ReplaceLineEndings("\n").Split('\n'))
        {
            var line = string.Empty;
            foreach (var raw in paragraph.Split(' ', StringSplitOptions.RemoveEmptyEntries))
            {
                var word = raw;
                while (Measure(word, font) > width && word.Length > 1)
                {
                    var cut = word.Length - 1;
                    while (cut > 1 && Measure(word[..cut], font) > width)
                    {
                        cut--;
                    }

                    if (line.Length > 0)
                    {
                        lines.Add(line);
                        line = string.Empty;
                    }

                    lines.Add(word[..cut]);
                    word = word[cut..];
                }

                var next = line.Length == 0 ? word : line + " " + word;
                if (line.Length > 0 && Measure(next, font) > width)
                {
                    lines.Add(line);
                    line = word;
                }
                else
                {
                    line = next;
                }
            }

            lines.Add(line);
        }

        return lines;
    }

    private double Measure(string text, XFont font) => _gfx!.MeasureString(text, font).Width;
}
