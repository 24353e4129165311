namespace EventReview.Web.Tests.Components;

/// <summary>
/// A <see cref="MudTestContext"/> for components that open dialogs or popovers: MudBlazor's pointer-events service can
/// only be disposed asynchronously, so xunit disposes this context through <see cref="IAsyncLifetime"/>.
/// </summary>
public abstract class MudDialogTestContext : MudTestContext, IAsyncLifetime
{
    Task IAsyncLifetime.InitializeAsync() => Task.CompletedTask;

    async Task IAsyncLifetime.DisposeAsync() => await DisposeAsync();
}
