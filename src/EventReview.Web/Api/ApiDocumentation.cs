using Microsoft.AspNetCore.Authorization;
using Microsoft.OpenApi;

namespace EventReview.Web.Api;

/// <summary>
/// The OpenAPI document at <c>/openapi/v1.json</c> (readable without sign-in; also written to <c>docs/openapi.json</c>
/// at build): the bearer scheme on every operation that needs sign-in, and the multipart body of file uploads.
/// Operation ids, tags and problem answers are declared beside each endpoint with <see cref="Documented"/>.
/// </summary>
public static class ApiDocumentation
{
    /// <summary>Name of the security scheme (API tokens: <c>Authorization: Bearer ert_...</c>).</summary>
    public const string BearerScheme = "bearer";

    /// <summary>Where the browsable reference is served.</summary>
    public const string ReferencePath = "/api/docs";

    public static IServiceCollection AddEventReviewOpenApi(this IServiceCollection services) => services.AddOpenApi(o =>
    {
        o.AddDocumentTransformer((document, _, _) =>
        {
            document.Info.Title = "EventReview API";
            document.Info.Version = "v1";
            document.Info.Description =
                "Cases, checklist items, evidence, computation records and sign-offs of an EventReview server. Send an API token as " +
                "'Authorization: Bearer ert_...' (made on the Tokens page or with 'eventreview token create'); a token acts only within its scopes. " +
                "Every refusal is an RFC 9457 problem (application/problem+json) naming what was wrong; a refused request has changed nothing. " +
                "Decisions rest with the people who sign, under their collaboration's own procedures.";

            // The servers list would name whichever host asked; the document is the same for every server.
            document.Servers?.Clear();
            document.Components ??= new OpenApiComponents();
            document.Components.SecuritySchemes ??= new Dictionary<string, IOpenApiSecurityScheme>();
            document.Components.SecuritySchemes[BearerScheme] = new OpenApiSecurityScheme
            {
                Type = SecuritySchemeType.Http,
                Scheme = "bearer",
                BearerFormat = "ert_ token",
                Description = "An API token (ert_ followed by 40 or more characters). Signed-in browsers use the session cookie instead.",
            };
            return Task.CompletedTask;
        });
        o.AddOperationTransformer((operation, context, _) =>
        {
            var metadata = context.Description.ActionDescriptor.EndpointMetadata;
            if (!metadata.OfType<IAllowAnonymous>().Any())
            {
                operation.Security ??= [];
                operation.Security.Add(new OpenApiSecurityRequirement { [new OpenApiSecuritySchemeReference(BearerScheme, context.Document)] = [] });
            }

            if (metadata.OfType<MultipartUpload>().FirstOrDefault() is { } upload)
            {
                operation.RequestBody = upload.Body();
            }

            return Task.CompletedTask;
        });
    });

    /// <summary>
    /// Names an operation (its <c>operationId</c> and a short summary; the longer text goes in its description), files it under a tag and declares its refusals as problem answers:
    /// 401/403/429 for every operation that needs sign-in, plus the statuses given.
    /// </summary>
    public static RouteHandlerBuilder Documented(this RouteHandlerBuilder builder, string operationId, string summary, string tag, bool anonymous, params int[] problems)
    {
        builder.WithName(operationId).WithSummary(summary).WithTags(tag);
        var all = anonymous ? problems : [.. problems, StatusCodes.Status401Unauthorized, StatusCodes.Status403Forbidden, StatusCodes.Status429TooManyRequests];
        foreach (var status in all.Distinct().Order())
        {
            builder.ProducesProblem(status);
        }

        return builder;
    }

    /// <summary>Endpoint metadata: the body is a multipart form with a file field (and optional text fields).</summary>
    public sealed record MultipartUpload(string FileField, string FileDescription, IReadOnlyDictionary<string, string> TextFields)
    {
        public OpenApiRequestBody Body()
        {
            var properties = new Dictionary<string, IOpenApiSchema>
            {
                [FileField] = new OpenApiSchema { Type = JsonSchemaType.String, Format = "binary", Description = FileDescription },
            };
            foreach (var (name, description) in TextFields)
            {
                properties[name] = new OpenApiSchema { Type = JsonSchemaType.String, Description = description };
            }

            return new OpenApiRequestBody
            {
                Required = true,
                Content = new Dictionary<string, OpenApiMediaType>
                {
                    ["multipart/form-data"] = new OpenApiMediaType
                    {
                        Schema = new OpenApiSchema { Type = JsonSchemaType.Object, Required = new HashSet<string> { FileField }, Properties = properties },
                    },
                },
            };
        }
    }
}
