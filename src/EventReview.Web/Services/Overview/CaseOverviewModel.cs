using System.Globalization;
using System.Text.Json;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Formatting;
using EventReview.Core.Significance;
using EventReview.Core.Signal.Overlap;
using EventReview.Core.Timing;
using EventReview.Web.Services.Checks;

namespace EventReview.Web.Services.Overview;

/// <summary>
/// What the case overview shows, worked out from the case alone: a matrix of checklist sections (rows) by built-in checks
/// (columns) with each item's newest verdict, the headline numbers read from the newest records' result JSON, the items
/// whose sign-offs went stale, and what still blocks closing. The overview component only draws this.
/// </summary>
public sealed class CaseOverviewModel
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Builds the overview of <paramref name="c"/>.</summary>
    public CaseOverviewModel(ReviewCase c)
    {
        ArgumentNullException.ThrowIfNull(c);
        var items = c.Items.OrderBy(i => i.SectionOrder).ThenBy(i => i.Order).ToList();
        Kinds = [.. CheckKind.All.Where(k => items.Any(i => i.CheckKind == k))];
        Rows = [.. items.GroupBy(i => (i.SectionOrder, i.SectionKey, i.SectionTitle)).OrderBy(g => g.Key.SectionOrder).Select(g => new OverviewRow(
            g.Key.SectionKey, g.Key.SectionTitle, g.Count(i => i.State == ItemState.SignedOff), g.Count(), g.Count(i => i.HasStaleSignOffs),
            [.. Kinds.Select(k => (IReadOnlyList<OverviewCell>)[.. g.Where(i => i.CheckKind == k).Select(Cell)])]))];
        Stale = [.. items.Where(i => i.HasStaleSignOffs)];
        Headlines = [Significance(items), Overlap(items), Timing(items)];
        Blockers = BlockersOf(c, items);
        ProgressSvg = Core.Plots.PlotSvg.Write(Core.Plots.Figures.ReviewProgressFigure.Build(ProgressOf(items), c.CreatedAt.UtcTicks, c.UpdatedAt.UtcTicks));
    }

    /// <summary>The review-progress chart (SVG): items fully signed and sign-offs given from the case's opening to its last change.</summary>
    public string ProgressSvg { get; }

    /// <summary>The items as the review-progress chart reads them (the dossier builds the same from its sign-offs).</summary>
    public static IReadOnlyList<Core.Plots.Figures.ReviewProgressItem> ProgressOf(IEnumerable<ChecklistItem> items) =>
        [.. items.Select(i => new Core.Plots.Figures.ReviewProgressItem(i.RequiredSignOffs,
            [.. i.SignOffs.Select(s => new Core.Plots.Figures.ReviewProgressSignOff(s.SignedAtUtc.UtcTicks, s.IsStale ? s.StaleSince?.UtcTicks ?? s.SignedAtUtc.UtcTicks : null))]))];

    /// <summary>The built-in checks the checklist runs, in <see cref="CheckKind.All"/> order: the matrix's columns.</summary>
    public IReadOnlyList<string> Kinds { get; }

    /// <summary>The checklist's sections in order: the matrix's rows.</summary>
    public IReadOnlyList<OverviewRow> Rows { get; }

    /// <summary>Significance (FAR and σ), overlap (value and lag ± uncertainty) and timing (sky-fit χ²).</summary>
    public IReadOnlyList<Headline> Headlines { get; }

    /// <summary>Items whose sign-offs went stale because their evidence changed after signing.</summary>
    public IReadOnlyList<ChecklistItem> Stale { get; }

    /// <summary>What keeps the case from being closed, in words; empty when nothing does (the closing rules are the case's own).</summary>
    public IReadOnlyList<string> Blockers { get; }

    private static OverviewCell Cell(ChecklistItem i) =>
        new(i.Key, i.Title, i.LatestComputation?.Verdict ?? "not run", i.LatestComputation?.Summary ?? string.Empty);

    private static (ChecklistItem? Item, ComputationRecord? Record) Newest(IEnumerable<ChecklistItem> items, string kind)
    {
        var runs = items.Where(i => i.CheckKind == kind).ToList();
        var best = runs.Select(i => (Item: i, Record: CheckRecords.Latest(i.Computations, kind))).Where(x => x.Record is not null)
            .OrderByDescending(x => x.Record!.RunAt).FirstOrDefault();
        return best.Record is null ? (runs.FirstOrDefault(), null) : best;
    }

    private static Headline Read<T>(IEnumerable<ChecklistItem> items, string kind, string label, Func<T, string> value)
    {
        var (item, record) = Newest(items, kind);
        if (item is null)
        {
            return new Headline(label, "no item of this checklist runs this check", null, "not run");
        }

        if (record is null)
        {
            return new Headline(label, "not run yet", item.Key, "not run");
        }

        try
        {
            var result = JsonSerializer.Deserialize<T>(record.ResultJson, CheckRecords.Json);
            return new Headline(label, result is null ? "the record has no result" : value(result), item.Key, record.Verdict);
        }
        catch (JsonException ex)
        {
            return new Headline(label, $"the stored result could not be read ({ex.Message}); open the item to see the record", item.Key, record.Verdict);
        }
    }

    private static Headline Significance(IEnumerable<ChecklistItem> items) =>
        Read<BackgroundRecordResult>(items, CheckKind.Background, "False-alarm rate and significance", r =>
        {
            if (r.Check.Joint is { } joint)
            {
                var f = joint.Figures;
                return $"FAR {SignificanceText.FarCell(f.FarHz, f.FarIsBound, f.Louder, f.BoundConfidence)} Hz, {SignificanceText.SigmaCell(f.Sigma, f.SigmaIsBound)}σ (joint over the search types)";
            }

            if (r.Check.Pairs.Count == 0)
            {
                return "no pair was computed";
            }

            var h = r.Check.Pairs[Math.Clamp(r.Check.HeadlinePair, 0, r.Check.Pairs.Count - 1)];
            var b = h.Result;
            return $"FAR {SignificanceText.FarCell(b.FarHz, b.FarIsBound, b.Louder, b.FarBoundConfidence)} Hz ({SignificanceText.PerYearCell(b.FarHz, b.FarIsBound)} per year), " +
                   $"{SignificanceText.SigmaCell(b.Sigma, b.SigmaIsBound)}σ ({h.Plan.Name}; {h.Band})";
        });

    private static Headline Overlap(IEnumerable<ChecklistItem> items) =>
        Read<OverlapReviewResult>(items, CheckKind.Overlap, "Overlap between sites", r =>
        {
            var o = r.Overlap;
            var sigma = o.LagUncertaintySeconds is { } u ? string.Create(Inv, $" ± {u * 1e3:0.00}") : " (no uncertainty stated)";
            var p = o.PValue is { } pv ? $", off-source p = {ScientificFormat.Format(pv, 2)}" : string.Empty;
            return string.Create(Inv, $"{r.SiteA}–{r.SiteB}: overlap {o.Overlap:0.00} at lag {o.RefinedLagSeconds * 1e3:+0.00;-0.00}{sigma} ms (allowed ±{r.AllowedLagSeconds * 1e3:0.00} ms){p}");
        });

    private static Headline Timing(IEnumerable<ChecklistItem> items) =>
        Read<TimingReviewResult>(items, CheckKind.Timing, "Timing across sites", r =>
        {
            var t = r.Timing;
            var pairs = string.Create(Inv, $"{t.Pairs.Count(x => x.Consistent)} of {t.Pairs.Count} pairs within their windows");
            if (t.DegreesOfFreedom is 0)
            {
                return $"no sky-fit χ² test: three sites leave no degree of freedom; {pairs}";
            }

            return t.Chi2 is { } chi2 && t.DegreesOfFreedom is { } dof
                ? string.Create(Inv, $"sky-fit χ² = {chi2:0.##} with {dof} degree{(dof == 1 ? "" : "s")} of freedom{(t.PValue is { } p ? $", p {(t.PValueIsBound ? "≥" : "=")} {ScientificFormat.Format(p, 2)}" : "")}; {pairs}")
                : $"no sky-fit χ² (too few sites); {pairs}";
        });

    private static List<string> BlockersOf(ReviewCase c, List<ChecklistItem> items)
    {
        if (c.State == CaseState.Closed)
        {
            return [];
        }

        var blockers = new List<string>();
        var unsigned = items.Where(i => i.State != ItemState.SignedOff).ToList();
        if (unsigned.Count > 0)
        {
            var by = unsigned.GroupBy(i => i.State).OrderBy(g => g.Key).Select(g => $"{g.Count()} {StateNames.Of(g.Key)}");
            blockers.Add($"{unsigned.Count} of {items.Count} items not signed off ({string.Join(", ", by)})");
        }

        var stale = items.Count(i => i.HasStaleSignOffs);
        if (stale > 0)
        {
            blockers.Add($"{stale} item(s) with stale sign-offs to sign again");
        }

        var notRun = items.Count(i => i.CheckKind is not null && i.LatestComputation is null);
        if (notRun > 0)
        {
            blockers.Add($"{notRun} built-in check(s) not run yet");
        }

        return blockers;
    }
}
