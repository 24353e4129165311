using EventReview.Core.Records;
using EventReview.Data.Records;

namespace EventReview.Web.Api;

/// <summary>
/// <c>GET /api/signing-key</c> (no sign-in: public keys are public): the server's record public keys with their validity,
/// so that anyone can check a dossier's signature (<c>eventreview dossier verify FILE.zip --key signing-key.json</c>).
/// </summary>
public static class RecordKeyEndpoints
{
    public static IEndpointRouteBuilder MapRecordKeyApi(this IEndpointRouteBuilder app)
    {
        app.MapGet("/api/signing-key", (IRecordKeyRing keys) => Results.Json(PublicKeyFile.Describe(keys)))
            .AllowAnonymous()
            .RequireRateLimiting(Security.ApiRateLimitPolicy.Name)
            .WithSummary("The server's record public keys (ECDSA P-256) with their validity; the current one signs new dossiers.");
        return app;
    }
}
