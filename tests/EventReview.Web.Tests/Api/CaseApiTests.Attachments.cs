using System.Net;
using System.Net.Http.Json;
using EventReview.Core.Evidence;
using EventReview.Web.Services;
using EventReview.Web.Tests.Fixtures;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Api;

/// <summary>Attachments through the API, and the OpenAPI document covering every endpoint.</summary>
public sealed partial class CaseApiTests
{
    [Fact]
    public async Task An_attachment_is_stored_by_its_sha256_and_can_be_downloaded()
    {
        var client = await app.As(Who.Reviewer);
        var id = await client.CaseIdAsync("ER-C-0142");
        var bytes = System.Security.Cryptography.RandomNumberGenerator.GetBytes(5000);
        var sha = Hashing.Sha256Hex(bytes);

        var response = await client.AttachAsync(id, "timing.arrival", bytes, "../../evil/strain plot.bin", "A plot");

        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        var json = await response.JsonAsync();
        Assert.Equal(sha, (string?)json["sha256"]);
        Assert.Equal(5000, json["sizeBytes"]!.GetValue<long>());
        Assert.Equal("strain plot.bin", (string?)json["fileName"]);
        Assert.Equal(bytes, await File.ReadAllBytesAsync(Path.Combine(app.AttachmentDirectory, sha[..2], sha)));
        Assert.Equal(bytes, await client.GetByteArrayAsync($"/files/{sha}"));
        Assert.Equal((string?)json["fingerprint"], (string?)(await client.ItemAsync(id, "timing.arrival"))["fingerprint"]);
    }

    [Fact]
    public async Task An_attachment_over_the_configured_limit_is_a_413_and_nothing_is_kept()
    {
        var client = await app.As(Who.Reviewer);
        var id = await client.CaseIdAsync("ER-C-0142");
        var bytes = System.Security.Cryptography.RandomNumberGenerator.GetBytes((int)EventReviewFactory.MaxUploadBytes + 1);
        var before = await client.ItemAsync(id, "timing.arrival");

        var response = await client.AttachAsync(id, "timing.arrival", bytes);

        Assert.Equal(HttpStatusCode.RequestEntityTooLarge, response.StatusCode);
        Assert.Equal("File too large", (string?)(await response.JsonAsync())["title"]);
        var sha = Hashing.Sha256Hex(bytes);
        Assert.False(File.Exists(Path.Combine(app.AttachmentDirectory, sha[..2], sha)));
        Assert.Empty(Directory.EnumerateFiles(app.AttachmentDirectory, ".incoming-*", SearchOption.AllDirectories));
        Assert.Equal((string?)before["fingerprint"], (string?)(await client.ItemAsync(id, "timing.arrival"))["fingerprint"]);
    }

    [Fact]
    public async Task An_attachment_request_without_a_file_is_a_422_naming_the_field_and_one_that_is_not_a_form_a_415()
    {
        var client = await app.As(Who.Reviewer);
        var id = await client.CaseIdAsync("ER-C-0142");
        var form = new MultipartFormDataContent { { new StringContent("only words"), "description" } };

        var response = await client.PostAsync($"/api/cases/{id}/items/timing.arrival/attachments", form);
        var notMultipart = await client.PostAsJsonAsync($"/api/cases/{id}/items/timing.arrival/attachments", new { file = "x" });

        Assert.Equal(HttpStatusCode.UnprocessableEntity, response.StatusCode);
        Assert.Equal("file", (string?)(await response.JsonAsync())["field"]);
        Assert.Equal(HttpStatusCode.UnsupportedMediaType, notMultipart.StatusCode);
        Assert.Contains("multipart/form-data", (string?)(await notMultipart.JsonAsync())["detail"], StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_openapi_document_describes_every_api_endpoint()
    {
        var client = await app.As(Who.Observer);

        var doc = await (await client.GetAsync("/openapi/v1.json")).JsonAsync();

        var paths = doc["paths"]!.AsObject().Select(p => p.Key).ToList();
        Assert.Contains("/api/cases", paths);
        Assert.Contains("/api/cases/{id}", paths);
        Assert.Contains("/api/sites", paths);
        Assert.Contains("/api/cases/{id}/items/{key}/notes", paths);
        Assert.Contains("/api/cases/{id}/items/{key}/attachments", paths);
        Assert.NotNull(doc["paths"]!["/api/cases"]!["post"]);
    }
}
