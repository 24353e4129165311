using System.Net;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Tests.Api;

/// <summary>Many people adding evidence at once: nothing is lost and the timeline stays one intact chain.</summary>
public sealed class ConcurrencyTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private const int Writers = 16;

    [Fact]
    public async Task Parallel_notes_to_the_same_item_all_succeed_and_are_all_kept_in_an_intact_timeline()
    {
        var coordinator = await app.As(Who.Coordinator);
        var id = (await (await coordinator.OpenCaseAsync(ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId()))).JsonAsync())["id"]!.GetValue<int>();
        HttpClient[] clients = [await app.As(Who.Reviewer), await app.As(Who.ReviewerB), coordinator, await app.As(Who.Token)];
        var texts = Enumerable.Range(0, Writers).Select(i => $"Parallel note {i:D2}.").ToList();

        var responses = await Task.WhenAll(texts.Select((t, i) => clients[i % clients.Length].AddNoteAsync(id, "triage.timing", t)));

        foreach (var r in responses)
        {
            Assert.True(r.StatusCode == HttpStatusCode.Created, $"{(int)r.StatusCode}: {await r.Content.ReadAsStringAsync()}");
        }

        await using var db = app.Db();
        var stored = await db.CasesWithEverything().AsNoTracking().SingleAsync(c => c.Id == id);
        var notes = stored.Item("triage.timing").Evidence.Where(e => e.Kind == EvidenceKind.Note).Select(e => e.Text).Order(StringComparer.Ordinal);
        Assert.Equal(texts, notes);
        Assert.Null(TimelineChain.FirstProblem(stored.Timeline));
        Assert.Equal(1 + Writers, stored.Timeline.Count);
        Assert.Equal(Enumerable.Range(1, 1 + Writers), stored.Timeline.Select(a => a.Sequence).Order());
    }

    [Fact]
    public async Task Parallel_notes_to_different_items_of_one_case_are_all_kept()
    {
        var coordinator = await app.As(Who.Coordinator);
        var body = await (await coordinator.OpenCaseAsync(ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId()))).JsonAsync();
        var id = body["id"]!.GetValue<int>();
        var keys = body["items"]!.AsArray().Select(i => (string)i!["key"]!).ToList();
        var reviewer = await app.As(Who.Reviewer);

        var responses = await Task.WhenAll(keys.Select(k => reviewer.AddNoteAsync(id, k, $"Note on {k}.")));

        Assert.All(responses, r => Assert.Equal(HttpStatusCode.Created, r.StatusCode));
        var json = await (await reviewer.GetAsync($"/api/cases/{id}")).JsonAsync();
        Assert.All(json["items"]!.AsArray(), i => Assert.Equal(1, i!["evidenceCount"]!.GetValue<int>()));
        Assert.All(json["items"]!.AsArray(), i => Assert.Equal("in-progress", (string?)i!["state"]));
        await using var db = app.Db();
        Assert.Null(TimelineChain.FirstProblem((await db.CasesWithEverything().AsNoTracking().SingleAsync(c => c.Id == id)).Timeline));
    }

    [Fact]
    public async Task Opening_the_same_candidate_in_parallel_makes_one_case()
    {
        var token = await app.As(Who.Token);
        var coordinator = await app.As(Who.Coordinator);
        var candidate = ApiCalls.NewCandidateId();

        var responses = await Task.WhenAll(Enumerable.Range(0, 6).Select(i => (i % 2 == 0 ? token : coordinator).OpenCaseAsync(ApiCalls.OpenCaseBody(candidate))));

        Assert.All(responses, r => Assert.True(r.StatusCode is HttpStatusCode.Created or HttpStatusCode.OK, r.StatusCode.ToString()));
        Assert.Single(responses, r => r.StatusCode == HttpStatusCode.Created);
        var ids = new HashSet<int>();
        foreach (var r in responses)
        {
            ids.Add((await r.JsonAsync())["id"]!.GetValue<int>());
        }

        Assert.Single(ids);
    }
}
