using EventReview.Web.Services;
using EventReview.Web.Tests.Components;

namespace EventReview.Web.Tests.Services;

public sealed class ChecklistFilterTests
{
    private readonly IReadOnlyList<Core.Checklists.ChecklistItem> _items = ComponentCases.Mixed().Items;

    [Theory]
    [InlineData("all", "alpha.one alpha.two beta.one beta.two beta.three")]
    [InlineData(null, "alpha.one alpha.two beta.one beta.two beta.three")]
    [InlineData("no-such-filter", "alpha.one alpha.two beta.one beta.two beta.three")]
    [InlineData("to-do", "alpha.two beta.one beta.two")]
    [InlineData("ready", "beta.one")]
    [InlineData("stale", "beta.one")]
    public void Each_filter_keeps_its_items_in_checklist_order(string? word, string expected)
    {
        var shown = ChecklistFilter.Apply(_items.OrderBy(i => i.SectionOrder).ThenBy(i => i.Order), word);

        Assert.Equal(expected.Split(' '), shown.Select(i => i.Key));
    }

    [Fact]
    public void An_unknown_word_is_read_as_every_item_and_labelled_so()
    {
        Assert.Equal(ChecklistFilter.All, ChecklistFilter.Normalise("<script>"));
        Assert.Equal("all items", ChecklistFilter.Label("<script>"));
        Assert.Equal("stale sign-offs", ChecklistFilter.Label("stale"));
    }

    [Fact]
    public void A_filter_that_keeps_nothing_gives_an_empty_list()
    {
        var signedOnly = _items.Where(i => i.Key == "alpha.one").ToList();

        Assert.Empty(ChecklistFilter.Apply(signedOnly, "to-do"));
        Assert.Empty(ChecklistFilter.Apply(signedOnly, "stale"));
    }
}
