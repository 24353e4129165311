using System.Net;
using EventReview.Web.Services;
using EventReview.Web.Tests.Fixtures;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Api;

public sealed class PagedReadTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    [Fact]
    public async Task The_case_list_comes_in_pages_newest_first_with_the_total()
    {
        var client = await app.As(Who.Token);
        var tag = "PG" + Guid.NewGuid().ToString("N")[..8];
        for (var k = 0; k < 7; k++)
        {
            Assert.Equal(HttpStatusCode.Created, (await client.OpenCaseAsync(ApiCalls.OpenCaseBody($"{tag}-{k}", 1_400_000_000m + k))).StatusCode);
        }

        var first = await (await client.GetAsync($"/api/cases?q={tag}&limit=3")).JsonAsync();
        var last = await (await client.GetAsync($"/api/cases?q={tag}&limit=3&offset=6")).JsonAsync();

        Assert.Equal(7, first["total"]!.GetValue<int>());
        Assert.Equal(3, first["limit"]!.GetValue<int>());
        Assert.Equal([$"{tag}-6", $"{tag}-5", $"{tag}-4"], first["items"]!.AsArray().Select(c => (string?)c!["candidateId"]));
        Assert.Equal([$"{tag}-0"], last["items"]!.AsArray().Select(c => (string?)c!["candidateId"]));
        Assert.Equal(6, last["offset"]!.GetValue<int>());
    }

    [Theory]
    [InlineData("limit=0", "limit")]
    [InlineData("limit=501", "limit")]
    [InlineData("offset=-1", "offset")]
    public async Task A_page_outside_the_limits_is_refused_with_422_naming_the_parameter(string query, string field)
    {
        var client = await app.As(Who.Observer);

        using var response = await client.GetAsync($"/api/cases?{query}");

        Assert.Equal(HttpStatusCode.UnprocessableEntity, response.StatusCode);
        Assert.Contains(field, await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_case_overview_gives_the_same_counts_and_fingerprints_as_the_whole_case()
    {
        var client = await app.As(Who.Token);
        var opened = await (await client.OpenCaseAsync(ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId()))).JsonAsync();
        var id = opened["id"]!.GetValue<int>();
        var key = (string)opened["items"]![0]!["key"]!;
        var other = (string)opened["items"]![1]!["key"]!;
        for (var k = 0; k < 4; k++)
        {
            Assert.Equal(HttpStatusCode.Created, (await client.AddNoteAsync(id, key, $"note {k}")).StatusCode);
        }

        var attached = await (await client.AttachAsync(id, key, [1, 2, 3, 4], "trace.bin")).JsonAsync();
        await client.AddNoteAsync(id, other, "elsewhere");

        var overview = await (await client.GetAsync($"/api/cases/{id}")).JsonAsync();
        using var scope = app.Services.CreateScope();
        var whole = await scope.ServiceProvider.GetRequiredService<CaseQueries>().GetAsync(Principals.Coordinator("test-coordinator", "Test Coordinator"), id);
        foreach (var item in overview["items"]!.AsArray())
        {
            var full = whole.Item((string)item!["key"]!);
            Assert.Equal(full.Fingerprint(), (string?)item["fingerprint"]);
            Assert.Equal(full.Evidence.Count + full.Computations.Count, item["evidenceCount"]!.GetValue<int>());
        }

        Assert.Equal((string?)attached["fingerprint"], (string?)overview["items"]!.AsArray().Single(i => (string?)i!["key"] == key)!["fingerprint"]);
        Assert.Equal(5, overview["items"]!.AsArray().Single(i => (string?)i!["key"] == key)!["evidenceCount"]!.GetValue<int>());
    }

    [Fact]
    public async Task An_items_evidence_comes_in_pages_oldest_first_with_download_links_for_files()
    {
        var client = await app.As(Who.Token);
        var opened = await (await client.OpenCaseAsync(ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId()))).JsonAsync();
        var id = opened["id"]!.GetValue<int>();
        var key = (string)opened["items"]![0]!["key"]!;
        await client.AddNoteAsync(id, key, "first");
        await client.AttachAsync(id, key, [9, 9, 9], "second.bin");
        await client.AddNoteAsync(id, key, "third");

        var page = await (await client.GetAsync($"/api/cases/{id}/items/{key}/evidence?limit=2")).JsonAsync();
        var rest = await (await client.GetAsync($"/api/cases/{id}/items/{key}/evidence?limit=2&offset=2")).JsonAsync();

        Assert.Equal(3, page["total"]!.GetValue<int>());
        var rows = page["items"]!.AsArray();
        Assert.Equal(["note", "attachment"], rows.Select(r => (string?)r!["kind"]));
        Assert.Equal("first", (string?)rows[0]!["text"]);
        Assert.StartsWith("/files/", (string?)rows[1]!["download"], StringComparison.Ordinal);
        Assert.Equal("second.bin", (string?)rows[1]!["fileName"]);
        Assert.Equal(["third"], rest["items"]!.AsArray().Select(r => (string?)r!["text"]));
    }

    [Fact]
    public async Task Evidence_of_an_item_the_case_does_not_have_is_404_naming_the_item()
    {
        var client = await app.As(Who.Observer);
        var id = await client.CaseIdAsync("ER-C-0142");

        using var response = await client.GetAsync($"/api/cases/{id}/items/no.such.item/evidence");

        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
        Assert.Contains("no.such.item", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_timeline_comes_in_pages_newest_first_and_its_entries_chain()
    {
        var client = await app.As(Who.Observer);
        var id = await client.CaseIdAsync("ER-C-0142");

        var first = await (await client.GetAsync($"/api/cases/{id}/timeline?limit=5")).JsonAsync();
        var total = first["total"]!.GetValue<int>();
        var all = await (await client.GetAsync($"/api/cases/{id}/timeline?limit=500")).JsonAsync();

        var sequences = first["items"]!.AsArray().Select(e => e!["sequence"]!.GetValue<int>()).ToList();
        Assert.Equal(Enumerable.Range(total - 4, 5).Reverse(), sequences);
        var entries = all["items"]!.AsArray();
        Assert.Equal(total, entries.Count);
        Assert.Equal(1, entries[^1]!["sequence"]!.GetValue<int>());
    }
}
