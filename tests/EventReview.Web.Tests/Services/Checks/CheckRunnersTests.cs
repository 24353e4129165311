using EventReview.Core.Checklists;
using EventReview.Web.Components.Checks;
using EventReview.Web.Services.Checks;
using EventReview.Web.Tests.Fixtures;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Services.Checks;

/// <summary>The check runners come from dependency injection: every computed kind has its pair of views, one per kind.</summary>
public sealed class CheckRunnersTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    [Fact]
    public void The_app_registers_a_run_form_and_a_result_view_for_every_computed_check_kind()
    {
        var runners = app.Services.GetRequiredService<CheckRunners>();

        Assert.Equal(
            new[] { CheckKind.Background, CheckKind.Chain, CheckKind.Environment, CheckKind.Injections, CheckKind.Overlap, CheckKind.Timing }.Order(StringComparer.Ordinal),
            runners.Kinds.Order(StringComparer.Ordinal));
        Assert.Null(runners.For(CheckKind.Configuration, null!, null!, null!, _ => { })); // configuration has its own tab, no run form
        Assert.Null(runners.For(null, null!, null!, null!, _ => { }));
    }

    [Fact]
    public void Two_views_for_one_kind_are_refused_at_start_up_naming_the_kind()
    {
        var services = new ServiceCollection()
            .AddCheckView<TimingRunner, TimingResultView>(CheckKind.Timing)
            .AddCheckView<OverlapRunner, TimingResultView>(CheckKind.Timing)
            .AddSingleton<CheckRunners>()
            .BuildServiceProvider();

        var ex = Assert.Throws<InvalidOperationException>(() => services.GetRequiredService<CheckRunners>());
        Assert.Contains("'timing'", ex.Message, StringComparison.Ordinal);
    }
}
