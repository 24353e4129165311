using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using Microsoft.AspNetCore.Components;

namespace EventReview.Web.Services.Checks;

/// <summary>Maps a check kind to the component that shows its run form (parameters with their defaults).</summary>
public static class CheckRunners
{
    private static readonly Dictionary<string, Type> Runners = new(StringComparer.Ordinal);

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
