using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Time;

namespace EventReview.Web.Tests.Components;

/// <summary>Cases built through the domain for component tests.</summary>
public static class ComponentCases
{
    public static Actor Coordinator { get; } = new("u-coord", "Coordinator Cole");

    public static Actor ReviewerA { get; } = new("u-rev-a", "Reviewer Ada");

    public static Actor ReviewerB { get; } = new("u-rev-b", "Reviewer Bo");

    /// <summary>Opened 2026-03-01 12:00 UTC.</summary>
    public static DateTimeOffset Opened { get; } = new(2026, 3, 1, 12, 0, 0, TimeSpan.Zero);

    /// <summary>
    /// Section "Alpha checks": <c>alpha.one</c> (signed off, was due 2026-03-02), <c>alpha.two</c> (open, due 2026-03-04,
    /// owned by Reviewer Ada). Section "Beta checks": <c>beta.one</c> (timing check, stale sign-off),
    /// <c>beta.two</c> (in progress), <c>beta.three</c> (signed off).
    /// </summary>
    public static ReviewCase Mixed()
    {
        var template = new ChecklistTemplate
        {
            Name = "component-test",
            Title = "Component test",
            Sections =
            [
                new TemplateSection
                {
                    Key = "alpha", Title = "Alpha checks",
                    Items = [Item("alpha.one", "First alpha"), Item("alpha.two", "Second alpha", dueDays: 3)],
                },
                new TemplateSection
                {
                    Key = "beta", Title = "Beta checks",
                    Items = [Item("beta.one", "First beta", check: CheckKind.Timing), Item("beta.two", "Second beta"), Item("beta.three", "Third beta")],
                },
            ],
        };
        ChecklistTemplateLoader.Validate(template);
        var c = ReviewCase.Open("TC-UI-1", GpsTime.FromSeconds(1_400_000_000m), "s", "", [], template, Coordinator, Opened);
        var t = Opened;
        c.SetItemDue("alpha.one", new DateOnly(2026, 3, 2), Coordinator, t);
        c.AssignItem("alpha.two", ReviewerA.UserId, ReviewerA.DisplayName, Coordinator, t);
        foreach (var key in new[] { "alpha.one", "beta.one", "beta.three" })
        {
            t = t.AddMinutes(1);
            c.AddEvidence(key, EvidenceItem.Note("n", ReviewerA, t), ReviewerA, t);
            c.MarkItemReady(key, ReviewerA, t);
            c.SignItem(key, ReviewerB, SignOffMeaning.Reviewed, "ok", c.Item(key).Fingerprint(), t, GpsUtc.FromUtc(t.UtcDateTime));
        }

        t = t.AddMinutes(1);
        c.AddEvidence("beta.one", EvidenceItem.Note("later", ReviewerA, t), ReviewerA, t);
        c.StartItem("beta.two", ReviewerA, t);
        return c;
    }

    private static TemplateItem Item(string key, string title, int? dueDays = null, string? check = null) =>
        new() { Key = key, Title = title, Guidance = "g", DueDays = dueDays, Check = check };
}
