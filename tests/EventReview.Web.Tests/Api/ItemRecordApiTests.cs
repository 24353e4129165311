using System.Net;
using EventReview.Web.Tests.Fixtures;

namespace EventReview.Web.Tests.Api;

/// <summary>Reading an item's computation records and sign-offs through the API, as the dossier holds them.</summary>
public sealed class ItemRecordApiTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    [Fact]
    public async Task An_items_computation_records_carry_verdict_summary_numbers_pictures_and_hashes()
    {
        var client = await app.As(Who.TokenRead);
        var caseId = await client.CaseIdAsync("ER-C-0142");

        var page = await (await client.GetAsync($"/api/cases/{caseId}/items/timing.arrival/computations")).JsonAsync();

        var records = page["items"]!.AsArray();
        Assert.Equal(records.Count, page["total"]!.GetValue<int>());
        var timing = records.Last()!;
        Assert.Equal("timing", (string?)timing["kind"]);
        Assert.False(string.IsNullOrWhiteSpace((string?)timing["verdict"]));
        Assert.False(string.IsNullOrWhiteSpace((string?)timing["summary"]));
        Assert.True(timing["current"]!.GetValue<bool>());
        Assert.Equal(System.Text.Json.JsonValueKind.Object, timing["result"]!.GetValueKind());
        Assert.Matches("^[0-9a-f]{64}$", (string?)timing["contentSha256"]);
        Assert.Matches("^[0-9a-f]{64}$", (string?)timing["seal"]);
        Assert.All(timing["picturesSvg"]!.AsArray(), p => Assert.Contains("<svg", (string?)p, StringComparison.Ordinal));

        // Exactly one current record per kind: the newest.
        Assert.All(records.GroupBy(r => (string?)r!["kind"]), g => Assert.Single(g, r => r!["current"]!.GetValue<bool>()));
    }

    [Fact]
    public async Task A_sign_off_shown_as_current_turns_stale_once_the_evidence_it_was_bound_to_changes()
    {
        // Adversarial: a count of sign-offs alone would still say "signed"; the list shows the binding went stale.
        var coordinator = await app.As(Who.Coordinator);
        var caseId = await coordinator.CaseIdAsync("ER-C-0142");
        var before = await (await coordinator.GetAsync($"/api/cases/{caseId}/items/injection.schedule/signoffs")).JsonAsync();
        var key = (string?)before["itemKey"];
        var signOff = before["signOffs"]!.AsArray().Single()!;
        Assert.False(signOff["stale"]!.GetValue<bool>());
        Assert.Equal((string?)before["fingerprint"], (string?)signOff["evidenceFingerprint"]);
        Assert.Equal("reviewed", (string?)signOff["meaning"]);
        Assert.Equal(1, before["currentSignOffs"]!.GetValue<int>());

        Assert.Equal(HttpStatusCode.Created, (await coordinator.AddNoteAsync(caseId, key!, "A later schedule copy, added after the sign-off.")).StatusCode);
        var after = await (await coordinator.GetAsync($"/api/cases/{caseId}/items/{key}/signoffs")).JsonAsync();

        var stale = after["signOffs"]!.AsArray().Single()!;
        Assert.True(stale["stale"]!.GetValue<bool>());
        Assert.NotEqual((string?)after["fingerprint"], (string?)stale["evidenceFingerprint"]);
        Assert.Equal(0, after["currentSignOffs"]!.GetValue<int>());
    }

    [Theory]
    [InlineData("/api/cases/{0}/items/no.such.item/computations", 404)]
    [InlineData("/api/cases/{0}/items/no.such.item/signoffs", 404)]
    [InlineData("/api/cases/999999/items/timing.arrival/signoffs", 404)]
    [InlineData("/api/cases/{0}/items/timing.arrival/computations?limit=0", 422)]
    [InlineData("/api/cases/{0}/items/timing.arrival/computations?offset=x", 400)]
    public async Task Bad_reads_are_refused_with_a_problem(string path, int status)
    {
        var client = await app.As(Who.Observer);
        var caseId = await client.CaseIdAsync("ER-C-0142");

        using var response = await client.GetAsync(string.Format(System.Globalization.CultureInfo.InvariantCulture, path, caseId));

        Assert.Equal(status, (int)response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
    }
}
