using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Web.Auth;
using EventReview.Web.Services;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Api;

/// <summary>The JSON HTTP API under /api (documented at /openapi/v1.json, browsable at /api/docs).</summary>
public static class CaseEndpoints
{
    /// <summary>Longest text search accepted by <c>GET /api/cases?q=</c>, characters.</summary>
    public const int MaxSearchLength = 200;

    public static IEndpointRouteBuilder MapEventReviewApi(this IEndpointRouteBuilder app)
    {
        // Each endpoint names its own policy (policies on a group add up, so none is set here: a pipeline token may open
        // cases without being able to read them); all share the API rate limit.
        var api = app.MapGroup("/api").DisableAntiforgery().RequireRateLimiting(Security.ApiRateLimitPolicy.Name);

        api.MapPost("/cases", async (HttpRequest request, ClaimsPrincipal user, CaseQueries cases, EvidenceAppender appender, CaseWorkflow workflow) =>
        {
            var (body, error) = await ApiResults.ReadJson<OpenCaseRequest>(request);
            if ((error ?? ApiResults.NullMember(body!.Arrivals, "arrivals")) is { } refused)
            {
                return refused;
            }

            return await ApiResults.Guard(async () =>
            {
                var (c, created) = await workflow.OpenAsync(user, body!);
                var dto = CaseDtos.Detail(c);
                return created ? Results.Created($"/api/cases/{c.Id}", dto) : Results.Ok(dto);
            });
        }).RequireAuthorization(Policies.OpenCases)
          .WithDescription("Open a case for a candidate (idempotent on candidateId: 201 new, 200 existing).")
          .Accepts<OpenCaseRequest>("application/json")
          .Produces<CaseDtos.CaseDetail>(StatusCodes.Status201Created)
          .Produces<CaseDtos.CaseDetail>()
          .Documented("openCase", "Open a case", Tags.Cases, false, 400, 409, 413, 415, 422);

        api.MapGet("/cases", (ClaimsPrincipal user, CaseQueries cases, EvidenceAppender appender, CaseWorkflow workflow, string? state, string? q, int? offset, int? limit) => ApiResults.Guard(async () =>
        {
            CaseState? s = null;
            if (!string.IsNullOrWhiteSpace(state))
            {
                s = Enum.GetValues<CaseState>().Cast<CaseState?>().FirstOrDefault(x => string.Equals(CaseDtos.Api(x!.Value), state.Trim(), StringComparison.OrdinalIgnoreCase))
                    ?? throw new ArgumentException($"state '{(state.Length > 40 ? state[..40] + "..." : state)}' is not one of open, in-review, awaiting-decision, closed.", nameof(state));
            }

            Core.Inputs.InputGuard.Text(q, MaxSearchLength, nameof(q));

            var page = await cases.ListAsync(user, s, q, offset, limit);
            return Results.Ok(new CaseDtos.Page<CaseDtos.CaseSummary>(page.Total, page.Offset, page.Limit, page.Cases.Select(CaseDtos.Summary).ToList()));
        })).RequireAuthorization(Policies.Read).WithDescription("List cases, newest first, one page at a time (offset, limit 1-500, default 50); filter by state and text.")
          .Produces<CaseDtos.Page<CaseDtos.CaseSummary>>().Documented("listCases", "List cases", Tags.Cases, false, 400, 422);

        api.MapGet("/cases/{id:int}", (int id, ClaimsPrincipal user, CaseQueries cases, EvidenceAppender appender, CaseWorkflow workflow) => ApiResults.Guard(async () =>
            Results.Ok(CaseDtos.Detail(await cases.GetOverviewAsync(user, id)))))
            .RequireAuthorization(Policies.Read)
            .WithDescription("One case with its arrivals and checklist item states (evidence counts and fingerprints; evidence itself is paged separately).")
            .Produces<CaseDtos.CaseDetail>().Documented("getCase", "Read a case", Tags.Cases, false, 400, 404);

        api.MapGet("/cases/{id:int}/items/{key}/evidence", (int id, string key, ClaimsPrincipal user, CaseQueries cases, EvidenceAppender appender, CaseWorkflow workflow, int? offset, int? limit) => ApiResults.Guard(async () =>
        {
            var page = await cases.EvidencePageAsync(user, id, key, offset, limit);
            return Results.Ok(new CaseDtos.Page<CaseDtos.Evidence>(page.Total, page.Offset, page.Limit, page.Evidence.Select(CaseDtos.Of).ToList()));
        })).RequireAuthorization(Policies.Read).WithDescription("One page of an item's evidence (notes, files, links), oldest first (offset, limit 1-500, default 50).")
          .Produces<CaseDtos.Page<CaseDtos.Evidence>>().Documented("listEvidence", "List an item's evidence", Tags.Evidence, false, 400, 404, 422);

        api.MapGet("/cases/{id:int}/timeline", (int id, ClaimsPrincipal user, CaseQueries cases, EvidenceAppender appender, CaseWorkflow workflow, int? offset, int? limit) => ApiResults.Guard(async () =>
        {
            var page = await cases.TimelinePageAsync(user, id, offset, limit);
            return Results.Ok(new CaseDtos.Page<CaseDtos.TimelineEntry>(page.Total, page.Offset, page.Limit, page.Entries.Select(CaseDtos.Of).ToList()));
        })).RequireAuthorization(Policies.Read).WithDescription("One page of the case's hash-chained timeline, newest first (offset, limit 1-500, default 50).")
          .Produces<CaseDtos.Page<CaseDtos.TimelineEntry>>().Documented("listTimeline", "List a case's timeline", Tags.Cases, false, 400, 404, 422);

        api.MapGet("/sites", async (NetworkService network) =>
        {
            var n = await network.GetAsync();
            return Results.Ok(n.Sites.OrderBy(s => s.Code).Select(CaseDtos.Site).ToList());
        }).RequireAuthorization(Policies.Read).WithDescription("The network's sites (same fields as the network page and network.json).").Produces<List<CaseDtos.SiteDto>>()
          .Documented("listSites", "List the sites", Tags.Network, false);

        api.MapPost("/cases/{id:int}/items/{key}/notes", async (int id, string key, HttpRequest request, ClaimsPrincipal user, CaseQueries cases, EvidenceAppender appender, CaseWorkflow workflow) =>
        {
            var (body, error) = await ApiResults.ReadJson<NoteRequest>(request);
            if (error is not null)
            {
                return error;
            }

            return await ApiResults.Guard(async () =>
            {
                if (string.IsNullOrWhiteSpace(body!.Text))
                {
                    throw new ArgumentException("text is required (Markdown).", "text");
                }

                var r = await appender.AppendNoteAsync(user, id, key, body.Text);
                return Results.Created(EvidencePath(id, key), new CaseDtos.NoteAdded(r.EvidenceId, r.ContentSha256, CaseDtos.Api(r.ItemState), r.ItemFingerprint));
            });
        }).RequireAuthorization(Policies.AddEvidence).Accepts<NoteRequest>("application/json")
          .WithDescription("Add a Markdown note to a checklist item (current sign-offs become stale).")
          .Produces<CaseDtos.NoteAdded>(StatusCodes.Status201Created)
          .Documented("addNote", "Add a note", Tags.Evidence, false, 400, 404, 409, 413, 415, 422);

        api.MapPost("/cases/{id:int}/items/{key}/attachments", (int id, string key, HttpRequest request, ClaimsPrincipal user, CaseQueries cases, EvidenceAppender appender, CaseWorkflow workflow, IOptions<EventReviewOptions> options) =>
            ApiResults.Guard(async () =>
            {
                if (!MultipartForms.IsMultipart(request.ContentType))
                {
                    return ApiResults.Problem(StatusCodes.Status415UnsupportedMediaType, "Multipart form expected",
                        $"Send the file as multipart/form-data with a field named 'file' (got {(string.IsNullOrEmpty(request.ContentType) ? "no content type" : $"'{request.ContentType}'")}); nothing was stored.");
                }

                var max = options.Value.MaxUploadBytes;
                if (request.ContentLength > max + (1024 * 1024))
                {
                    return ApiResults.Problem(StatusCodes.Status413PayloadTooLarge, "File too large", $"The upload limit is {max / (1024 * 1024)} MB.");
                }

                var form = await MultipartForms.ReadAsync(request);
                var file = form.Files.GetFile("file") ?? (form.Files.Count > 0 ? form.Files[0] : null)
                    ?? throw new ArgumentException("The form has no file; send it in a field named 'file'.", "file");
                if (form["description"].Count > 1)
                {
                    throw new MalformedRequestException("description", "The form has more than one 'description' field; send one.");
                }

                if (form["role"].Count > 1)
                {
                    throw new MalformedRequestException("role", "The form has more than one 'role' field; send one.");
                }

                // The role is checked before the bytes are stored, so a refused upload leaves nothing behind.
                var role = string.IsNullOrWhiteSpace(form["role"].ToString()) ? null : EventReview.Core.Evidence.Roles.FileRole.Parse(form["role"].ToString());
                await using var stream = file.OpenReadStream();
                var r = await appender.AppendAttachmentAsync(user, id, key, stream, file.FileName, string.IsNullOrWhiteSpace(file.ContentType) ? "application/octet-stream" : file.ContentType,
                    form["description"].ToString(), max, role);
                return Results.Created(EvidencePath(id, key), new CaseDtos.FileAdded(r.EvidenceId, r.ContentSha256, r.SizeBytes ?? 0, r.FileName ?? string.Empty, r.ItemFingerprint, r.Role?.Word, r.RoleGuess));
            })).RequireAuthorization(Policies.AddEvidence).DisableAntiforgery()
              .WithDescription("Attach a file (multipart field 'file', optional 'description' and 'role', e.g. strain:KP or dq-segments; without a role it is guessed from the content and the answer says from what); stored by SHA-256 (current sign-offs become stale).")
              .WithMetadata(new ApiDocumentation.MultipartUpload("file", "The file, any type; stored as opaque bytes and served back only as a download.",
                  new Dictionary<string, string>
                  {
                      ["description"] = "Optional one-line description shown beside the file.",
                      ["role"] = "Optional role of the file: strain:SITE, dq-segments, triggers, and the others listed in docs/formats/csv-inputs.md; guessed from the content when left out.",
                  }))
              .Produces<CaseDtos.FileAdded>(StatusCodes.Status201Created)
              .Documented("addAttachment", "Attach a file", Tags.Evidence, false, 400, 404, 409, 413, 415, 422);

        app.MapGet("/files/{sha}", (string sha, EventReview.Data.AttachmentStore store, string? name) =>
        {
            if (!EventReview.Core.Evidence.Hashing.IsSha256Hex(sha))
            {
                return Results.NotFound();
            }

            // Always a download of opaque bytes (the security headers add a sandbox policy); the name is cleaned, never a path.
            var s = store.Open(sha);
            return s is null ? Results.NotFound() : Results.File(s, "application/octet-stream", EventReview.Core.Evidence.SafeFileName.From(name, sha));
        }).RequireAuthorization(Policies.Read).RequireRateLimiting(Security.ApiRateLimitPolicy.Name)
          .WithDescription("An attachment's bytes by SHA-256 (always a download; ?name= sets the offered file name).")
          .Produces<byte[]>(contentType: "application/octet-stream").Documented("downloadFile", "Download a file", Tags.Downloads, false, 404);

        app.MapGet("/cases/{id:int}/dossier.zip", async (int id, ClaimsPrincipal user, EventReview.Dossier.CaseDossierService dossiers, CaseQueries cases, EvidenceAppender appender, CaseWorkflow workflow, HttpContext http) =>
        {
            ReviewCase c;
            try
            {
                c = await cases.GetAsync(user, id);
            }
            catch (KeyNotFoundException ex)
            {
                return ApiResults.Problem(StatusCodes.Status404NotFound, "Not found", ex.Message);
            }

            using var buffer = new MemoryStream();
            await dossiers.ExportAsync(id, user.ToActor(), buffer, http.RequestAborted);
            return Results.File(buffer.ToArray(), "application/zip", EventReview.Core.Evidence.SafeFileName.From($"{c.CandidateId}-dossier.zip", "dossier.zip"));
        }).RequireAuthorization(Policies.Read).RequireRateLimiting(Security.ApiRateLimitPolicy.Name)
          .WithDescription("The case's signed dossier (zip), verifiable offline with 'eventreview dossier verify'.")
          .Produces<byte[]>(contentType: "application/zip").Documented("downloadDossier", "Download a case dossier", Tags.Downloads, false, 400, 404);

        app.MapGet("/network.json", async (NetworkService network) =>
        {
            var n = await network.GetAsync();
            var json = EventReview.Core.Network.NetworkFile.Write(new EventReview.Core.Network.NetworkDefinition(n.Name, n.Sites.OrderBy(s => s.Code).ToList()));
            return Results.File(System.Text.Encoding.UTF8.GetBytes(json), "application/json", "network.json");
        }).RequireAuthorization(Policies.Read).RequireRateLimiting(Security.ApiRateLimitPolicy.Name)
          .WithDescription("The detector network as a network.json file (the format 'eventreview network import' reads).")
          .Produces<byte[]>(contentType: "application/json").Documented("downloadNetwork", "Download the network file", Tags.Downloads, false);

        ItemRecordEndpoints.Map(api);
        return app;
    }

    /// <summary>Where an item's evidence is read (the Location of a created note or file).</summary>
    public static string EvidencePath(int caseId, string itemKey) => $"/api/cases/{caseId}/items/{Uri.EscapeDataString(itemKey)}/evidence";

    /// <summary>Tags grouping the operations in the reference.</summary>
    public static class Tags
    {
        public const string Cases = "Cases";
        public const string Evidence = "Evidence";
        public const string Records = "Records and sign-offs";
        public const string Network = "Network";
        public const string Downloads = "Downloads";
        public const string Keys = "Signing keys";
    }
}
