using Scalar.AspNetCore;

namespace EventReview.Web.Api;

/// <summary>
/// The browsable API reference at <c>/api/docs</c> (Scalar, its script served by the app itself: no network needed),
/// readable without sign-in like the OpenAPI document it draws. Its script tags carry the request's CSP nonce, fonts
/// come from the browser, and nothing is reported anywhere.
/// </summary>
public static class ApiReference
{
    public static IEndpointRouteBuilder MapApiReference(this IEndpointRouteBuilder app)
    {
        app.MapScalarApiReference(ApiDocumentation.ReferencePath, (o, http) => o
                .WithTitle("EventReview API reference")
                .WithOpenApiRoutePattern("/openapi/{documentName}.json")
                .WithNonce(Security.SecurityHeaders.Nonce(http))
                .AddPreferredSecuritySchemes(ApiDocumentation.BearerScheme)
                .DisableDefaultFonts()
                .DisableTelemetry()
                .DisableAgent()
                .DisableMcp()
                .HideDeveloperTools()
                .ShowOperationId()
                .SortTagsAlphabetically())
            .AllowAnonymous()
            .RequireRateLimiting(Security.ApiRateLimitPolicy.Name);
        return app;
    }
}
