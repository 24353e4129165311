using System.Globalization;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Configuration;
using EventReview.Core.Evidence;

namespace EventReview.Core.Records;

/// <summary>
/// The facts (see <see cref="FactNames"/>) that each change of a case records in its timeline entry, and the facts that
/// describe a case's stored fields as they are now (<see cref="Fields(ReviewCase)"/>). Replaying the facts of a timeline
/// (<see cref="CaseReplay"/>) gives what the stored fields must be; both sides are written by this one class, so a
/// field can only be compared if it is also recorded.
/// </summary>
public static class CaseFacts
{
    /// <summary>Every field of the case, its arrivals and its items (not the evidence, computation or sign-off rows).</summary>
    public static List<Fact> Fields(ReviewCase c)
    {
        ArgumentNullException.ThrowIfNull(c);
        var facts = CaseFields(c.CandidateId, c.GpsNanoseconds, c.Search, c.Summary, c.CoordinatorId, c.CoordinatorName, c.ChecklistName,
            c.ChecklistVersion, c.CreatedAt.UtcTicks, c.State, c.Outcome, c.ClosingStatement);
        facts.AddRange(c.Arrivals.OrderBy(a => a.SiteCode, StringComparer.Ordinal).Select(a => Arrival(a.SiteCode, a.ArrivalNanoseconds, a.Snr)));
        foreach (var i in c.Items)
        {
            facts.AddRange(ItemFields(i.Key, i.SectionKey, i.SectionTitle, i.SectionOrder, i.Order, i.Title, i.Guidance, i.CheckKind,
                i.RequiredSignOffs, i.OwnerMaySign, i.DueDate, i.OwnerId, i.OwnerName, i.State));
        }

        return facts;
    }

    /// <summary>The case's own fields from plain values (state and outcome by member name).</summary>
    public static List<Fact> CaseFields(string candidateId, long gpsNanoseconds, string search, string summary, string coordinatorId, string coordinatorName,
        string checklist, int checklistVersion, long createdUtcTicks, CaseState state, CaseOutcome? outcome, string? closingStatement) =>
    [
        new(FactNames.Case(FactNames.Candidate), candidateId),
        new(FactNames.Case(FactNames.Gps), Int(gpsNanoseconds)),
        new(FactNames.Case(FactNames.Search), search),
        new(FactNames.Case(FactNames.Summary), Hashing.Sha256Hex(summary)),
        new(FactNames.Case(FactNames.Coordinator), coordinatorId),
        new(FactNames.Case(FactNames.CoordinatorName), coordinatorName),
        new(FactNames.Case(FactNames.Checklist), checklist),
        new(FactNames.Case(FactNames.ChecklistVersion), Int(checklistVersion)),
        new(FactNames.Case(FactNames.Created), Int(createdUtcTicks)),
        CaseState(state),
        ..Closed(outcome, closingStatement),
    ];

    /// <summary>An arrival: "GPS-nanoseconds SNR" with the SNR in round-trip form.</summary>
    public static Fact Arrival(string site, long arrivalNanoseconds, double snr) =>
        new(FactNames.Arrival(site), Int(arrivalNanoseconds) + " " + snr.ToString("R", CultureInfo.InvariantCulture));

    /// <summary>Every field of one item from plain values.</summary>
    public static IEnumerable<Fact> ItemFields(string key, string sectionKey, string sectionTitle, int sectionOrder, int order, string title, string guidance,
        string? checkKind, int required, bool ownerMaySign, DateOnly? due, string? ownerId, string? ownerName, ItemState state)
    {
        yield return new(FactNames.Item(key, FactNames.Section), sectionKey);
        yield return new(FactNames.Item(key, FactNames.SectionTitle), sectionTitle);
        yield return new(FactNames.Item(key, FactNames.SectionOrder), Int(sectionOrder));
        yield return new(FactNames.Item(key, FactNames.Order), Int(order));
        yield return new(FactNames.Item(key, FactNames.Title), title);
        yield return new(FactNames.Item(key, FactNames.Guidance), Hashing.Sha256Hex(guidance));
        yield return new(FactNames.Item(key, FactNames.Check), checkKind ?? string.Empty);
        yield return new(FactNames.Item(key, FactNames.Required), Int(required));
        yield return new(FactNames.Item(key, FactNames.OwnerMaySign), ownerMaySign ? "true" : "false");
        yield return ItemDue(key, due);
        foreach (var f in ItemOwner(key, ownerId, ownerName))
        {
            yield return f;
        }

        yield return ItemState(key, state);
    }

