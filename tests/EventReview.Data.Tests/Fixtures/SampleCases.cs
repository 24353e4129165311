using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Time;

namespace EventReview.Data.Tests.Fixtures;

/// <summary>Invented cases and people for the data tests.</summary>
public static class SampleCases
{
    public static Actor Coordinator { get; } = new("u-coord", "Coordinator Cole");

    public static Actor ReviewerA { get; } = new("u-rev-a", "Reviewer Ada");

    public static Actor ReviewerB { get; } = new("u-rev-b", "Reviewer Bo");

    public static Actor ReviewerC { get; } = new("u-rev-c", "Reviewer Cy");

    /// <summary>2026-03-01 12:00:00 UTC plus an odd number of ticks, so that full tick precision is exercised.</summary>
    public static DateTimeOffset T0 { get; } = new DateTimeOffset(2026, 3, 1, 12, 0, 0, TimeSpan.Zero).AddTicks(1_234_567);

    public static ChecklistTemplate Template() => new()
    {
        Name = "data-test",
        Title = "Data test",
        Version = 3,
        Sections =
        [
            new TemplateSection
            {
                Key = "alpha", Title = "Alpha",
                Items =
                [
                    new TemplateItem { Key = "alpha.one", Title = "One", Guidance = "Guidance *one*." },
                    new TemplateItem { Key = "alpha.two", Title = "Two", Guidance = "Guidance two.", Signoffs = 2, DueDays = 4 },
                ],
            },
            new TemplateSection
            {
                Key = "beta", Title = "Beta",
                Items = [new TemplateItem { Key = "beta.one", Title = "Three", Guidance = "Guidance three.", Check = CheckKind.Timing, OwnerMaySign = true }],
            },
        ],
    };

    /// <summary>A freshly opened case with two arrivals.</summary>
    public static ReviewCase Open(string candidateId, DateTimeOffset? at = null)
    {
        var gps = GpsTime.FromSeconds(1_400_000_000.123456789m);
        return ReviewCase.Open(candidateId, gps, "data-search", "Summary with *Markdown*.",
            [new CaseArrival("KX", gps.AddSeconds(0.0021), 9.5), new CaseArrival("MV", gps.AddSeconds(-0.0043), 7.25)],
            Template(), Coordinator, at ?? T0);
    }

    /// <summary>
    /// A case with every kind of content: an owner, notes, a link, an attachment, a computation, a signed item,
    /// a half-signed item and a stale sign-off that was signed again.
    /// </summary>
    public static ReviewCase Worked(string candidateId)
    {
        var c = Open(candidateId);
        var t = T0;
        DateTimeOffset Next() => t = t.AddSeconds(1.0000003);
        GpsTime Gps(DateTimeOffset at) => GpsUtc.FromUtc(at.UtcDateTime);

        c.AssignItem("alpha.one", ReviewerA.UserId, ReviewerA.DisplayName, Coordinator, Next());
        c.StartItem("alpha.one", ReviewerA, Next());
        var at = Next();
        c.AddEvidence("alpha.one", EvidenceItem.Note("First **note**.", ReviewerA, at), ReviewerA, at);
        at = Next();
        c.AddEvidence("alpha.one", EvidenceItem.Link("https://logbook.example.invalid/7", "Shift log", ReviewerA, at), ReviewerA, at);
        at = Next();
        c.AddEvidence("alpha.one", EvidenceItem.Attachment("plot.png", "image/png", 3, Hashing.Sha256Hex("abc"), "A plot", ReviewerA, at), ReviewerA, at);
        c.MarkItemReady("alpha.one", ReviewerA, Next());
        at = Next();
        c.SignItem("alpha.one", ReviewerB, SignOffMeaning.Reviewed, "Looked at all three.", c.Item("alpha.one").Fingerprint(), at, Gps(at));
        at = Next();
        c.AddEvidence("alpha.one", EvidenceItem.Note("Late addendum.", ReviewerA, at), ReviewerA, at);
        at = Next();
        c.SignItem("alpha.one", ReviewerB, SignOffMeaning.Approved, "Read the addendum too.", c.Item("alpha.one").Fingerprint(), at, Gps(at));

        at = Next();
        c.AddEvidence("alpha.two", EvidenceItem.Note("Two.", ReviewerA, at), ReviewerA, at);
        c.MarkItemReady("alpha.two", ReviewerA, Next());
        at = Next();
        c.SignItem("alpha.two", ReviewerC, SignOffMeaning.Reviewed, "Half of it.", c.Item("alpha.two").Fingerprint(), at, Gps(at));

        at = Next();
        c.AddComputation("beta.one", new ComputationRecord(CheckKind.Timing, "{\"toleranceSeconds\":0.001}", Hashing.Sha256Hex("inputs"), "0.1.0",
            "{\"consistent\":true}", "consistent", "Δt within 13 ms", "<svg/>", ReviewerA, at), ReviewerA, at);
        c.SetItemDue("beta.one", new DateOnly(2026, 3, 9), Coordinator, Next());
        return c;
    }
}
