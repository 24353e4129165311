using MudBlazor;

namespace EventReview.Web.Components.Shared;

/// <summary>Shows a <see cref="ConfirmDialog"/> and returns what was confirmed.</summary>
public static class Confirmations
{
    /// <summary>
    /// Asks <paramref name="request"/>; returns null when cancelled, otherwise the written reason (empty when none was asked for).
    /// </summary>
    public static async Task<string?> ConfirmAsync(this IDialogService dialogs, ConfirmRequest request)
    {
        ArgumentNullException.ThrowIfNull(dialogs);
        var parameters = new DialogParameters<ConfirmDialog> { { d => d.Request, request } };
        var dialog = await dialogs.ShowAsync<ConfirmDialog>(request.Title, parameters, new DialogOptions { MaxWidth = MaxWidth.Small, FullWidth = true, CloseOnEscapeKey = true });
        var result = await dialog.Result;
        return result is null || result.Canceled ? null : result.Data as string ?? string.Empty;
    }
}
