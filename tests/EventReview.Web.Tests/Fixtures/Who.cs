namespace EventReview.Web.Tests.Fixtures;

/// <summary>The callers of the authorisation matrix.</summary>
public static class Who
{
    public const string Anonymous = "anonymous";
    public const string Observer = "observer";
    public const string Reviewer = "reviewer";
    public const string ReviewerB = "reviewer-b";
    public const string Coordinator = "coordinator";

    /// <summary>A token with every scope (what tokens could do before scopes existed).</summary>
    public const string Token = "token";

    public const string TokenRead = "token cases:read";
    public const string TokenOpen = "token cases:open";
    public const string TokenEvidence = "token evidence:add";

    /// <summary>A token with the default pipeline scopes (open cases, add evidence).</summary>
    public const string TokenPipeline = "token pipeline";

    /// <summary>A token with every scope that expired yesterday.</summary>
    public const string TokenExpired = "token expired";

    /// <summary>A token with every scope, revoked.</summary>
    public const string TokenRevoked = "token revoked";

    public static IReadOnlyList<string> People { get; } = [Anonymous, Observer, Reviewer, Coordinator];

    public static IReadOnlyList<string> Tokens { get; } = [TokenRead, TokenOpen, TokenEvidence, TokenPipeline, Token, TokenExpired, TokenRevoked];
}
