using System.Net;
using EventReview.Core.Evidence;
using EventReview.Web.Tests.Fixtures;

namespace EventReview.Web.Tests.Security;

/// <summary>Content security policy and framing protection everywhere; attachments only ever as inert downloads.</summary>
public sealed class SecurityHeadersTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private static void AssertFramingAndSniffing(HttpResponseMessage response)
    {
        Assert.Equal("DENY", response.Headers.GetValues("X-Frame-Options").Single());
        Assert.Equal("nosniff", response.Headers.GetValues("X-Content-Type-Options").Single());
        Assert.Equal("same-origin", response.Headers.GetValues("Referrer-Policy").Single());
    }

    [Theory]
    [InlineData(Who.Anonymous, "/signin")]
    [InlineData(Who.Reviewer, "/cases")]
    [InlineData(Who.Reviewer, "/api/cases")]
    [InlineData(Who.Anonymous, "/api/cases")]
    [InlineData(Who.Reviewer, "/no-such-page")]
    public async Task Pages_and_api_answers_carry_the_content_security_policy(string who, string path)
    {
        using var response = await (await app.As(who)).GetAsync(path);

        AssertFramingAndSniffing(response);
        var csp = response.Headers.GetValues("Content-Security-Policy").Single();
        Assert.Contains("default-src 'self'", csp, StringComparison.Ordinal);
        Assert.Contains("frame-ancestors 'none'", csp, StringComparison.Ordinal);
        Assert.Matches("script-src 'self' 'nonce-[A-Za-z0-9+/=]+';", csp);
        Assert.DoesNotContain("unsafe-eval", csp, StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_import_map_carries_the_nonce_of_the_policy()
    {
        using var response = await app.Anonymous().GetAsync("/signin");
        var csp = response.Headers.GetValues("Content-Security-Policy").Single();
        var nonce = System.Text.RegularExpressions.Regex.Match(csp, "'nonce-(?<n>[^']+)'").Groups["n"].Value;

        var html = await response.Content.ReadAsStringAsync();

        Assert.Contains($"<script type=\"importmap\" nonce=\"{nonce}\"", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_uploaded_svg_comes_back_as_an_octet_stream_download_in_a_sandbox()
    {
        var reviewer = await app.As(Who.Reviewer);
        var caseId = await reviewer.CaseIdAsync("ER-C-0142");
        var svg = "<svg xmlns=\"http://www.w3.org/2000/svg\"><script>window.__xss=1</script></svg>"u8.ToArray();
        var form = new MultipartFormDataContent();
        var file = new ByteArrayContent(svg);
        file.Headers.ContentType = new System.Net.Http.Headers.MediaTypeHeaderValue("image/svg+xml");
        form.Add(file, "file", "plot.svg");
        Assert.Equal(HttpStatusCode.Created, (await reviewer.PostAsync($"/api/cases/{caseId}/items/timing.arrival/attachments", form)).StatusCode);

        using var response = await reviewer.GetAsync($"/files/{Hashing.Sha256Hex(svg)}?name=plot.svg");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        AssertFramingAndSniffing(response);
        Assert.Equal("application/octet-stream", response.Content.Headers.ContentType?.MediaType);
        Assert.Equal("attachment", response.Content.Headers.ContentDisposition?.DispositionType);
        Assert.Equal("plot.svg", response.Content.Headers.ContentDisposition?.FileNameStar ?? response.Content.Headers.ContentDisposition?.FileName?.Trim('"'));
        Assert.Equal("sandbox; default-src 'none'", response.Headers.GetValues("Content-Security-Policy").Single());
    }

    [Theory]
    [InlineData("../../etc/evil.html", "evil.html")]
    [InlineData("a\r\nSet-Cookie: x=1.txt", "aSet-Cookie: x=1.txt")]
    public async Task A_download_name_is_cleaned_of_paths_and_control_characters(string name, string expected)
    {
        var reviewer = await app.As(Who.Reviewer);
        var caseId = await reviewer.CaseIdAsync("ER-C-0142");
        var bytes = System.Text.Encoding.UTF8.GetBytes("named " + name);
        Assert.Equal(HttpStatusCode.Created, (await reviewer.AttachAsync(caseId, "timing.arrival", bytes, "x.txt")).StatusCode);

        using var response = await reviewer.GetAsync($"/files/{Hashing.Sha256Hex(bytes)}?name={Uri.EscapeDataString(name)}");

        Assert.Equal(expected, response.Content.Headers.ContentDisposition?.FileNameStar ?? response.Content.Headers.ContentDisposition?.FileName?.Trim('"'));
        Assert.False(response.Headers.Contains("x"));
    }

    [Fact]
    public async Task An_upload_named_like_a_path_is_stored_only_under_its_hash_and_listed_under_its_clean_name()
    {
        var reviewer = await app.As(Who.Reviewer);
        var caseId = await reviewer.CaseIdAsync("ER-C-0142");
        var bytes = System.Text.Encoding.UTF8.GetBytes("path attempt " + Guid.NewGuid());

        using var response = await reviewer.AttachAsync(caseId, "timing.arrival", bytes, "../../../outside.html");

        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        Assert.Equal("outside.html", (string?)(await response.JsonAsync())["fileName"]);
        var stored = Directory.EnumerateFiles(app.AttachmentDirectory, "*", SearchOption.AllDirectories).Select(Path.GetFileName).ToList();
        Assert.All(stored, f => Assert.True(Hashing.IsSha256Hex(f), $"{f} is not a hash name"));
        Assert.Contains(Hashing.Sha256Hex(bytes), stored);
        Assert.False(File.Exists(Path.Combine(app.DataDirectory, "outside.html")));
        Assert.Empty(Directory.EnumerateFiles(Path.GetTempPath(), "outside.html"));
    }

    [Fact]
    public async Task The_dossier_download_is_a_zip_attachment_in_a_sandbox()
    {
        var reviewer = await app.As(Who.Reviewer);
        var caseId = await reviewer.CaseIdAsync("ER-C-0142");

        using var response = await reviewer.GetAsync($"/cases/{caseId}/dossier.zip");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("application/zip", response.Content.Headers.ContentType?.MediaType);
        Assert.Equal("attachment", response.Content.Headers.ContentDisposition?.DispositionType);
        Assert.Equal("sandbox; default-src 'none'", response.Headers.GetValues("Content-Security-Policy").Single());
        AssertFramingAndSniffing(response);
    }
}
