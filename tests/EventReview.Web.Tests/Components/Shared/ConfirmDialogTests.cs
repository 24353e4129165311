using Bunit;
using EventReview.Web.Components.Shared;
using Microsoft.Extensions.DependencyInjection;
using MudBlazor;

namespace EventReview.Web.Tests.Components.Shared;

public sealed class ConfirmDialogTests : MudDialogTestContext
{
    private (IRenderedComponent<MudDialogProvider> Provider, Task<string?> Answer) Ask(ConfirmRequest request)
    {
        var provider = Render<MudDialogProvider>();
        var dialogs = Services.GetRequiredService<IDialogService>();
        Task<string?> answer = null!;
        provider.InvokeAsync(() => answer = dialogs.ConfirmAsync(request));
        provider.WaitForElement("#confirm-ok");
        return (provider, answer);
    }

    [Fact]
    public async Task The_dialog_names_the_action_and_what_cannot_be_undone()
    {
        var (provider, answer) = Ask(new ConfirmRequest("Revoke the token 'pipeline'?", "Revoke", "the token stops working at once.", "Scopes: cases:read."));

        Assert.Contains("Revoke the token 'pipeline'?", provider.Markup, StringComparison.Ordinal);
        Assert.Equal("This cannot be undone: the token stops working at once.", provider.Find("#confirm-cannot-undo").TextContent.Trim());
        Assert.Contains("Scopes: cases:read.", provider.Markup, StringComparison.Ordinal);
        Assert.Equal("Revoke", provider.Find("#confirm-ok").TextContent.Trim());
        Assert.Empty(provider.FindAll("#confirm-reason"));
        Assert.False(answer.IsCompleted);

        provider.Find("#confirm-ok").Click();

        Assert.True(answer.IsCompleted);
        Assert.Equal(string.Empty, await answer);
    }

    [Fact]
    public async Task Cancelling_answers_nothing_so_the_caller_does_nothing()
    {
        var (provider, answer) = Ask(new ConfirmRequest("Freeze 'run A' for KX?", "Freeze", "a frozen record can never be edited."));

        provider.Find("#confirm-cancel").Click();

        Assert.True(answer.IsCompleted);
        Assert.Null(await answer);
        Assert.Empty(provider.FindAll("#confirm-ok"));
    }

    [Fact]
    public async Task When_a_reason_is_asked_for_the_confirm_button_waits_for_a_long_enough_one()
    {
        // Adversarial: whitespace padding to the minimum length must not count as a reason.
        var (provider, answer) = Ask(new ConfirmRequest("Open the sealed record 'run 7'?", "Override and open", "the seal is opened for good.",
            ReasonLabel: "Why open it before the review is complete", MinReasonLength: 10));

        Assert.True(provider.Find("#confirm-ok").HasAttribute("disabled"));
        provider.Find("#confirm-reason").Input("          ok          ");
        Assert.True(provider.Find("#confirm-ok").HasAttribute("disabled"));

        provider.Find("#confirm-reason").Input("  The holders leave tomorrow.  ");
        Assert.False(provider.Find("#confirm-ok").HasAttribute("disabled"));
        provider.Find("#confirm-ok").Click();

        Assert.Equal("The holders leave tomorrow.", await answer);
    }
}
