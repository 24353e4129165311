using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Data.Auth;
using EventReview.Web.Auth;
using EventReview.Web.Services;
using Microsoft.AspNetCore.Components;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Components.Pages.Cases;

/// <summary>
/// One checklist item: its facts, guidance, check records, evidence, sign-offs and timeline, and the actions a person
/// may take on it. Changes go through <see cref="CaseWorkflow"/>; what to tell the reader afterwards is <see cref="ItemActions"/>.
/// </summary>
public partial class ItemPanel
{
    private readonly ItemActions _actions = new();
    private List<AppUser> _people = [];

    /// <summary>The case the item belongs to.</summary>
    [Parameter, EditorRequired]
    public ReviewCase Case { get; set; } = default!;

    /// <summary>The item shown.</summary>
    [Parameter, EditorRequired]
    public ChecklistItem Item { get; set; } = default!;

    /// <summary>The person reading (their roles decide which actions are offered; the services check them again).</summary>
    [Parameter, EditorRequired]
    public System.Security.Claims.ClaimsPrincipal User { get; set; } = default!;

    /// <summary>Called with the updated case after every successful change.</summary>
    [Parameter]
    public EventCallback<ReviewCase> OnChanged { get; set; }

    /// <summary>Form that runs this item's built-in check (supplied by the page for kinds that have one).</summary>
    [Parameter]
    public RenderFragment? RunnerContent { get; set; }

    [Inject]
    private CaseQueries Cases { get; set; } = default!;

    [Inject]
    private CaseWorkflow Workflow { get; set; } = default!;

    [Inject]
    private MarkdownRenderer Markdown { get; set; } = default!;

    [Inject]
    private UserManager<AppUser> Users { get; set; } = default!;

    [Inject]
    private IOptions<EventReviewOptions> Options { get; set; } = default!;

    [Inject]
    private ReauthenticatedSigning Reauthentication { get; set; } = default!;

    [Inject]
    private NavigationManager Navigation { get; set; } = default!;

    private bool Closed => Case.State == CaseState.Closed;

    private bool CanWork => Permissions.Allows(User, Policies.Work);

    private bool CanCoordinate => Permissions.Allows(User, Policies.Coordinate);

    private bool CanAddEvidence => Permissions.Allows(User, Policies.AddEvidence);

    private string Fingerprint => Item.Fingerprint();

    private IReadOnlyList<ComputationRecord> Computations => Item.Computations.OrderByDescending(c => c.RunAt).ThenByDescending(c => c.Id).ToList();

    private IEnumerable<TimelineEntry> ItemTimeline => Case.Timeline.Where(a => a.ItemKey == Item.Key).OrderByDescending(a => a.Sequence);

    /// <inheritdoc />
    protected override async Task OnInitializedAsync()
    {
        if (CanCoordinate)
        {
            _people = Users.Users.OrderBy(u => u.DisplayName).ToList();
        }

        // Back from signing in again at the identity provider: say how the signature went.
        var query = Microsoft.AspNetCore.WebUtilities.QueryHelpers.ParseQuery(new Uri(Navigation.Uri).Query);
        if (query.TryGetValue("signature", out var id) && await Reauthentication.FindAsync(User, id.ToString()) is { UsedAt: not null } done && done.ItemKey == Item.Key)
        {
            _actions.ShowSignature(done);
        }
    }

    private Task<bool> Run(Func<Task<ReviewCase>> action, string? success = null) =>
        _actions.RunAsync(action, success, c => OnChanged.InvokeAsync(c), () => Cases.GetAsync(User, Case.Id));

    private Task<bool> Transition(string action) => Run(() => Workflow.TransitionAsync(User, Case.Id, Item.Key, action, Item.Version));

    private Task<bool> Assign(string ownerId)
    {
        var person = _people.FirstOrDefault(p => p.Id == ownerId);
        return Run(() => Workflow.AssignAsync(User, Case.Id, Item.Key, person?.Id, person?.DisplayName, Item.Version), person is null ? "Unassigned." : $"Assigned to {person.DisplayName}.");
    }

    private Task<bool> SetDue(DateTime? date) =>
        Run(() => Workflow.SetDueAsync(User, Case.Id, Item.Key, date is null ? null : DateOnly.FromDateTime(date.Value), Item.Version), "Due date saved.");

    private async Task Signed(ReviewCase updated)
    {
        _actions.ShowSigned();
        await OnChanged.InvokeAsync(updated);
    }
}
