namespace EventReview.Web.Tests.Integrity;

/// <summary>One request of the bad-input corpus: who sends what to which endpoint, and what answer it must get.</summary>
/// <param name="Endpoint">The endpoint as documented ("POST /api/cases"), for coverage and for reports.</param>
/// <param name="What">What is wrong with the request.</param>
/// <param name="Who">The caller (<see cref="Fixtures.Who"/> or <see cref="CorpusRequest.CookieWithoutOrigin"/>).</param>
/// <param name="Method">HTTP method.</param>
/// <param name="Path">Path and query.</param>
public sealed record CorpusRequest(string Endpoint, string What, string Who, HttpMethod Method, string Path)
{
    /// <summary>A signed-in coordinator's cookie client that sends no Origin header (a tool replaying a browser cookie).</summary>
    public const string CookieWithoutOrigin = "cookie without origin";

    /// <summary>The body, made fresh for each send (null: none).</summary>
    public Func<HttpContent?> Body { get; init; } = () => null;

    /// <summary>The exact status expected, when the case pins one; otherwise any 4xx.</summary>
    public int? Expected { get; init; }

    /// <summary>The field a 422 or 400 must name, when the case pins one.</summary>
    public string? Field { get; init; }

    /// <summary>Extra request headers (Origin, Authorization, ...).</summary>
    public IReadOnlyList<KeyValuePair<string, string>> Headers { get; init; } = [];

    /// <summary>Form fields of a sign-in post; the runner adds a fresh antiforgery token unless <see cref="WithoutToken"/>.</summary>
    public IReadOnlyDictionary<string, string>? SignInForm { get; init; }

    /// <summary>Send the sign-in form without its antiforgery token.</summary>
    public bool WithoutToken { get; init; }

    /// <summary>
    /// The request reaches the password check, which the sign-in audit records by design (a sign-in or a failed
    /// attempt); only that table may change, and the answer must be a redirect to a local path.
    /// </summary>
    public bool AuditsSignIn { get; init; }

    public override string ToString() => $"{Endpoint} [{Who}] {What}";
}
