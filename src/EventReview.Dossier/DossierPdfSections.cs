using EventReview.Core.Dossier;
using EventReview.Core.Plots;

namespace EventReview.Dossier;

/// <summary>
/// The per-section part of <c>summary.pdf</c>: each checklist section on its own page, each item by title with its
/// state and verdict, its evidence, its check runs with their figures ("Figure N. caption", numbered through the
/// document in the order of <see cref="FigureNumbers"/>), and its sign-offs with statements and times.
/// </summary>
internal static class DossierPdfSections
{
    public static void Write(DossierDocument doc, PdfPageWriter w)
    {
        var numbers = FigureNumbers(doc);
        var sections = DossierPdf.Sections(doc);
        for (int s = 0; s < sections.Count; s++)
        {
            var section = sections[s];
            w.NewPage();
            var title = section[0].SectionTitle;
            w.Heading(title.Length > 1 && char.IsAsciiDigit(title[0]) ? title : $"Section {s + 1}. {title}");
            foreach (var item in section)
            {
                Item(doc, item, numbers, w);
            }
        }
    }

    /// <summary>
    /// Figure numbers of every picture named by a computation, 2, 3, ... in item then run then picture order (figure 1 is
    /// the review-progress chart under the verdict matrix).
    /// </summary>
    public static IReadOnlyDictionary<(long Computation, string Picture), int> FigureNumbers(DossierDocument doc)
    {
        var numbers = new Dictionary<(long, string), int>();
        foreach (var r in DossierPdf.Sections(doc).SelectMany(s => s).SelectMany(i => i.Computations))
        {
            foreach (var p in r.Pictures)
            {
                numbers.TryAdd((r.Id, p), numbers.Count + 2);
            }
        }

        return numbers;
    }

    private static void Item(DossierDocument doc, DossierItem i, IReadOnlyDictionary<(long, string), int> numbers, PdfPageWriter w)
    {
        w.Space(4);
        w.Bold(i.Title);
        w.Small($"item {i.Key}; state {i.State}; latest verdict {i.LatestVerdict ?? "none"}; sign-offs required {i.RequiredSignOffs}"
                + (i.OwnerName is null ? string.Empty : $"; owner {i.OwnerName}") + (i.HasStaleSignOffs ? "; has stale sign-offs" : string.Empty));
        if (i.Evidence.Count > 0)
        {
            w.Small($"Evidence: {i.Evidence.Count} ({string.Join(", ", i.Evidence.GroupBy(e => e.Kind).Select(g => $"{g.Count()} {g.Key}"))})", 12);
        }

        foreach (var r in i.Computations)
        {
            w.Line($"Check {r.Kind}: {r.Verdict}. {r.Summary}", 12);
            w.Small($"run by {r.RunByName} at {DossierPdf.UtcAndGps(r.RunAtUtcTicks)}; {r.ToolVersion}; record {DossierPdf.Short(r.ContentSha256)}", 24);
            foreach (var p in r.Pictures)
            {
                var n = numbers[(r.Id, p)];
                var drawing = doc.PictureSvgs.TryGetValue(p, out var svg) ? PlotSvg.Read(svg) : null;
                if (drawing is null)
                {
                    w.Line($"Figure {n}. {p} (drawn before the plot model; shown in index.html and kept in the ZIP).", 12);
                }
                else
                {
                    w.Figure(drawing, $"Figure {n}. {drawing.Caption} ({r.Kind} check, {p})");
                }
            }
        }

        if (i.SignOffs.Count == 0)
        {
            w.Line("Not signed.", 12);
        }

        foreach (var s in i.SignOffs)
        {
            w.Line($"{s.SignerName}, {s.Meaning}, {DossierPdf.Utc(s.SignedAtUtcTicks)} ({DossierPdf.Gps(s.SignedAtGpsNanoseconds)})"
                   + (s.IsStale ? $"; STALE since {(s.StaleSinceUtcTicks is { } t ? DossierPdf.Utc(t) : "an unknown time")}" : string.Empty), 12);
            w.Small("Statement: " + s.Statement, 24);
        }
    }
}
