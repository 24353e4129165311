namespace EventReview.Data.Auth;

/// <summary>The three roles. Coordinators can do everything reviewers can; reviewers everything observers can.</summary>
public static class Roles
{
    public const string Coordinator = "coordinator";
    public const string Reviewer = "reviewer";
    public const string Observer = "observer";

    /// <summary>Stored on every API token row; what a token may do comes from its scopes (<see cref="TokenScopes"/>), never from a role.</summary>
    public const string Pipeline = "pipeline";

    public static IReadOnlyList<string> All { get; } = [Coordinator, Reviewer, Observer];

    /// <summary>Roles allowed to add evidence and sign (comma list for [Authorize(Roles=...)]).</summary>
    public const string ReviewerOrAbove = Coordinator + "," + Reviewer;

    public static bool IsKnown(string? role) => role is not null && All.Contains(role);
}
