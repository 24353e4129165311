using System.Net;
using System.Net.Http.Json;
using EventReview.Core.Evidence;
using EventReview.Web.Services;
using EventReview.Web.Tests.Fixtures;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Api;

public sealed partial class CaseApiTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    [Fact]
    public async Task Opening_a_case_returns_201_with_its_id_location_and_checklist_in_camel_case()
    {
        var client = await app.As(Who.Coordinator);
        var candidate = ApiCalls.NewCandidateId();

        var response = await client.OpenCaseAsync(ApiCalls.OpenCaseBody(candidate, 1_400_000_000.123456789m));

        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        var json = await response.JsonAsync();
        var id = json["id"]!.GetValue<int>();
        Assert.True(id > 0);
        Assert.Equal($"/api/cases/{id}", response.Headers.Location?.OriginalString);
        Assert.Equal(candidate, (string?)json["candidateId"]);
        Assert.Equal(1_400_000_000.123456789m, json["gpsTime"]!.GetValue<decimal>());
        Assert.Equal("open", (string?)json["state"]);
        Assert.Equal("rapid-triage", (string?)json["checklist"]);
        Assert.Equal("Demo Coordinator", (string?)json["coordinator"]);
        Assert.Equal(["AB", "KP"], json["arrivals"]!.AsArray().Select(a => (string?)a!["site"]));
        var items = json["items"]!.AsArray();
        Assert.Equal(8, items.Count);
        Assert.All(items, i => Assert.Equal("open", (string?)i!["state"]));
        Assert.All(items, i => Assert.True(Hashing.IsSha256Hex((string?)i!["fingerprint"])));
        Assert.Null(json["CandidateId"]);
    }

    [Fact]
    public async Task Opening_the_same_candidate_again_returns_200_with_the_same_case()
    {
        var client = await app.As(Who.Token);
        var candidate = ApiCalls.NewCandidateId();
        var first = await (await client.OpenCaseAsync(ApiCalls.OpenCaseBody(candidate))).JsonAsync();

        var again = await client.OpenCaseAsync(ApiCalls.OpenCaseBody(candidate, 1_400_000_999m));

        Assert.Equal(HttpStatusCode.OK, again.StatusCode);
        var json = await again.JsonAsync();
        Assert.Equal(first["id"]!.GetValue<int>(), json["id"]!.GetValue<int>());
        Assert.Equal(1_400_000_000.125m, json["gpsTime"]!.GetValue<decimal>());
        await using var db = app.Db();
        Assert.Equal(1, db.Cases.Count(c => c.CandidateId == candidate));
    }

    [Fact]
    public async Task An_arrival_at_a_site_the_network_does_not_have_is_refused_with_422_naming_it()
    {
        var client = await app.As(Who.Coordinator);

        var response = await client.OpenCaseAsync(ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId(), site: "ZZ9"));

        Assert.Equal(HttpStatusCode.UnprocessableEntity, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        var problem = await response.JsonAsync();
        Assert.Contains("'ZZ9'", (string?)problem["detail"], StringComparison.Ordinal);
        Assert.Equal("arrivals[0].site", (string?)problem["field"]);
        Assert.Equal(422, problem["status"]!.GetValue<int>());
    }

    [Fact]
    public async Task A_gps_time_sent_as_a_string_is_malformed_json_and_the_400_names_the_field()
    {
        var client = await app.As(Who.Coordinator);

        var response = await client.PostAsync("/api/cases", ApiCalls.Json("""{"candidateId": "TC-STR", "gpsTime": "1400000000.5", "arrivals": []}"""));

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var problem = await response.JsonAsync();
        Assert.Equal("gpsTime", (string?)problem["field"]);
        Assert.Contains("'gpsTime'", (string?)problem["detail"], StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_malformed_arrival_snr_is_named_with_its_position()
    {
        var client = await app.As(Who.Coordinator);

        var response = await client.PostAsync("/api/cases",
            ApiCalls.Json("""{"candidateId": "TC-SNR", "gpsTime": 1400000000.5, "arrivals": [{"site": "KP", "gpsTime": 1400000000.5, "snr": "loud"}]}"""));

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Equal("arrivals[0].snr", (string?)(await response.JsonAsync())["field"]);
    }

    [Fact]
    public async Task Json_that_does_not_parse_is_a_400()
    {
        var client = await app.As(Who.Coordinator);

        var response = await client.PostAsync("/api/cases", ApiCalls.Json("""{"candidateId": "TC-X", "gpsTime": 14"""));

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Equal("Malformed JSON", (string?)(await response.JsonAsync())["title"]);
    }

    [Fact]
    public async Task A_body_that_is_not_json_is_a_415()
    {
        var client = await app.As(Who.Coordinator);

        var response = await client.PostAsync("/api/cases", new StringContent("candidateId=TC-1", System.Text.Encoding.UTF8, "text/plain"));

        Assert.Equal(HttpStatusCode.UnsupportedMediaType, response.StatusCode);
    }

    [Theory]
    [InlineData("""{"gpsTime": 1400000000.5}""", "candidateId")]
    [InlineData("""{"candidateId": "TC-NOGPS"}""", "gpsTime")]
    [InlineData("""{"candidateId": "TC-NEG", "gpsTime": -3}""", "gpsTime")]
    [InlineData("""{"candidateId": "TC-CL", "gpsTime": 1400000000.5, "checklist": "no-such-list"}""", "checklist")]
    [InlineData("""{"candidateId": "TC-FAR", "gpsTime": 1400000000.5, "arrivals": [{"site": "KP", "gpsTime": 1400000003.5, "snr": 8}]}""", "arrivals")]
    [InlineData("""{"candidateId": "TC-NOSITE", "gpsTime": 1400000000.5, "arrivals": [{"gpsTime": 1400000000.5}]}""", "arrivals[0].site")]
    public async Task A_missing_or_invalid_field_is_refused_with_422_naming_it(string body, string field)
    {
        var client = await app.As(Who.Coordinator);

        var response = await client.PostAsync("/api/cases", ApiCalls.Json(body));

        Assert.Equal(HttpStatusCode.UnprocessableEntity, response.StatusCode);
        var problem = await response.JsonAsync();
        Assert.Equal(field, (string?)problem["field"]);
        Assert.DoesNotContain("(Parameter", (string?)problem["detail"], StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_case_list_shows_the_demo_cases_with_progress_newest_first()
    {
        var client = await app.As(Who.Observer);

        var list = (await (await client.GetAsync("/api/cases")).JsonAsync())["items"]!.AsArray();

        var demo = list.Where(c => ((string?)c!["candidateId"])!.StartsWith("ER-C-", StringComparison.Ordinal)).ToList();
        Assert.Equal(["ER-C-0157", "ER-C-0142", "ER-C-0121"], demo.Select(c => (string?)c!["candidateId"]));
        var closed = demo.Single(c => (string?)c!["candidateId"] == "ER-C-0121")!;
        Assert.Equal("closed", (string?)closed["state"]);
        Assert.Equal("instrumental", (string?)closed["outcome"]);
        Assert.Equal(closed["totalItems"]!.GetValue<int>(), closed["signedItems"]!.GetValue<int>());
        var review = demo.Single(c => (string?)c!["candidateId"] == "ER-C-0142")!;
        Assert.Equal("in-review", (string?)review["state"]);
        Assert.Equal(2, review["signedItems"]!.GetValue<int>()); // the injection schedule and the frozen configuration record
    }

    [Fact]
    public async Task The_case_list_filters_by_state_and_text_and_refuses_an_unknown_state()
    {
        var client = await app.As(Who.Observer);

        var closed = (await (await client.GetAsync("/api/cases?state=closed")).JsonAsync())["items"]!.AsArray();
        var found = (await (await client.GetAsync("/api/cases?q=er-c-0157")).JsonAsync())["items"]!.AsArray();
        var bad = await client.GetAsync("/api/cases?state=sleeping");

        Assert.Equal(["ER-C-0121"], closed.Select(c => (string?)c!["candidateId"]));
        Assert.Equal(["ER-C-0157"], found.Select(c => (string?)c!["candidateId"]));
        Assert.Equal(HttpStatusCode.UnprocessableEntity, bad.StatusCode);
        Assert.Contains("sleeping", (string?)(await bad.JsonAsync())["detail"], StringComparison.Ordinal);
    }

    [Fact]
    public async Task One_case_shows_its_arrivals_and_every_item_state()
    {
        var client = await app.As(Who.Observer);
        var id = await client.CaseIdAsync("ER-C-0142");

        var json = await (await client.GetAsync($"/api/cases/{id}")).JsonAsync();

        Assert.Equal("ER-C-0142", (string?)json["candidateId"]);
        Assert.Equal(3, json["arrivals"]!.AsArray().Count);
        var items = json["items"]!.AsArray();
        Assert.InRange(items.Count, 25, 40);
        Assert.Equal("signed-off", (string?)items[0]!["state"]);
        Assert.Equal(1, items[0]!["currentSignOffs"]!.GetValue<int>());
        var timing = items.Single(i => (string?)i!["key"] == "timing.arrival")!;
        Assert.Equal("Demo Reviewer A", (string?)timing["owner"]);
        Assert.Equal("in-progress", (string?)timing["state"]);
        Assert.Equal("timing", (string?)timing["checkKind"]);
    }

    [Fact]
    public async Task An_unknown_case_is_a_404_json_problem_naming_the_id()
    {
        var client = await app.As(Who.Observer);

        var response = await client.GetAsync("/api/cases/987654");

        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        Assert.Contains("987654", (string?)(await response.JsonAsync())["detail"], StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_sites_are_the_demo_network_with_the_site_page_fields()
    {
        var client = await app.As(Who.Observer);

        var sites = (await (await client.GetAsync("/api/sites")).JsonAsync()).AsArray();

        Assert.Equal(["AB", "KP", "SM"], sites.Select(s => (string?)s!["code"]));
        var kp = sites.Single(s => (string?)s!["code"] == "KP")!;
        Assert.Equal("Kestrel Plain", (string?)kp["name"]);
        Assert.Equal(-22.0, kp["latitudeDegrees"]!.GetValue<double>());
        Assert.Equal(17.5, kp["longitudeDegrees"]!.GetValue<double>());
        Assert.Equal(1150.0, kp["heightMeters"]!.GetValue<double>());
        Assert.Equal(35.0, kp["xArmAzimuthDegrees"]!.GetValue<double>());
        Assert.Equal(125.0, kp["yArmAzimuthDegrees"]!.GetValue<double>());
        Assert.Equal(1.0e-4, kp["timingUncertaintySeconds"]!.GetValue<double>());
    }

    [Fact]
    public async Task A_note_is_added_hashed_and_moves_an_open_item_to_in_progress()
    {
        var client = await app.As(Who.Token);
        var id = (await (await client.OpenCaseAsync(ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId()))).JsonAsync())["id"]!.GetValue<int>();
        var before = await client.ItemAsync(id, "triage.timing");

        var response = await client.AddNoteAsync(id, "triage.timing", "Δt is **2.1 ms**, well inside the window.");

        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        var json = await response.JsonAsync();
        Assert.Equal(Hashing.Sha256Hex("Δt is **2.1 ms**, well inside the window."), (string?)json["sha256"]);
        Assert.Equal("in-progress", (string?)json["itemState"]);
        var after = await client.ItemAsync(id, "triage.timing");
        Assert.Equal((string?)json["fingerprint"], (string?)after["fingerprint"]);
        Assert.NotEqual((string?)before["fingerprint"], (string?)after["fingerprint"]);
        Assert.Equal(1, after["evidenceCount"]!.GetValue<int>());
    }

    [Fact]
    public async Task A_note_on_a_signed_item_makes_its_sign_off_stale()
    {
        var client = await app.As(Who.Reviewer);
        var id = (await (await (await app.As(Who.Coordinator)).OpenCaseAsync(ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId()))).JsonAsync())["id"]!.GetValue<int>();
        using (var scope = app.Services.CreateScope())
        {
            var appender = scope.ServiceProvider.GetRequiredService<EvidenceAppender>();
            var workflow = scope.ServiceProvider.GetRequiredService<CaseWorkflow>();
            await appender.AddNoteAsync(Principals.Reviewer("u-a", "Reviewer Ada"), id, "triage.timing", "Evidence.");
            var c = await workflow.TransitionAsync(Principals.Reviewer("u-a", "Reviewer Ada"), id, "triage.timing", "ready", null);
            var reviewerB = Principals.Reviewer("u-b", "Reviewer Bo");
            await workflow.SignAsync(reviewerB, id, "triage.timing", SignOffMeaning.Reviewed, "ok", c.Item("triage.timing").Fingerprint(), await Signers.ProofAsync(scope.ServiceProvider, reviewerB));
        }

        Assert.Equal("signed-off", (string?)(await client.ItemAsync(id, "triage.timing"))["state"]);

        var response = await client.AddNoteAsync(id, "triage.timing", "One more thing.");

        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        var item = await client.ItemAsync(id, "triage.timing");
        Assert.Equal("ready-for-sign-off", (string?)item["state"]);
        Assert.True(item["staleSignOffs"]!.GetValue<bool>());
        Assert.Equal(0, item["currentSignOffs"]!.GetValue<int>());
    }

    [Fact]
    public async Task A_note_to_an_unknown_item_or_case_is_a_404_naming_it()
    {
        var client = await app.As(Who.Reviewer);
        var id = await client.CaseIdAsync("ER-C-0142");

        var item = await client.AddNoteAsync(id, "no.such.item", "text");
        var kase = await client.AddNoteAsync(999_999, "timing.arrival", "text");

        Assert.Equal(HttpStatusCode.NotFound, item.StatusCode);
        Assert.Contains("'no.such.item'", (string?)(await item.JsonAsync())["detail"], StringComparison.Ordinal);
        Assert.Equal(HttpStatusCode.NotFound, kase.StatusCode);
        Assert.Contains("999999", (string?)(await kase.JsonAsync())["detail"], StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("""{"text": ""}""")]
    [InlineData("""{"text": "   "}""")]
    [InlineData("""{}""")]
    public async Task An_empty_note_is_a_422_naming_the_text_field(string body)
    {
        var client = await app.As(Who.Reviewer);
        var id = await client.CaseIdAsync("ER-C-0142");

        var response = await client.PostAsync($"/api/cases/{id}/items/timing.arrival/notes", ApiCalls.Json(body));

        Assert.Equal(HttpStatusCode.UnprocessableEntity, response.StatusCode);
        Assert.Equal("text", (string?)(await response.JsonAsync())["field"]);
    }

    [Fact]
    public async Task A_note_to_a_closed_case_is_a_409_naming_the_rule()
    {
        var client = await app.As(Who.Reviewer);
        var id = await client.CaseIdAsync("ER-C-0121");

        var response = await client.AddNoteAsync(id, "triage.timing", "Too late.");

        Assert.Equal(HttpStatusCode.Conflict, response.StatusCode);
        var problem = await response.JsonAsync();
        Assert.Equal("case-closed", (string?)problem["rule"]);
        Assert.Contains("closed", (string?)problem["detail"], StringComparison.Ordinal);
    }
}
