using EventReview.Core.Cases;
using EventReview.Core.Inputs;
using EventReview.Data;
using EventReview.Data.Auth;
using EventReview.Web.Services;

namespace EventReview.Web.Components.Pages.Cases;

/// <summary>
/// What the item panel tells its reader after an action: one error or one success message, never both. It runs an
/// action, turns a refusal into the message the person reads (naming what was wrong; nothing was changed) and, after a
/// conflict, reloads the case so the reader sees what someone else changed. A plain class, tested without a browser.
/// </summary>
public sealed class ItemActions
{
    /// <summary>The refusal to show, or null.</summary>
    public string? Error { get; set; }

    /// <summary>The success to show, or null.</summary>
    public string? Info { get; set; }

    /// <summary>
    /// Runs <paramref name="action"/>; on success shows <paramref name="success"/> and hands the updated case to
    /// <paramref name="changed"/>; on a refusal shows why (and after a conflict hands over <paramref name="reload"/>'s case).
    /// Returns whether the action succeeded.
    /// </summary>
    public async Task<bool> RunAsync(Func<Task<ReviewCase>> action, string? success, Func<ReviewCase, Task> changed, Func<Task<ReviewCase>> reload)
    {
        Error = null;
        Info = null;
        try
        {
            var updated = await action();
            Info = success;
            await changed(updated);
            return true;
        }
        catch (Exception ex) when (ex is DomainRuleException or ConflictException or ArgumentException or UnauthorizedAccessException or KeyNotFoundException or AttachmentTooLargeException or IOException)
        {
            Error = UserMessage.From(ex);
            if (ex is ConflictException)
            {
                await changed(await reload());
            }

            return false;
        }
    }

    /// <summary>Shows how a signature made at the identity provider ended (back from signing in again there).</summary>
    public void ShowSignature(SignatureRequest done) => (Info, Error) = done.Signed ? (done.Outcome, (string?)null) : (null, done.Outcome);

    /// <summary>Shows a successful signature made on this page.</summary>
    public void ShowSigned() => (Error, Info) = (null, "Signed.");
}
