using System.Net;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using EventReview.Web.Tests.Fixtures;

namespace EventReview.Web.Tests.Api;

/// <summary>The OpenAPI document as clients read it: open to all, complete, and the same as the committed docs/openapi.json.</summary>
public sealed partial class OpenApiDocumentTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private static readonly string[] Methods = ["get", "post", "put", "patch", "delete"];

    [Fact]
    public async Task The_document_is_read_without_sign_in_and_even_with_a_refused_token()
    {
        var anonymous = app.Anonymous();
        using var open = await anonymous.GetAsync("/openapi/v1.json");
        var expired = await app.As(Who.TokenExpired);
        using var withExpired = await expired.GetAsync("/openapi/v1.json");

        Assert.Equal(HttpStatusCode.OK, open.StatusCode);
        Assert.Equal(HttpStatusCode.OK, withExpired.StatusCode);
        Assert.Equal("EventReview API", (string?)(await open.JsonAsync())["info"]!["title"]);
    }

    [Fact]
    public async Task Every_operation_has_a_unique_operation_id_a_tag_and_the_bearer_scheme_unless_it_is_public()
    {
        var doc = await DocumentAsync();

        Assert.Equal("http", (string?)doc["components"]!["securitySchemes"]!["bearer"]!["type"]);
        Assert.Equal("bearer", (string?)doc["components"]!["securitySchemes"]!["bearer"]!["scheme"]);
        var operations = Operations(doc).ToList();
        Assert.True(operations.Count >= 14, $"{operations.Count} operations");
        Assert.Equal(operations.Count, operations.Select(o => (string?)o.Operation["operationId"]).Distinct().Count());
        foreach (var (path, method, op) in operations)
        {
            Assert.False(string.IsNullOrEmpty((string?)op["operationId"]), $"{method} {path}");
            Assert.NotEmpty(op["tags"]!.AsArray());
            var secured = op["security"]?.AsArray().Any(r => r!.AsObject().ContainsKey("bearer")) == true;
            Assert.True(secured == (path != "/api/signing-key"), $"{method} {path}: bearer {secured}");
        }
    }

    [Fact]
    public async Task Refusals_are_declared_with_the_problem_schema_and_creations_with_201()
    {
        var doc = await DocumentAsync();

        foreach (var (path, method, op) in Operations(doc))
        {
            var responses = op["responses"]!.AsObject();
            foreach (var (status, response) in responses.Where(r => r.Key[0] is '4' or '5'))
            {
                Assert.Equal("#/components/schemas/ProblemDetails", (string?)response!["content"]!["application/problem+json"]!["schema"]!["$ref"]);
            }

            if (path != "/api/signing-key")
            {
                Assert.All(new[] { "401", "403", "429" }, s => Assert.True(responses.ContainsKey(s), $"{method} {path} lacks {s}"));
            }
        }

        Assert.Contains("201", Responses(doc, "/api/cases", "post"));
        Assert.Contains("201", Responses(doc, "/api/cases/{id}/items/{key}/notes", "post"));
        Assert.Contains("201", Responses(doc, "/api/cases/{id}/items/{key}/attachments", "post"));
        Assert.DoesNotContain("200", Responses(doc, "/api/cases/{id}/items/{key}/notes", "post"));
        Assert.Equal(["400", "401", "403", "404", "409", "413", "415", "422", "429"],
            Responses(doc, "/api/cases/{id}/items/{key}/attachments", "post").Where(s => s[0] == '4').Order());
    }

    [Fact]
    public async Task The_upload_is_declared_as_a_multipart_form_with_a_binary_file_field()
    {
        var doc = await DocumentAsync();

        var body = doc["paths"]!["/api/cases/{id}/items/{key}/attachments"]!["post"]!["requestBody"]!;
        var schema = body["content"]!["multipart/form-data"]!["schema"]!;
        Assert.Equal("binary", (string?)schema["properties"]!["file"]!["format"]);
        Assert.Equal(["file"], schema["required"]!.AsArray().Select(n => (string?)n));
        Assert.NotNull(schema["properties"]!["description"]);
    }

    [Fact]
    public async Task The_served_document_is_the_committed_docs_openapi_json()
    {
        // docs/openapi.json is written at build (EventReview.Web.csproj); this fails when the API changed but the file did not.
        var served = await DocumentAsync();
        var committed = JsonNode.Parse(await File.ReadAllTextAsync(Path.Combine(RepositoryRoot(), "docs", "openapi.json")))!;
        served.AsObject().Remove("servers");
        committed.AsObject().Remove("servers");

        Assert.True(JsonNode.DeepEquals(served, committed),
            "docs/openapi.json differs from the document the app serves: build src/EventReview.Web (it rewrites the file) and commit it.");
    }

    [Fact]
    public async Task The_reference_page_is_served_locally_with_the_pages_nonce_and_no_outside_address()
    {
        var anonymous = app.Anonymous();

        using var page = await anonymous.GetAsync("/api/docs/");
        var html = await page.Content.ReadAsStringAsync();

        Assert.Equal(HttpStatusCode.OK, page.StatusCode);
        var policy = page.Headers.GetValues("Content-Security-Policy").Single();
        var nonce = Nonce().Match(policy).Groups[1].Value;
        Assert.NotEmpty(nonce);
        var scripts = Regex.Matches(html, "<script[^>]*>").Select(m => m.Value).ToList();
        Assert.NotEmpty(scripts);
        Assert.All(scripts, s => Assert.Contains($"nonce=\"{nonce}\"", s, StringComparison.Ordinal));
        Assert.DoesNotContain("https://", html, StringComparison.Ordinal);
        Assert.DoesNotContain("http://", html, StringComparison.Ordinal);
        using var script = await anonymous.GetAsync("/api/docs/scalar.js");
        Assert.Equal(HttpStatusCode.OK, script.StatusCode);
        Assert.True((await script.Content.ReadAsByteArrayAsync()).Length > 100_000);
    }

    private async Task<JsonNode> DocumentAsync() => await (await app.Anonymous().GetAsync("/openapi/v1.json")).JsonAsync();

    private static IEnumerable<(string Path, string Method, JsonNode Operation)> Operations(JsonNode doc) =>
        from path in doc["paths"]!.AsObject()
        from op in path.Value!.AsObject()
        where Methods.Contains(op.Key)
        select (path.Key, op.Key, op.Value!);

    private static IEnumerable<string> Responses(JsonNode doc, string path, string method) =>
        doc["paths"]![path]![method]!["responses"]!.AsObject().Select(r => r.Key);

    private static string RepositoryRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "EventReview.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException($"No EventReview.sln above {AppContext.BaseDirectory}.");
    }

    [GeneratedRegex("script-src[^;]*'nonce-([0-9a-f]+)'")]
    private static partial Regex Nonce();
}
