namespace EventReview.Core.Plots.Figures;

/// <summary>One checklist item as the review-progress chart needs it: how many sign-offs it requires and those it has.</summary>
/// <param name="RequiredSignOffs">Sign-offs needed for the item to count as signed (items needing none never count).</param>
/// <param name="SignOffs">Its sign-offs, current and stale.</param>
public sealed record ReviewProgressItem(int RequiredSignOffs, IReadOnlyList<ReviewProgressSignOff> SignOffs);
