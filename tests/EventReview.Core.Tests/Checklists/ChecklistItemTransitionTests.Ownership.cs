using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Tests.Builders;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Checklists;

/// <summary>Owner, due date and version of an item.</summary>
public partial class ChecklistItemTransitionTests
{
    [Fact]
    public void A_signed_off_item_cannot_be_reassigned()
    {
        _case.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(1));
        _case.SignNow("alpha.one", People.ReviewerB, Clock.At(2));

        var ex = Assert.Throws<DomainRuleException>(() =>
            _case.AssignItem("alpha.one", People.ReviewerC.UserId, People.ReviewerC.DisplayName, People.Coordinator, Clock.At(3)));

        Assert.Equal("signed-item-locked", ex.Rule);
        Assert.Null(_case.Item("alpha.one").OwnerId);
    }

    [Fact]
    public void Assigning_and_unassigning_an_item_records_the_owner_and_clears_it()
    {
        _case.AssignItem("alpha.one", People.ReviewerA.UserId, People.ReviewerA.DisplayName, People.Coordinator, Clock.At(1));
        Assert.Equal(People.ReviewerA.DisplayName, _case.Item("alpha.one").OwnerName);
        Assert.Equal("item.assigned", _case.Timeline[^1].Kind);

        _case.AssignItem("alpha.one", " ", "ignored", People.Coordinator, Clock.At(2));

        Assert.Null(_case.Item("alpha.one").OwnerId);
        Assert.Null(_case.Item("alpha.one").OwnerName);
    }

    [Fact]
    public void Setting_and_clearing_a_due_date_is_recorded_on_the_timeline()
    {
        _case.SetItemDue("alpha.one", new DateOnly(2026, 3, 9), People.Coordinator, Clock.At(1));
        Assert.Equal(new DateOnly(2026, 3, 9), _case.Item("alpha.one").DueDate);
        Assert.Contains("2026-03-09", _case.Timeline[^1].Text, StringComparison.Ordinal);

        _case.SetItemDue("alpha.one", null, People.Coordinator, Clock.At(2));

        Assert.Null(_case.Item("alpha.one").DueDate);
        Assert.Equal("item.due", _case.Timeline[^1].Kind);
    }

    [Fact]
    public void Each_change_of_an_item_bumps_its_version()
    {
        var item = _case.Item("alpha.one");
        var versions = new List<int> { item.Version };

        _case.StartItem("alpha.one", People.ReviewerA, Clock.At(1));
        versions.Add(item.Version);
        _case.AddNote("alpha.one", "n", People.ReviewerA, Clock.At(2));
        versions.Add(item.Version);
        _case.MarkItemReady("alpha.one", People.ReviewerA, Clock.At(3));
        versions.Add(item.Version);
        _case.SignNow("alpha.one", People.ReviewerB, Clock.At(4));
        versions.Add(item.Version);

        Assert.Equal([0, 1, 2, 3, 4], versions);
    }
}
