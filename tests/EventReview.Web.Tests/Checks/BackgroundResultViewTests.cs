using Bunit;
using EventReview.Core.Evidence;
using EventReview.Web.Components.Checks;
using EventReview.Web.Demo;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;
using Microsoft.Extensions.DependencyInjection;
using MudBlazor.Services;

namespace EventReview.Web.Tests.Checks;

public sealed class BackgroundResultViewTests(BackgroundAppFactory app) : IClassFixture<BackgroundAppFactory>
{
    [Fact]
    public async Task Result_view_shows_far_in_hz_and_per_year_with_the_bound_and_both_backgrounds()
    {
        ComputationRecord record;
        using (var scope = app.Services.CreateScope())
        {
            var cases = scope.ServiceProvider.GetRequiredService<CaseQueries>();
            var id = (await cases.ListAsync(BackgroundAppFactory.Reviewer, search: BackgroundDemoStep.CandidateId)).Cases.Single(x => x.CandidateId == BackgroundDemoStep.CandidateId).Id;
            var c = await cases.GetAsync(BackgroundAppFactory.Reviewer, id);
            record = c.Item(BackgroundDemoStep.ItemKey).Computations.First(r => r.Kind == BackgroundCheckService.Kind);
        }

        using var ctx = new BunitContext();
        ctx.JSInterop.Mode = JSRuntimeMode.Loose;
        ctx.Services.AddMudServices();
        var view = ctx.Render<BackgroundResultView>(p => p.Add(x => x.Record, record));
        var text = view.Find("#background-figures").TextContent;
        var stored = System.Text.Json.JsonSerializer.Deserialize<BackgroundRecordResult>(record.ResultJson, CheckRecords.Json)!;

        Assert.Contains("FAR (Hz)", text, StringComparison.Ordinal);
        Assert.Contains("FAR (per year)", text, StringComparison.Ordinal);
        Assert.Contains("without the candidate's own triggers", text, StringComparison.Ordinal);
        foreach (var p in stored.Check.Pairs)
        {
            Assert.Contains(p.Plan.Name, text, StringComparison.Ordinal);
            if (p.Result.FarIsBound)
            {
                Assert.Contains("< " + EventReview.Core.Formatting.ScientificFormat.Format(p.Result.FarHz) + " (90 %)", text, StringComparison.Ordinal);
                Assert.Contains("≥ " + p.Result.Sigma.ToString("F2", System.Globalization.CultureInfo.InvariantCulture), text, StringComparison.Ordinal);
            }
            else
            {
                Assert.Contains(" ± ", text, StringComparison.Ordinal); // a measured FAR carries its Poisson uncertainty
            }
        }

        Assert.Contains("joint (headline)", text, StringComparison.Ordinal);
        Assert.Contains("(three sites)", text, StringComparison.Ordinal);
        Assert.DoesNotContain("consistent", view.Markup, StringComparison.Ordinal);

        Assert.Contains("Was et al. 2010", view.Markup, StringComparison.Ordinal);
        Assert.Contains("outside the site's analysed segments", view.Markup, StringComparison.Ordinal);
    }
}
