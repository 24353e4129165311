using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using Microsoft.AspNetCore.Components;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Maps a check kind to the components that show its run form (parameters with their defaults) and a record's result,
/// from the <see cref="CheckView"/>s registered in dependency injection (one per kind; a second one for a kind is an
/// error at start-up).
/// </summary>
public sealed class CheckRunners
{
    private readonly Dictionary<string, CheckView> _views;

    /// <summary>Takes the registered views.</summary>
    /// <exception cref="InvalidOperationException">When two views are registered for one kind.</exception>
    public CheckRunners(IEnumerable<CheckView> views)
    {
        _views = new Dictionary<string, CheckView>(StringComparer.Ordinal);
        foreach (var v in views)
        {
            if (!_views.TryAdd(v.Kind, v))
            {
                throw new InvalidOperationException($"Check kind '{v.Kind}' has two views registered ({_views[v.Kind].Runner.Name} and {v.Runner.Name}).");
            }
        }
    }

    /// <summary>The kinds that have views.</summary>
    public IReadOnlyCollection<string> Kinds => _views.Keys;

    /// <summary>The result view for a record, or null when its kind has none.</summary>
    public RenderFragment? ResultFor(ComputationRecord record)
    {
        if (!_views.TryGetValue(record.Kind, out var view))
        {
            return null;
        }

        return builder =>
        {
            builder.OpenComponent(0, view.ResultView);
            builder.AddAttribute(1, "Record", record);
            builder.CloseComponent();
        };
    }

    /// <summary>The run form for an item's kind, or null when the kind has no runner.</summary>
    public RenderFragment? For(string? kind, ReviewCase c, ChecklistItem item, ClaimsPrincipal user, Action<ReviewCase> changed)
    {
        if (kind is null || !_views.TryGetValue(kind, out var view))
        {
            return null;
        }

        return builder =>
        {
            builder.OpenComponent(0, view.Runner);
            builder.AddAttribute(1, "Case", c);
            builder.AddAttribute(2, "Item", item);
            builder.AddAttribute(3, "User", user);
            builder.AddAttribute(4, "OnChanged", EventCallback.Factory.Create(new object(), changed));
            builder.CloseComponent();
        };
    }
}
