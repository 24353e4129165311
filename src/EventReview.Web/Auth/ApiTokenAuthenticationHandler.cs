using System.Security.Claims;
using System.Text.Encodings.Web;
using EventReview.Data.Auth;
using Microsoft.AspNetCore.Authentication;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Auth;

/// <summary>
/// Authenticates <c>Authorization: Bearer ert_...</c> against the stored token hashes. A revoked or expired token is
/// refused with a 401 problem saying which; an unknown or malformed one gets the same answer as any invalid token, so
/// nothing tells whether a guessed value exists. A valid token gets one scope claim per scope and no role.
/// </summary>
public sealed class ApiTokenAuthenticationHandler(
    IOptionsMonitor<AuthenticationSchemeOptions> options,
    ILoggerFactory logger,
    UrlEncoder encoder,
    ApiTokenCache tokens,
    TimeProvider clock) : AuthenticationHandler<AuthenticationSchemeOptions>(options, logger, encoder)
{
    public const string SchemeName = "ApiToken";

    private const string RefusalKey = "eventreview:token-refusal";

    protected override async Task<AuthenticateResult> HandleAuthenticateAsync()
    {
        var header = Request.Headers.Authorization.ToString();
        if (!header.StartsWith("Bearer ", StringComparison.OrdinalIgnoreCase))
        {
            return AuthenticateResult.NoResult();
        }

        var secret = header["Bearer ".Length..].Trim();
        if (!secret.StartsWith(ApiToken.Prefix, StringComparison.Ordinal) || secret.Length > 200)
        {
            return Refuse("invalid", "The API token is not valid.");
        }

        var hash = ApiToken.HashOf(secret);
        var token = await tokens.FindAsync(hash, Context.RequestAborted);
        var now = clock.GetUtcNow();
        switch (token?.StateAt(now))
        {
            case null:
                return Refuse("invalid", "The API token is not valid.");
            case TokenState.Revoked:
                return Refuse("revoked", $"This API token was revoked on {token.RevokedAt!.Value.UtcDateTime:yyyy-MM-dd HH:mm} UTC; ask a coordinator for a new one.");
            case TokenState.Expired:
                return Refuse("expired", $"This API token expired on {token.ExpiresAt.UtcDateTime:yyyy-MM-dd HH:mm} UTC; ask a coordinator for a new one.");
        }

        await tokens.TouchAsync(token, Context.RequestAborted);

        List<Claim> claims =
        [
            new(ClaimTypes.NameIdentifier, $"token:{token.Id}"),
            new(ClaimTypes.Name, $"token {token.Name}"),
            new(UserClaims.DisplayName, $"API token '{token.Name}'"),
            new(UserClaims.TokenId, token.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)),
        ];
        claims.AddRange(token.ScopeList.Select(s => new Claim(UserClaims.Scope, s)));
        var identity = new ClaimsIdentity(claims, SchemeName);
        return AuthenticateResult.Success(new AuthenticationTicket(new ClaimsPrincipal(identity), SchemeName));
    }

    protected override Task HandleChallengeAsync(AuthenticationProperties properties)
    {
        var (reason, detail) = Context.Items[RefusalKey] as (string, string)? ?? ("missing", "Send a valid API token as 'Authorization: Bearer ert_...'.");
        Response.Headers.WWWAuthenticate = $"Bearer error=\"invalid_token\", error_description=\"{reason}\"";
        return WriteProblem(StatusCodes.Status401Unauthorized, "API token refused", detail, reason);
    }

    protected override Task HandleForbiddenAsync(AuthenticationProperties properties) =>
        WriteProblem(StatusCodes.Status403Forbidden, "Not allowed", "This API token's scopes do not allow this request.", "scope");

    private AuthenticateResult Refuse(string reason, string detail)
    {
        Context.Items[RefusalKey] = ((string, string)?)(reason, detail);
        return AuthenticateResult.Fail(detail);
    }

    private Task WriteProblem(int status, string title, string detail, string reason)
    {
        Response.StatusCode = status;
        return Results.Problem(detail: detail, statusCode: status, title: title, extensions: new Dictionary<string, object?> { ["reason"] = reason }).ExecuteAsync(Context);
    }
}
