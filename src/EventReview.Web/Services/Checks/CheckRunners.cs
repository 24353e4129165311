using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using Microsoft.AspNetCore.Components;

namespace EventReview.Web.Services.Checks;

/// <summary>Maps a check kind to the component that shows its run form (parameters with their defaults).</summary>
public static class CheckRunners
{
    // Concurrent: test hosts (and any two hosts in one process) register at start-up at the same time.
    private static readonly System.Collections.Concurrent.ConcurrentDictionary<string, Type> Runners = new(StringComparer.Ordinal);
    private static readonly System.Collections.Concurrent.ConcurrentDictionary<string, Type> ResultViews = new(StringComparer.Ordinal);

    /// <summary>Registers the component that shows a record's result of this kind; it receives a "Record" parameter.</summary>
    public static void RegisterResultView(string kind, Type component) => ResultViews[kind] = component;

    /// <summary>The result view for a record, or null when its kind has none.</summary>
    public static RenderFragment? ResultFor(EventReview.Core.Evidence.ComputationRecord record)
    {
        if (!ResultViews.TryGetValue(record.Kind, out var type))
        {
            return null;
        }

        return builder =>
        {
            builder.OpenComponent(0, type);
            builder.AddAttribute(1, "Record", record);
            builder.CloseComponent();
        };
    }

    /// <summary>Registers a runner component; it receives Case, Item, User and OnChanged parameters.</summary>
    public static void Register(string kind, Type component) => Runners[kind] = component;

    /// <summary>The run form for an item's kind, or null when the kind has no runner yet.</summary>
    public static RenderFragment? For(string? kind, ReviewCase c, ChecklistItem item, ClaimsPrincipal user, Action<ReviewCase> changed)
    {
        if (kind is null || !Runners.TryGetValue(kind, out var type))
        {
            return null;
        }

        return builder =>
        {
            builder.OpenComponent(0, type);
            builder.AddAttribute(1, "Case", c);
            builder.AddAttribute(2, "Item", item);
            builder.AddAttribute(3, "User", user);
            builder.AddAttribute(4, "OnChanged", EventCallback.Factory.Create(new object(), changed));
            builder.CloseComponent();
        };
    }
}
