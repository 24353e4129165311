namespace EventReview.Web.Tests.Fixtures;

/// <summary>The callers of the authorisation matrix.</summary>
public static class Who
{
    public const string Anonymous = "anonymous";
    public const string Observer = "observer";
    public const string Reviewer = "reviewer";
    public const string ReviewerB = "reviewer-b";
    public const string Coordinator = "coordinator";
    public const string Token = "token";
}
