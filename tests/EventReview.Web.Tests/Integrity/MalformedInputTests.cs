using System.IO.Compression;
using System.Net;
using System.Net.Http.Headers;
using System.Security.Claims;
using System.Text;
using EventReview.Dossier;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Integrity;

/// <summary>
/// A corpus of malformed inputs, through the API and the services: truncated and hostile ZIPs, bad JSON (truncated,
/// wrong types, deeply nested, a 5 MB line), a note that is not UTF-8, NaN in configuration values, an upload named
/// "../../etc/passwd". Each gets a clear answer and changes nothing.
/// </summary>
public sealed class MalformedInputTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private static readonly ClaimsPrincipal ReviewerA = Principals.Reviewer("u-rev-a", "Reviewer Ada");

    /// <summary>Everything a refused input could have changed: row counts, every item's fingerprint, and the files in the data folder.</summary>
    private async Task<string> StateAsync()
    {
        await using var db = app.Db();
        var cases = await db.CasesWithEverything().AsNoTracking().OrderBy(c => c.Id).ToListAsync();
        var fingerprints = cases.SelectMany(c => c.Items.OrderBy(i => i.Key).Select(i => $"{c.CandidateId}/{i.Key}={i.Fingerprint()}"));
        var files = Directory.EnumerateFiles(app.DataDirectory, "*", SearchOption.AllDirectories)
            .Select(f => Path.GetRelativePath(app.DataDirectory, f))
            .Where(f => !f.StartsWith(DatabaseFilePrefix, StringComparison.Ordinal))
            .Order(StringComparer.Ordinal);
        return string.Join('\n', [
            $"cases {cases.Count}", $"activity {cases.Sum(c => c.Timeline.Count)}", $"snapshots {await db.ConfigurationSnapshots.CountAsync()}",
            .. fingerprints, .. files]);
    }

    /// <summary>The SQLite file and its -wal/-shm companions change size on their own; the rows are compared instead.</summary>
    private static readonly string DatabaseFilePrefix = Data.DatabaseSettings.SqliteFileName;

    private async Task<(HttpStatusCode Status, string Title, string Detail, string? Field)> PostCaseAsync(HttpContent body)
    {
        var client = await app.As(Who.Coordinator);
        using var response = await client.PostAsync("/api/cases", body);
        var json = await response.JsonAsync();
        return (response.StatusCode, (string?)json["title"] ?? string.Empty, (string?)json["detail"] ?? string.Empty, (string?)json["field"]);
    }

    public static TheoryData<string, string, string?> BadCaseBodies() => new()
    {
        { "truncated", """{"candidateId": "TC-TRUNCATED", "gpsTime": 1400000000.1, "arrivals": [{"site": "KP", """, null },
        { "candidate id as a number", """{"candidateId": 42, "gpsTime": 1400000000.1}""", "candidateId" },
        { "arrivals as an object", """{"candidateId": "TC-WRONG-TYPE", "gpsTime": 1400000000.1, "arrivals": {"site": "KP"}}""", "arrivals" },
        { "snr as a string", """{"candidateId": "TC-WRONG-SNR", "gpsTime": 1400000000.1, "arrivals": [{"site": "KP", "gpsTime": 1400000000.1, "snr": "loud"}]}""", "arrivals[0].snr" },
        { "trailing text", """{"candidateId": "TC-TRAILING", "gpsTime": 1400000000.1} and more""", null },
        { "deeply nested", """{"candidateId": "TC-NESTED", "gpsTime": 1400000000.1, "extra": """ + new string('[', 5000) + new string(']', 5000) + "}", null },
        { "arrivals nested too deep", """{"candidateId": "TC-NESTED-2", "gpsTime": 1400000000.1, "arrivals": """ + new string('[', 5000) + new string(']', 5000) + "}", "arrivals[0]" },
        { "NaN for a number", """{"candidateId": "TC-NAN", "gpsTime": NaN}""", null },
    };

    [Theory]
    [MemberData(nameof(BadCaseBodies))]
    public async Task A_malformed_case_body_is_a_400_naming_the_problem_and_creates_nothing(string what, string body, string? field)
    {
        var before = await StateAsync();

        var (status, title, detail, named) = await PostCaseAsync(ApiCalls.Json(body));

        Assert.True(status == HttpStatusCode.BadRequest, $"{what}: {(int)status} {detail}");
        Assert.Equal("Malformed JSON", title);
        Assert.StartsWith("Malformed JSON at '", detail, StringComparison.Ordinal);
        if (field is not null)
        {
            Assert.Equal(field, named);
        }

        if (what == "deeply nested")
        {
            Assert.Contains("depth", detail, StringComparison.OrdinalIgnoreCase);
        }

        Assert.Equal(before, await StateAsync());
    }

    [Fact]
    public async Task The_reported_poison_snr_is_refused_naming_the_field_and_every_page_and_export_still_reads()
    {
        // The reported request: a finite SNR whose square overflows stored a case with an infinite network SNR, answered
        // 500, and from then on its page, the case list and its dossier failed.
        var pipeline = await app.As(Who.TokenPipeline);
        var candidate = ApiCalls.NewCandidateId();
        var before = await StateAsync();
        var body = $$"""{"candidateId": "{{candidate}}", "gpsTime": 1400000000.125, "arrivals": [{"site": "KP", "gpsTime": 1400000000.127, "snr": 1e308}]}""";

        using var response = await pipeline.PostAsync("/api/cases", ApiCalls.Json(body));

        Assert.Equal(HttpStatusCode.UnprocessableEntity, response.StatusCode);
        var problem = await response.JsonAsync();
        Assert.Equal("arrivals[0].snr", (string?)problem["field"]);
        Assert.Contains("from 0 to 10000", (string?)problem["detail"], StringComparison.Ordinal);
        Assert.Equal(before, await StateAsync());
        var reader = await app.As(Who.Observer);
        Assert.Empty((await (await reader.GetAsync($"/api/cases?q={candidate}")).JsonAsync())["items"]!.AsArray());
        Assert.Equal(HttpStatusCode.OK, (await reader.GetAsync("/cases")).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await reader.GetAsync("/api/cases")).StatusCode);
        var id = await reader.CaseIdAsync("ER-C-0142");
        Assert.Equal(HttpStatusCode.OK, (await reader.GetAsync($"/cases/{id}")).StatusCode);
    }

    [Fact]
    public async Task A_5_mb_single_line_case_body_is_refused_as_too_large_and_creates_nothing()
    {
        var candidate = ApiCalls.NewCandidateId();
        var before = await StateAsync();
        var body = $$"""{"candidateId": "{{candidate}}", "gpsTime": 1400000000.125, "summary": "{{new string('x', 5 * 1024 * 1024)}}"}""";

        var (status, title, detail, _) = await PostCaseAsync(ApiCalls.Json(body));

        Assert.Equal(HttpStatusCode.RequestEntityTooLarge, status);
        Assert.Equal("JSON body too large", title);
        Assert.Contains("1024 KiB", detail, StringComparison.Ordinal);
        Assert.Equal(before, await StateAsync());
        Assert.Empty((await (await (await app.As(Who.Coordinator)).GetAsync($"/api/cases?q={candidate}")).JsonAsync())["items"]!.AsArray());
    }

    [Fact]
    public async Task A_5_mb_body_sent_without_a_length_is_refused_as_it_arrives()
    {
        var before = await StateAsync();
        var bytes = Encoding.UTF8.GetBytes("{\"candidateId\": \"" + new string('y', 5 * 1024 * 1024));
        var content = new StreamContent(new MemoryStream(bytes));
        content.Headers.ContentType = new MediaTypeHeaderValue("application/json");
        content.Headers.ContentLength = null;

        var (status, title, _, _) = await PostCaseAsync(content);

        Assert.Equal((HttpStatusCode.RequestEntityTooLarge, "JSON body too large"), (status, title));
        Assert.Equal(before, await StateAsync());
    }

    [Fact]
    public async Task A_summary_over_the_stored_limit_is_a_422_naming_the_field()
    {
        var before = await StateAsync();
        var body = new { candidateId = ApiCalls.NewCandidateId(), gpsTime = 1_400_000_000.125m, summary = new string('s', 20_001) };

        using var response = await (await app.As(Who.Coordinator)).PostAsync("/api/cases", ApiCalls.Json(System.Text.Json.JsonSerializer.Serialize(body)));

        Assert.Equal(HttpStatusCode.UnprocessableEntity, response.StatusCode);
        var json = await response.JsonAsync();
        Assert.Equal("summary", (string?)json["field"]);
        Assert.Contains("at most 20000 characters", (string?)json["detail"], StringComparison.Ordinal);
        Assert.Equal(before, await StateAsync());
    }

    [Fact]
    public async Task A_note_whose_bytes_are_not_utf8_is_a_400_and_the_item_is_unchanged()
    {
        var client = await app.As(Who.Reviewer);
        var id = await client.CaseIdAsync("ER-C-0142");
        var before = await StateAsync();
        // "café" in Latin-1: the 0xE9 byte is not valid UTF-8.
        byte[] bytes = [.. "{\"text\": \"caf"u8, 0xE9, .. "\"}"u8];
        var content = new ByteArrayContent(bytes);
        content.Headers.ContentType = new MediaTypeHeaderValue("application/json");

        using var response = await client.PostAsync($"/api/cases/{id}/items/timing.arrival/notes", content);

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var json = await response.JsonAsync();
        Assert.Equal("Malformed JSON", (string?)json["title"]);
        Assert.Contains("UTF-8", (string?)json["detail"], StringComparison.OrdinalIgnoreCase);
        Assert.Equal(before, await StateAsync());
    }

    [Theory]
    [InlineData("{\n  \"daq.firmware\": \"4.2.1\",\n  \"filter.gain\": NaN\n}", "line 3")]
    [InlineData("{\"a\": {\"b\": Infinity}}", "line 1")]
    [InlineData("{\n\"a\": -NaN\n}", "line 2")]
    public async Task A_configuration_with_nan_is_refused_naming_the_line_and_nothing_is_stored(string text, string line)
    {
        var c = await Get<CaseQueries>().GetAsync(ReviewerA, await (await app.As(Who.Observer)).CaseIdAsync("ER-C-0142"));
        var before = await StateAsync();

        var ex = await Assert.ThrowsAsync<FormatException>(() => Get<ConfigurationService>().CaptureAsync(ReviewerA, c, "KP", "bad", text, "kp.json"));

        Assert.StartsWith($"kp.json, {line}: invalid JSON", ex.Message, StringComparison.Ordinal);
        Assert.Equal(before, await StateAsync());
    }

    [Theory]
    [InlineData("../../etc/passwd", "passwd")]
    [InlineData("/etc/passwd", "passwd")]
    [InlineData("..\\..\\evil.txt", "evil.txt")]
    public async Task An_upload_named_with_a_parent_path_is_stored_by_hash_only_and_keeps_the_bare_name_for_display(string fileName, string shown)
    {
        var client = await app.As(Who.Reviewer);
        var id = await client.CaseIdAsync("ER-C-0142");
        var bytes = Encoding.UTF8.GetBytes("root:x:0:0 " + Guid.NewGuid());
        var sha = Core.Evidence.Hashing.Sha256Hex(bytes);
        var before = Files();

        using var response = await client.AttachAsync(id, "timing.arrival", bytes, fileName);

        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        var json = await response.JsonAsync();
        Assert.Equal((sha, shown), ((string?)json["sha256"], (string?)json["fileName"]));
        var added = Files().Except(before).ToList();
        Assert.Equal([Path.Combine("attachments", sha[..2], sha)], added);
        var outside = Path.GetFullPath(Path.Combine(app.AttachmentDirectory, fileName.Replace('\\', '/')));
        Assert.False(File.Exists(outside) && File.ReadAllBytes(outside).SequenceEqual(bytes), $"the upload was written to {outside}");
    }

    private IReadOnlyList<string> Files() => Directory.EnumerateFiles(app.DataDirectory, "*", SearchOption.AllDirectories)
        .Select(f => Path.GetRelativePath(app.DataDirectory, f))
        .Where(f => !f.StartsWith(DatabaseFilePrefix, StringComparison.Ordinal))
        .ToList();

    private async Task<byte[]> DemoDossierAsync()
    {
        var client = await app.As(Who.Observer);
        var id = await client.CaseIdAsync("ER-C-0121");
        using var response = await client.GetAsync($"/cases/{id}/dossier.zip");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        return await response.Content.ReadAsByteArrayAsync();
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(0.9)]
    [InlineData(0.01)]
    public async Task A_truncated_dossier_is_a_clear_problem_not_an_exception(double keep)
    {
        var zip = await DemoDossierAsync();

        var v = await DossierArchive.VerifyAsync(new MemoryStream(zip[..(int)(zip.Length * keep)]));

        Assert.False(v.Valid);
        var p = Assert.Single(v.Problems);
        Assert.Equal(DossierArchive.ZipName, p.File);
        Assert.Contains("not a readable ZIP file (truncated or corrupt)", p.What, StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_empty_upload_to_the_dossier_verifier_is_a_clear_problem()
    {
        var v = await DossierArchive.VerifyAsync(new MemoryStream([]));

        Assert.False(v.Valid);
        Assert.Equal(DossierArchive.ZipName, Assert.Single(v.Problems).File);
    }

    [Fact]
    public async Task A_dossier_with_a_parent_path_entry_names_it_and_reads_nothing_from_it()
    {
        var ms = new MemoryStream();
        ms.Write(await DemoDossierAsync());
        using (var archive = new ZipArchive(ms, ZipArchiveMode.Update, leaveOpen: true))
        {
            await using var s = archive.CreateEntry("../evil").Open();
            s.Write("#!/bin/sh\necho owned\n"u8);
        }

        ms.Position = 0;
        var v = await DossierArchive.VerifyAsync(ms);

        Assert.False(v.Valid);
        var p = Assert.Single(v.Problems);
        Assert.Equal("../evil", p.File);
        Assert.Contains("unsafe entry name", p.What, StringComparison.Ordinal);
    }

    private T Get<T>() where T : notnull => app.Services.CreateScope().ServiceProvider.GetRequiredService<T>();
}
