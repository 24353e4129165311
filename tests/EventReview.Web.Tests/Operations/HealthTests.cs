using System.Net;
using EventReview.Web.Tests.Fixtures;
using Microsoft.AspNetCore.Hosting;

namespace EventReview.Web.Tests.Operations;

public sealed class HealthTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    [Fact]
    public async Task Healthz_answers_200_without_sign_in_and_names_each_part_it_checked()
    {
        using var response = await app.Anonymous().GetAsync("/healthz");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var json = await response.JsonAsync();
        Assert.Equal("ok", (string?)json["status"]);
        Assert.Equal(["database", "migrations", "attachments", "leap-seconds", "record-key", "witness"], json["checks"]!.AsArray().Select(c => (string?)c!["name"]));
        Assert.All(json["checks"]!.AsArray(), c => Assert.True(c!["ok"]!.GetValue<bool>()));
        Assert.DoesNotContain(app.DataDirectory, json.ToJsonString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Healthz_warns_while_the_witness_is_inside_the_data_folder_and_not_once_it_is_moved()
    {
        var inside = (await (await app.Anonymous().GetAsync("/healthz")).JsonAsync())["checks"]!.AsArray().Single(c => (string?)c!["name"] == "witness")!;
        Assert.True(inside["ok"]!.GetValue<bool>());
        Assert.True(inside["warning"]!.GetValue<bool>());
        Assert.Contains("inside the data folder", (string?)inside["detail"], StringComparison.Ordinal);

        var elsewhere = Path.Combine(Path.GetTempPath(), "er-witness-" + Guid.NewGuid().ToString("N"));
        try
        {
            await using var moved = app.WithWebHostBuilder(b => b.UseSetting("EventReview:Records:WitnessDirectory", elsewhere));
            var line = (await (await moved.CreateClient().GetAsync("/healthz")).JsonAsync())["checks"]!.AsArray().Single(c => (string?)c!["name"] == "witness")!;
            Assert.True(line["ok"]!.GetValue<bool>());
            Assert.False(line["warning"]!.GetValue<bool>());
            Assert.DoesNotContain(elsewhere, line.ToJsonString(), StringComparison.Ordinal);
        }
        finally
        {
            if (Directory.Exists(elsewhere))
            {
                Directory.Delete(elsewhere, recursive: true);
            }
        }
    }

    [Fact]
    public async Task Healthz_answers_503_naming_the_attachment_folder_when_free_space_is_below_the_minimum()
    {
        await using var tight = app.WithWebHostBuilder(b => b.UseSetting("EventReview:Operations:MinimumFreeBytes", long.MaxValue.ToString(System.Globalization.CultureInfo.InvariantCulture)));

        using var response = await tight.CreateClient().GetAsync("/healthz");

        Assert.Equal(HttpStatusCode.ServiceUnavailable, response.StatusCode);
        var json = await response.JsonAsync();
        Assert.Equal("failing", (string?)json["status"]);
        var failing = Assert.Single(json["checks"]!.AsArray(), c => !c!["ok"]!.GetValue<bool>());
        Assert.Equal("attachments", (string?)failing!["name"]);
        Assert.Contains("free", (string?)failing["detail"], StringComparison.Ordinal);
    }

    [Fact]
    public async Task Every_response_carries_a_request_id_and_the_server_time()
    {
        var client = await app.As(Who.Observer);

        using var api = await client.GetAsync("/api/sites");
        using var page = await client.GetAsync("/cases");

        foreach (var r in new[] { api, page })
        {
            Assert.False(string.IsNullOrWhiteSpace(r.Headers.GetValues("X-Request-Id").Single()));
            Assert.Matches(@"^app;dur=\d+\.\d$", r.Headers.GetValues("Server-Timing").Single());
        }

        Assert.NotEqual(api.Headers.GetValues("X-Request-Id").Single(), page.Headers.GetValues("X-Request-Id").Single());
    }
}