    public static Fact CaseState(CaseState state) => new(FactNames.Case(FactNames.State), state.ToString());

    /// <summary>The outcome and closing statement (both empty while the case is not closed).</summary>
    public static IEnumerable<Fact> Closed(CaseOutcome? outcome, string? closingStatement)
    {
        yield return new(FactNames.Case(FactNames.Outcome), outcome?.ToString() ?? string.Empty);
        yield return new(FactNames.Case(FactNames.Closing), closingStatement ?? string.Empty);
    }

    public static Fact ItemState(string key, ItemState state) => new(FactNames.Item(key, FactNames.State), state.ToString());

    public static Fact ItemDue(string key, DateOnly? due) =>
        new(FactNames.Item(key, FactNames.Due), due?.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) ?? string.Empty);

    public static IEnumerable<Fact> ItemOwner(string key, string? ownerId, string? ownerName)
    {
        yield return new(FactNames.Item(key, FactNames.Owner), ownerId ?? string.Empty);
        yield return new(FactNames.Item(key, FactNames.OwnerName), ownerName ?? string.Empty);
    }

    /// <summary>A piece of evidence added to an item: its seal and <see cref="EvidenceItem.DetailSha256"/>.</summary>
    public static Fact Evidence(string key, EvidenceItem evidence) => new(FactNames.EvidenceAdded(key), evidence.Seal() + " " + evidence.DetailSha256());

    public static Fact Computation(string key, ComputationRecord record) => new(FactNames.ComputationAdded(key), record.Seal());

    public static Fact SignOff(string key, SignOff signOff) => new(FactNames.SignOffAdded(key), signOff.Seal());

    /// <summary>A sign-off made stale: its seal and the UTC ticks of its stale mark.</summary>
    public static Fact Stale(string key, SignOff signOff) =>
        new(FactNames.SignOffStale(key), signOff.Seal() + " " + Int(signOff.StaleSince?.UtcTicks ?? 0));

    /// <summary>A configuration record frozen for the case: its id, fingerprint and <see cref="ConfigurationDetail(ConfigurationSnapshot)"/>.</summary>
    /// <exception cref="ArgumentException">When the record is not frozen.</exception>
    public static Fact Frozen(ConfigurationSnapshot snapshot)
    {
        ArgumentNullException.ThrowIfNull(snapshot);
        if (!snapshot.IsFrozen || snapshot.Fingerprint is null)
        {
            throw new ArgumentException("Only a frozen configuration record can be recorded as frozen.", nameof(snapshot));
        }

        return new(FactNames.ConfigurationAdded, $"{Int(snapshot.Id)} {snapshot.Fingerprint} {ConfigurationDetail(snapshot)}");
    }

    /// <summary>
    /// SHA-256 over what a frozen configuration's fingerprint does not cover (version 1: site, who captured it and when,
    /// who froze it and when, UTC ticks), so that these cannot be changed afterwards either.
    /// </summary>
    public static string ConfigurationDetail(ConfigurationSnapshot s) => ConfigurationDetail(s.SiteCode, s.CapturedBy, s.CapturedByName, s.CapturedAt.UtcTicks,
        s.FrozenBy ?? string.Empty, s.FrozenByName ?? string.Empty, s.FrozenAt?.UtcTicks ?? 0);

    /// <summary>The same from plain values.</summary>
    public static string ConfigurationDetail(string siteCode, string capturedBy, string capturedByName, long capturedAtTicks, string frozenBy, string frozenByName, long frozenAtTicks) =>
        Hashing.Sha256Hex(string.Join('\n', "eventreview-configuration-detail-v1", siteCode, capturedBy, capturedByName, Int(capturedAtTicks), frozenBy, frozenByName, Int(frozenAtTicks)));

    private static string Int(long value) => value.ToString(CultureInfo.InvariantCulture);
}
