namespace EventReview.Web.Components.Shared;

/// <summary>What a confirmation asks: the action, what cannot be undone, and whether a written reason is required.</summary>
/// <param name="Title">The question ("Revoke the token 'pipeline'?").</param>
/// <param name="Action">The confirm button's words ("Revoke").</param>
/// <param name="CannotBeUndone">What cannot be undone, in plain words.</param>
/// <param name="Details">Anything else the person should know before confirming; null for nothing.</param>
/// <param name="ReasonLabel">Label of a required written reason; null when no reason is asked for.</param>
/// <param name="MinReasonLength">Shortest reason accepted, characters.</param>
public sealed record ConfirmRequest(string Title, string Action, string CannotBeUndone, string? Details = null, string? ReasonLabel = null, int MinReasonLength = 10);
