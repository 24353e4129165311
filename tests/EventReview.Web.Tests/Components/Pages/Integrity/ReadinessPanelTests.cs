using Bunit;
using EventReview.Web.Components.Pages.Integrity;
using EventReview.Web.Operations;

namespace EventReview.Web.Tests.Components.Pages.Integrity;

public sealed class ReadinessPanelTests : MudTestContext
{
    [Fact]
    public void A_degraded_part_is_shown_as_degraded_beside_the_ones_that_passed()
    {
        var report = new HealthReport("degraded",
        [
            new HealthCheckLine("database", true, "Sqlite database answers."),
            new HealthCheckLine("leap-seconds", true, "Warning: the bundled leap-second table expires on 2027-01-01 (27 days): update the application before then.", Warning: true),
        ]);

        var cut = Render<ReadinessPanel>(p => p.Add(x => x.Report, report).Add(x => x.At, new DateTimeOffset(2026, 12, 5, 12, 0, 0, TimeSpan.Zero)));

        Assert.Contains("degraded", cut.Find("#readiness-status").TextContent, StringComparison.Ordinal);
        var rows = cut.FindAll("tbody tr");
        Assert.Equal(["ok", "degraded"], rows.Select(r => r.QuerySelectorAll("td")[1].TextContent));
        Assert.Contains("27 days", rows[1].TextContent, StringComparison.Ordinal);
        Assert.Contains("2026-12-05 12:00:00 UTC", cut.Markup, StringComparison.Ordinal);
    }

    [Fact]
    public void A_failing_part_says_the_server_is_not_ready()
    {
        var report = new HealthReport("failing", [new HealthCheckLine("database", false, "Postgres database does not answer (SocketException).")]);

        var cut = Render<ReadinessPanel>(p => p.Add(x => x.Report, report).Add(x => x.At, DateTimeOffset.UnixEpoch));

        Assert.Contains("Not ready", cut.Find("#readiness-status").TextContent, StringComparison.Ordinal);
        Assert.Equal("failing", cut.Find("tbody tr").QuerySelectorAll("td")[1].TextContent);
    }
}
