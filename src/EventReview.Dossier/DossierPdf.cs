using System.Globalization;
using EventReview.Core.Dossier;
using EventReview.Core.Plots;
using PdfSharp.Pdf;

namespace EventReview.Dossier;

/// <summary>
/// Writes <c>summary.pdf</c> for the committee: a cover with the case, its decision status and headline numbers; the
/// verdict matrix (checklist sections × built-in checks); one part per section with item titles, verdicts, checks with
/// their figures (numbered, captioned, drawn natively from the plot model by <see cref="Plots.PlotPdf"/>), signers with
/// statements and times (UTC to the second and GPS seconds); the frozen configuration and its drift; the chain head
/// and the record's signing-key fingerprint. A pure function of the document and its pictures: creation and
/// modification dates are the case's last update time, and the random ids PDFsharp writes are replaced by values
/// derived from the chain head (<see cref="PdfStabilizer"/>), so the verifier can re-render it from <c>dossier.json</c>.
/// </summary>
public static class DossierPdf
{
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
        var w = new PdfPageWriter(pdf, $"Review dossier {doc.Case.CandidateId} - chain head {Short(doc.ChainHead)}");
        Cover(doc, w);
        Matrix(doc, w);
        DossierPdfSections.Write(doc, w);
        Configuration(doc, w);
        Integrity(doc, w);
        w.Finish();

