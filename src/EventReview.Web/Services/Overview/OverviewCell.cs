namespace EventReview.Web.Services.Overview;

/// <summary>One checklist item that runs a built-in check, in its section's row and its check's column of the overview matrix.</summary>
/// <param name="ItemKey">The item's key (the chip links to it).</param>
/// <param name="Title">The item's title.</param>
/// <param name="Verdict">The stored verdict word of its newest computation record, or "not run".</param>
/// <param name="Summary">That record's summary (empty when not run), shown as the chip's tooltip.</param>
public sealed record OverviewCell(string ItemKey, string Title, string Verdict, string Summary);
