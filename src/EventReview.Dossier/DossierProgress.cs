using EventReview.Core.Dossier;
using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;

namespace EventReview.Dossier;

/// <summary>
/// The review-progress chart of a dossier (figure 1 of <c>summary.pdf</c> and <c>index.html</c>), built from the sign-offs
/// recorded in <c>dossier.json</c> between the case's opening and its last change, the same inputs the app's overview uses.
/// </summary>
public static class DossierProgress
{
    /// <summary>The chart of <paramref name="doc"/>.</summary>
    public static PlotFigure Figure(DossierDocument doc)
    {
        ArgumentNullException.ThrowIfNull(doc);
        var items = doc.Items.Select(i => new ReviewProgressItem(i.RequiredSignOffs,
            i.SignOffs.Select(s => new ReviewProgressSignOff(s.SignedAtUtcTicks, s.IsStale ? s.StaleSinceUtcTicks ?? s.SignedAtUtcTicks : null)).ToList())).ToList();
        return ReviewProgressFigure.Build(items, doc.Case.CreatedAtUtcTicks, doc.Case.UpdatedAtUtcTicks);
    }
}