        using var ms = new MemoryStream();
        pdf.Save(ms, false);
        return PdfStabilizer.Stabilize(ms.ToArray(), doc.Case.CandidateId + "/" + doc.ChainHead);
    }

    /// <summary>UTC to the second, from 100 ns ticks: "2026-03-01 12:00:05 UTC".</summary>
    internal static string Utc(long ticks) => new DateTime(ticks, DateTimeKind.Utc).ToString("yyyy-MM-dd HH:mm:ss 'UTC'", CultureInfo.InvariantCulture);

    /// <summary>UTC to the second with the GPS second beside it: "2026-03-01 12:00:05 UTC (GPS 1456488023 s)" (leap seconds from the bundled table).</summary>
    internal static string UtcAndGps(long ticks) =>
        $"{Utc(ticks)} ({Gps(Core.Time.GpsUtc.FromUtc(new DateTime(ticks, DateTimeKind.Utc)).Nanoseconds)})";

    /// <summary>GPS seconds, whole: "GPS 1615248600 s".</summary>
    internal static string Gps(long nanoseconds) => string.Create(CultureInfo.InvariantCulture, $"GPS {Math.Floor(nanoseconds / 1e9):0} s");

    internal static string Short(string hash) => hash.Length > 16 ? hash[..16] + "…" : hash;

    private static void Cover(DossierDocument doc, PdfPageWriter w)
    {
        var c = doc.Case;
        w.NewPage();
        w.Small("REVIEW DOSSIER FOR THE COMMITTEE");
        w.Title(c.CandidateId);
        w.Line($"Candidate time {Gps(c.GpsNanoseconds)} ({c.Gps} s) = {Core.Time.GpsUtc.ToUtc(new Core.Time.GpsTime(c.GpsNanoseconds)).ToString(0).Replace('T', ' ').TrimEnd('Z')} UTC, search {c.Search}");
        w.Heading("Decision status");
        w.Bold(c.Outcome is null ? $"Open: the review is {c.State}; no decision has been recorded." : $"Closed: {c.Outcome} (state {c.State}).");
        if (c.ClosingStatement is not null)
        {
            w.Line("Closing statement: " + c.ClosingStatement);
        }

        w.Heading("Headline numbers");
        w.Line(string.Create(CultureInfo.InvariantCulture, $"Network SNR {c.NetworkSnr:F2} (root sum of squares of the site SNRs, dimensionless)"));
        foreach (var a in doc.Arrivals)
        {
            w.Line(string.Create(CultureInfo.InvariantCulture, $"{a.SiteCode}: arrival GPS {a.ArrivalGps} s, SNR {a.Snr:F2}"), 12);
        }

        var runs = doc.Items.SelectMany(i => i.Computations).ToList();
        w.Line($"Checklist items: {c.ItemCount}; fully signed {c.SignedItemCount}; with stale sign-offs {c.StaleItemCount}; not yet signed {c.ItemCount - c.SignedItemCount}");
        w.Line($"Check runs recorded: {runs.Count}" + (runs.Count == 0 ? string.Empty
            : " (" + string.Join(", ", runs.GroupBy(r => r.Verdict).OrderBy(g => g.Key, StringComparer.Ordinal).Select(g => $"{g.Count()} {g.Key}")) + ")"));
        w.Line($"Figures: {1 + doc.Items.SelectMany(i => i.Computations).Sum(r => r.Pictures.Count)} (the review progress and every check picture); timeline entries: {doc.Timeline.Count}");
        w.Heading("Case");
        w.Line($"Coordinator {c.CoordinatorName}; checklist {c.ChecklistName} version {c.ChecklistVersion}");
        w.Line($"Opened {UtcAndGps(c.CreatedAtUtcTicks)}; last change {UtcAndGps(c.UpdatedAtUtcTicks)}");
        w.Line(c.Summary);
        w.Space(8);
        w.Small("This summary is rendered from dossier.json and checked against it by 'eventreview dossier verify'. The decision rests " +
                "with the people who sign, under their collaboration's own procedures.");
    }

    private static void Matrix(DossierDocument doc, PdfPageWriter w)
    {
        var kinds = doc.Items.Select(i => i.CheckKind).Concat(doc.Items.SelectMany(i => i.Computations).Select(r => r.Kind))
            .OfType<string>().Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToList();
        w.Space(10);
        w.Heading("Verdict matrix");
        w.Small("Latest recorded verdict of each built-in check within each checklist section; 'not run' where the section has an item for " +
                "the check but no run is recorded, '-' where the section has none. Signed: items with all required sign-offs current.");
        w.Space(4);
        double first = 110, each = kinds.Count == 0 ? 0 : (w.Width - first - 36) / kinds.Count;
        var columns = kinds.Select((_, k) => first + (k * each)).Prepend(0.0).Append(w.Width - 36).ToArray();
        var headers = MatrixHeaders(kinds, kind => w.Fits(kind, 7.5, true, each - 4));
        w.Row(columns, true, 7.5, ["Section", .. headers, "Signed"]);
        foreach (var section in Sections(doc))
        {
            var cells = kinds.Select(kind =>
            {
                var latest = section.SelectMany(i => i.Computations).Where(r => r.Kind == kind).OrderBy(r => r.RunAtUtcTicks).ThenBy(r => r.Id).LastOrDefault();
                return latest?.Verdict ?? (section.Any(i => i.CheckKind == kind) ? "not run" : "-");
            });
            var signed = section.Count(i => i.SignOffs.Count(s => !s.IsStale) >= i.RequiredSignOffs && i.RequiredSignOffs > 0);
            w.Row(columns, false, 7.5, [section[0].SectionTitle, .. cells, $"{signed}/{section.Count}"]);
        }

        var abbreviated = kinds.Zip(headers).Where(p => p.First != p.Second).Select(p => $"{p.Second} = {p.First}").ToList();
        if (abbreviated.Count > 0)
        {
            w.Small("Column headings shortened to fit: " + string.Join("; ", abbreviated) + ".");
        }

        w.Space(6);
        var progress = DossierProgress.Figure(doc);
        w.Figure(PlotLayout.Lay(progress), $"Figure 1. {progress.Caption} (from the recorded sign-offs)");
    }

    /// <summary>
    /// The verdict matrix's column headings: each check kind as it is when it fits its column (<paramref name="fits"/>),
    /// otherwise its longest prefix that fits followed by "." (never a word broken across lines), kept distinct.
    /// </summary>
    internal static IReadOnlyList<string> MatrixHeaders(IReadOnlyList<string> kinds, Func<string, bool> fits)
    {
        var headers = new List<string>();
        foreach (var kind in kinds)
        {
            var header = kind;
            if (!fits(kind))
            {
                int n = kind.Length - 1;
                while (n > 1 && (!fits(kind[..n] + ".") || headers.Contains(kind[..n] + ".", StringComparer.Ordinal)))
                {
                    n--;
                }

                header = kind[..Math.Max(1, n)] + ".";
            }

            headers.Add(header);
        }

        return headers;
    }

    internal static List<List<DossierItem>> Sections(DossierDocument doc) =>
        doc.Items.GroupBy(i => (i.SectionOrder, i.SectionKey)).OrderBy(g => g.Key.SectionOrder).ThenBy(g => g.Key.SectionKey, StringComparer.Ordinal)
            .Select(g => g.OrderBy(i => i.Order).ToList()).ToList();

    private static void Configuration(DossierDocument doc, PdfPageWriter w)
    {
        if (doc.Configurations.Count == 0)
        {
            return;
        }

        w.Heading("Configuration");
        foreach (var s in doc.Configurations.Where(s => s.IsFrozen))
        {
            w.Bold($"{s.SiteCode}: '{s.Label}' frozen by {s.FrozenByName}, {s.FreezeFromUtc} to {s.FreezeUntilUtc}");
            w.Line($"{s.Items.Count} items; fingerprint {s.Fingerprint}", 12);
            foreach (var item in s.Items)
            {
                w.Small($"{item.Key} = {item.Value}", 24);
            }
        }

        foreach (var s in doc.Configurations.Where(s => s.Drift is not null))
        {
            w.Line($"{s.SiteCode} snapshot '{s.Label}' captured {s.CapturedAtUtc}: {s.Drift!.Verdict}. {s.Drift.Summary}");
        }
    }

    private static void Integrity(DossierDocument doc, PdfPageWriter w)
    {
        w.Heading("Integrity");
        w.Line($"Timeline entries: {doc.Timeline.Count}. Chain head (SHA-256 of the last entry):");
        w.Line(doc.ChainHead, 12);
        var keys = doc.Timeline.Select(t => t.KeyId).OfType<string>().Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToList();
        if (keys.Count == 0)
        {
            w.Line("Signing key: the timeline entries carry no record-key signature (written without a record key).");
        }
        else
        {
            w.Line($"Signing-key fingerprint{(keys.Count > 1 ? "s" : string.Empty)} of the record (timeline entries are keyed with it):");
            foreach (var k in keys)
            {
                w.Line(k, 12);
            }
        }

        w.Line("The manifest (manifest.json) lists every file's SHA-256 and carries the server's signature when one was configured.");
        w.Line("Verify offline: eventreview dossier verify <file.zip>");
    }
}
