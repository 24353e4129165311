using EventReview.Core.Cases;
using EventReview.Web.Components.Pages.Cases;
using EventReview.Web.Services;

namespace EventReview.Web.Tests.Components.Pages.Cases;

/// <summary>What the item panel tells its reader after an action (a plain class, no browser).</summary>
public sealed class ItemActionsTests
{
    private static readonly ReviewCase Before = ComponentCases.Mixed();
    private static readonly ReviewCase After = ComponentCases.Mixed();

    [Fact]
    public async Task A_success_shows_its_message_and_hands_the_changed_case_on()
    {
        var actions = new ItemActions { Error = "old error" };
        var handed = new List<ReviewCase>();

        var ok = await actions.RunAsync(() => Task.FromResult(After), "Due date saved.", c => { handed.Add(c); return Task.CompletedTask; }, () => Task.FromResult(Before));

        Assert.True(ok);
        Assert.Equal(("Due date saved.", (string?)null), (actions.Info, actions.Error));
        Assert.Same(After, Assert.Single(handed));
    }

    [Fact]
    public async Task A_refusal_shows_the_message_naming_the_field_and_hands_nothing_on()
    {
        var actions = new ItemActions { Info = "old info" };
        var handed = new List<ReviewCase>();

        var ok = await actions.RunAsync(() => throw new ArgumentException("dueDate must be a day in UTC.", "dueDate"), "Due date saved.",
            c => { handed.Add(c); return Task.CompletedTask; }, () => Task.FromResult(Before));

        Assert.False(ok);
        Assert.Null(actions.Info);
        Assert.Equal("dueDate must be a day in UTC.", actions.Error); // without the framework's " (Parameter ...)" tail
        Assert.Empty(handed);
    }

    [Fact]
    public async Task A_conflict_shows_why_and_hands_on_the_reloaded_case_so_the_reader_sees_the_other_change()
    {
        var actions = new ItemActions();
        var handed = new List<ReviewCase>();

        await actions.RunAsync(() => throw new ConflictException("Item 'triage.timing' was changed by Reviewer Bo while you were editing it."), null,
            c => { handed.Add(c); return Task.CompletedTask; }, () => Task.FromResult(Before));

        Assert.StartsWith("Item 'triage.timing' was changed by Reviewer Bo", actions.Error, StringComparison.Ordinal);
        Assert.Same(Before, Assert.Single(handed));
    }

    [Fact]
    public async Task An_unexpected_failure_is_not_swallowed()
    {
        var actions = new ItemActions();
        await Assert.ThrowsAsync<InvalidOperationException>(() => actions.RunAsync(() => throw new InvalidOperationException("bug"), null, _ => Task.CompletedTask, () => Task.FromResult(Before)));
    }
}
