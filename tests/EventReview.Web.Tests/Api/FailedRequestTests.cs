using System.Net;
using EventReview.Core.Cases;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Tests.Api;

/// <summary>A refused request changes nothing: no case, no evidence, no file, no timeline entry.</summary>
public sealed class FailedRequestTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private async Task<(int Cases, int Evidence, int Timeline, int Files)> CountsAsync()
    {
        await using var db = app.Db();
        var files = Directory.Exists(app.AttachmentDirectory) ? Directory.EnumerateFiles(app.AttachmentDirectory, "*", SearchOption.AllDirectories).Count() : 0;
        return (await db.Cases.CountAsync(), await db.Evidence.CountAsync(), await db.Timeline.CountAsync(), files);
    }

    [Fact]
    public async Task A_case_refused_with_422_is_not_stored_and_can_then_be_opened_fresh()
    {
        var client = await app.As(Who.Coordinator);
        var candidate = ApiCalls.NewCandidateId();
        var before = await CountsAsync();

        var refused = await client.OpenCaseAsync(ApiCalls.OpenCaseBody(candidate, site: "QQ"));

        Assert.Equal(HttpStatusCode.UnprocessableEntity, refused.StatusCode);
        Assert.Equal(before, await CountsAsync());
        Assert.Empty((await (await client.GetAsync($"/api/cases?q={candidate}")).JsonAsync())["items"]!.AsArray());
        Assert.Equal(HttpStatusCode.Created, (await client.OpenCaseAsync(ApiCalls.OpenCaseBody(candidate))).StatusCode);
    }

    [Fact]
    public async Task A_case_refused_as_malformed_json_is_not_stored()
    {
        var client = await app.As(Who.Coordinator);
        var before = await CountsAsync();

        var refused = await client.PostAsync("/api/cases", ApiCalls.Json("""{"candidateId": "TC-MALFORMED", "gpsTime": "soon"}"""));

        Assert.Equal(HttpStatusCode.BadRequest, refused.StatusCode);
        Assert.Equal(before, await CountsAsync());
    }

    [Fact]
    public async Task A_case_refused_for_the_role_is_not_stored()
    {
        var candidate = ApiCalls.NewCandidateId();
        var before = await CountsAsync();

        var refused = await (await app.As(Who.Reviewer)).OpenCaseAsync(ApiCalls.OpenCaseBody(candidate));

        Assert.Equal(HttpStatusCode.Forbidden, refused.StatusCode);
        Assert.Equal(before, await CountsAsync());
    }

    public static TheoryData<string, string> RefusedNotes() => new()
    {
        { Who.Reviewer, "" },
        { Who.Observer, "An observer's note." },
        { Who.Anonymous, "Nobody's note." },
    };

    [Theory]
    [MemberData(nameof(RefusedNotes))]
    public async Task A_refused_note_leaves_the_item_fingerprint_version_and_timeline_unchanged(string who, string text)
    {
        var reader = await app.As(Who.Observer);
        var id = await reader.CaseIdAsync("ER-C-0142");
        var before = await reader.ItemAsync(id, "timing.arrival");
        var counts = await CountsAsync();

        var response = await (await app.As(who)).AddNoteAsync(id, "timing.arrival", text);

        Assert.True((int)response.StatusCode is 401 or 403 or 422, $"status {(int)response.StatusCode}");
        var after = await reader.ItemAsync(id, "timing.arrival");
        Assert.Equal((string?)before["fingerprint"], (string?)after["fingerprint"]);
        Assert.Equal(before["version"]!.GetValue<int>(), after["version"]!.GetValue<int>());
        Assert.Equal(before["evidenceCount"]!.GetValue<int>(), after["evidenceCount"]!.GetValue<int>());
        Assert.Equal(counts, await CountsAsync());
    }

    [Fact]
    public async Task A_note_refused_because_the_case_is_closed_changes_nothing()
    {
        var id = await (await app.As(Who.Observer)).CaseIdAsync("ER-C-0121");
        var counts = await CountsAsync();

        var response = await (await app.As(Who.Coordinator)).AddNoteAsync(id, "triage.timing", "After the decision.");

        Assert.Equal(HttpStatusCode.Conflict, response.StatusCode);
        Assert.Equal(counts, await CountsAsync());
    }

    [Fact]
    public async Task An_oversized_upload_stores_no_file_and_no_evidence()
    {
        var client = await app.As(Who.Reviewer);
        var id = await client.CaseIdAsync("ER-C-0142");
        var counts = await CountsAsync();

        var response = await client.AttachAsync(id, "timing.arrival", new byte[EventReviewFactory.MaxUploadBytes * 2]);

        Assert.Equal(HttpStatusCode.RequestEntityTooLarge, response.StatusCode);
        Assert.Equal(counts, await CountsAsync());
    }

    [Fact]
    public async Task An_upload_to_an_unknown_item_is_a_404_and_stores_no_file()
    {
        var client = await app.As(Who.Reviewer);
        var id = await client.CaseIdAsync("ER-C-0142");
        var counts = await CountsAsync();

        var response = await client.AttachAsync(id, "no.such.item", "orphan bytes"u8.ToArray());

        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
        Assert.Equal(counts, await CountsAsync());
    }

    [Fact]
    public async Task After_all_the_refusals_every_timeline_still_verifies()
    {
        await using var db = app.Db();

        var cases = await db.CasesWithEverything().AsNoTracking().ToListAsync();

        Assert.NotEmpty(cases);
        Assert.All(cases, c => Assert.Null(TimelineChain.FirstProblem(c.Timeline)));
    }
}
