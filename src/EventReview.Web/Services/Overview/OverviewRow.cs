namespace EventReview.Web.Services.Overview;

/// <summary>A checklist section as a row of the overview matrix.</summary>
/// <param name="SectionKey">The section's key.</param>
/// <param name="Title">The section's title.</param>
/// <param name="Signed">Items signed off.</param>
/// <param name="Total">Items in the section.</param>
/// <param name="Stale">Items whose sign-offs went stale.</param>
/// <param name="Cells">Per check kind (the matrix's columns, same order), the section's items that run it; empty when none.</param>
public sealed record OverviewRow(string SectionKey, string Title, int Signed, int Total, int Stale, IReadOnlyList<IReadOnlyList<OverviewCell>> Cells);
