using Bunit;
using EventReview.Core.Cases;
using EventReview.Web.Components.Pages.Cases;
using MudBlazor;
using MudBlazor.Extensions;

namespace EventReview.Web.Tests.Components.Pages.Cases;

public sealed class DecisionPanelTests : MudDialogTestContext
{
    private readonly List<(CaseOutcome Outcome, string Statement)> _closed = [];

    private (IRenderedComponent<MudDialogProvider> Provider, IRenderedComponent<DecisionPanel> Panel) RenderPanel(ReviewCase c)
    {
        var provider = Render<MudDialogProvider>();
        Render<MudPopoverProvider>();
        var panel = Render<DecisionPanel>(p => p
            .Add(x => x.Case, c)
            .Add(x => x.OnClose, d => _closed.Add(d)));
        return (provider, panel);
    }

    [Fact]
    public void No_outcome_is_preselected_and_closing_waits_for_one()
    {
        var (_, panel) = RenderPanel(ComponentCases.Mixed());

        Assert.Null(panel.FindComponent<MudSelect<CaseOutcome?>>().Instance.GetState(x => x.Value));
        Assert.True(panel.Find("#close-case").HasAttribute("disabled"));
        Assert.Contains("none is preselected", panel.Markup, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Closing_asks_first_and_a_cancelled_dialog_closes_nothing()
    {
        var (provider, panel) = RenderPanel(ComponentCases.Mixed());
        var select = panel.FindComponent<MudSelect<CaseOutcome?>>();
        await panel.InvokeAsync(() => select.Instance.SelectOption(CaseOutcome.Instrumental));
        panel.Find("#decision-statement").Input("A scattered-light glitch at one site.");

        panel.Find("#close-case").Click();
        provider.WaitForElement("#confirm-ok");

        Assert.Contains("as instrumental?", provider.Markup, StringComparison.Ordinal);
        Assert.Contains("can never be reopened", provider.Find("#confirm-cannot-undo").TextContent, StringComparison.Ordinal);
        provider.Find("#confirm-cancel").Click();
        Assert.Empty(_closed);

        panel.Find("#close-case").Click();
        provider.WaitForElement("#confirm-ok").Click();

        var closed = Assert.Single(_closed);
        Assert.Equal(CaseOutcome.Instrumental, closed.Outcome);
        Assert.Equal("A scattered-light glitch at one site.", closed.Statement);
    }
}
