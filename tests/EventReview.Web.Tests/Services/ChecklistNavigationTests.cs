using EventReview.Web.Services;
using EventReview.Web.Tests.Components;

namespace EventReview.Web.Tests.Services;

public sealed class ChecklistNavigationTests
{
    private readonly IReadOnlyList<Core.Checklists.ChecklistItem> _items = ComponentCases.Mixed().Items;

    [Theory]
    [InlineData(null, "j", "alpha.one")]
    [InlineData(null, "k", "beta.three")]
    [InlineData("alpha.two", "j", "beta.one")] // across the section boundary, in checklist order
    [InlineData("beta.one", "k", "alpha.two")]
    [InlineData("beta.three", "j", null)] // stays at the end
    [InlineData("alpha.one", "k", null)]
    [InlineData("alpha.one", "x", null)]
    [InlineData("no.such", "j", "alpha.one")]
    public void J_and_k_move_through_the_items_in_checklist_order(string? selected, string key, string? expected)
    {
        Assert.Equal(expected, ChecklistNavigation.Move(_items, selected, key));
    }
}
