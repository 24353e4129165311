using EventReview.Core.Checklists;
using EventReview.Core.Configuration;
using EventReview.Core.Evidence;
using EventReview.Core.Inputs;
using EventReview.Core.Records;
using EventReview.Core.Time;

namespace EventReview.Core.Cases;

/// <summary>
/// The case file of one candidate: its times, arrivals, checklist, evidence, sign-offs and timeline. This is the
/// aggregate root: every change goes through a method here, which checks the rule, applies the change and appends
/// a timeline entry with the facts of the change (<see cref="CaseFacts"/>: the new values of what it changed and the
/// seals of the rows it added), so that the stored case can be recomputed from its timeline (<see cref="CaseReplay"/>).
/// A refused change throws <see cref="DomainRuleException"/> and leaves everything as it was.
/// </summary>
public sealed partial class ReviewCase
{
    private readonly List<CaseArrival> _arrivals = [];
    private readonly List<ChecklistItem> _items = [];
    private readonly List<TimelineEntry> _timeline = [];

    private ReviewCase()
    {
        CandidateId = string.Empty;
        Search = string.Empty;
        Summary = string.Empty;
        CoordinatorId = string.Empty;
        CoordinatorName = string.Empty;
        ChecklistName = string.Empty;
    }

    /// <summary>Database key of the case.</summary>
    public int Id { get; private set; }

    /// <summary>The identifier given by the search that raised the candidate (unique).</summary>
    public string CandidateId { get; private set; }

    /// <summary>Candidate time, GPS nanoseconds (see <see cref="Gps"/>).</summary>
    public long GpsNanoseconds { get; private set; }

    /// <summary>Candidate time on the GPS scale (from <see cref="GpsNanoseconds"/>).</summary>
    public GpsTime Gps => new(GpsNanoseconds);

    /// <summary>Name of the search that raised the candidate, trimmed, at most <see cref="MaxSearchLength"/> characters.</summary>
    public string Search { get; private set; }

    /// <summary>Free-text summary of the candidate given when the case was opened, at most <see cref="MaxSummaryLength"/> characters.</summary>
    public string Summary { get; private set; }

    /// <summary>Where the case stands: open, in review, awaiting decision or closed.</summary>
    public CaseState State { get; private set; }

    /// <summary>The committee's conclusion; null until the case is closed.</summary>
    public CaseOutcome? Outcome { get; private set; }

    /// <summary>The statement of the decision given when the case was closed, trimmed; null until then.</summary>
    public string? ClosingStatement { get; private set; }

    /// <summary>Account id of the coordinator who opened the case.</summary>
    public string CoordinatorId { get; private set; }

    /// <summary>Printed name of the coordinator who opened the case, as it was then.</summary>
    public string CoordinatorName { get; private set; }

    /// <summary>Template the checklist was made from, and its version.</summary>
    public string ChecklistName { get; private set; }

    /// <summary>Version of the template the checklist was made from (see <see cref="ChecklistName"/>).</summary>
    public int ChecklistVersion { get; private set; }

    /// <summary>When the case was opened, UTC, to whole milliseconds (<see cref="RecordedTime"/>).</summary>
    public DateTimeOffset CreatedAt { get; private set; }

    /// <summary>Time of the newest timeline entry, UTC, to whole milliseconds.</summary>
    public DateTimeOffset UpdatedAt { get; private set; }

    /// <summary>Optimistic-concurrency version of the whole case, bumped on every change (serialises the timeline).</summary>
    public int Version { get; private set; }

    /// <summary>The candidate's arrival at each site, at most one per site code.</summary>
    public IReadOnlyList<CaseArrival> Arrivals => _arrivals;

    /// <summary>The checklist items, made from the template's sections and items in their order.</summary>
    public IReadOnlyList<ChecklistItem> Items => _items;

    /// <summary>The case's timeline: entries numbered by <see cref="TimelineEntry.Sequence"/> and chained by their hashes.</summary>
    public IReadOnlyList<TimelineEntry> Timeline => _timeline;

    /// <summary>Network SNR: root sum of squares of the per-site SNRs.</summary>
    public double NetworkSnr => Math.Sqrt(_arrivals.Sum(a => a.Snr * a.Snr));

    /// <summary>Number of checklist items that are signed off.</summary>
    public int SignedItemCount => _items.Count(i => i.State == ItemState.SignedOff);

    /// <summary>Number of checklist items with a stale sign-off that have not been signed off again.</summary>
    public int StaleItemCount => _items.Count(i => i.HasStaleSignOffs);

    /// <summary>Longest search name, characters.</summary>
    public const int MaxSearchLength = 200;

    /// <summary>Longest summary, characters.</summary>
    public const int MaxSummaryLength = 20_000;

    /// <summary>Opens a case with its checklist made from <paramref name="template"/>.</summary>
    /// <exception cref="ArgumentException">When a field is invalid (the message names it).</exception>
    public static ReviewCase Open(string candidateId, GpsTime gps, string search, string summary,
        IEnumerable<CaseArrival> arrivals, ChecklistTemplate template, Actor coordinator, DateTimeOffset now)
    {
        candidateId = InputGuard.Identifier(candidateId, InputLimits.MaxCandidateIdLength, nameof(candidateId));
        InputGuard.Gps(gps, "gpsTime");

        // The stored limits (see the case's database configuration); beyond them SQLite would keep the text and PostgreSQL refuse it.
        if ((search ?? string.Empty).Length > MaxSearchLength)
        {
            throw new ArgumentException($"search must be at most {MaxSearchLength} characters.", nameof(search));
        }

        if ((summary ?? string.Empty).Length > MaxSummaryLength)
        {
            throw new ArgumentException($"summary must be at most {MaxSummaryLength} characters.", nameof(summary));
        }

        var list = arrivals.ToList();
        var duplicate = list.GroupBy(a => a.SiteCode).FirstOrDefault(g => g.Count() > 1);
        if (duplicate is not null)
        {
            throw new ArgumentException($"arrivals: site {duplicate.Key} appears more than once.", nameof(arrivals));
        }

        var far = list.FirstOrDefault(a => Math.Abs(a.Arrival.SecondsSince(gps)) > 1.0);
        if (far is not null)
        {
            throw new ArgumentException($"arrivals: the arrival at {far.SiteCode} is {far.Arrival.SecondsSince(gps):F3} s from the case time; arrivals must be within 1 s of it.", nameof(arrivals));
        }

        var c = new ReviewCase
        {
            CandidateId = candidateId,
            GpsNanoseconds = gps.Nanoseconds,
            Search = (search ?? string.Empty).Trim(),
            Summary = summary ?? string.Empty,
            State = CaseState.Open,
            CoordinatorId = coordinator.UserId,
            CoordinatorName = coordinator.DisplayName,
            ChecklistName = template.Name,
            ChecklistVersion = template.Version,
            CreatedAt = RecordedTime.Normalize(now),
            UpdatedAt = RecordedTime.Normalize(now),
        };
        c._arrivals.AddRange(list);
        var sectionOrder = 0;
        foreach (var section in template.Sections)
        {
            sectionOrder++;
            var order = 0;
            foreach (var item in section.Items)
            {
                order++;
                DateOnly? due = item.DueDays is { } days ? DateOnly.FromDateTime(now.UtcDateTime.AddDays(days)) : null;
                c._items.Add(new ChecklistItem(section, sectionOrder, item, order, due));
            }
        }

        c.Record(coordinator, now, "case.opened", null,
            $"Opened case {candidateId} at GPS {gps} from search '{c.Search}' with checklist '{template.Name}' v{template.Version} ({c._items.Count} items).",
            CaseFacts.Fields(c));
        return c;
    }

    /// <summary>Finds an item by key.</summary>
    /// <exception cref="KeyNotFoundException">When the case has no such item.</exception>
    public ChecklistItem Item(string key) =>
        _items.FirstOrDefault(i => i.Key == key) ?? throw new KeyNotFoundException($"Case {CandidateId} has no checklist item '{key}'.");

    /// <summary>Assigns an item to an owner, or unassigns it when <paramref name="ownerId"/> is null or blank; refused for a signed-off item.</summary>
    public void AssignItem(string key, string? ownerId, string? ownerName, Actor by, DateTimeOffset now)
    {
        var item = Mutable(key);
        item.Assign(ownerId, ownerName);
        Record(by, now, "item.assigned", key, ownerId is null ? $"Item '{key}' unassigned." : $"Item '{key}' assigned to {ownerName}.",
            CaseFacts.ItemOwner(key, item.OwnerId, item.OwnerName));
    }

    /// <summary>Sets the item's due date (a UTC calendar date), or clears it when <paramref name="due"/> is null.</summary>
    public void SetItemDue(string key, DateOnly? due, Actor by, DateTimeOffset now)
    {
        var item = Mutable(key);
        item.SetDue(due);
        Record(by, now, "item.due", key, due is null ? $"Due date of '{key}' cleared." : $"Item '{key}' due {due:yyyy-MM-dd}.", [CaseFacts.ItemDue(key, item.DueDate)]);
    }

    /// <summary>Moves an open item to in progress; an open case goes into review.</summary>
    public void StartItem(string key, Actor by, DateTimeOffset now)
    {
        Mutable(key).Start();
        BeginReviewIfOpen();
        Record(by, now, "item.state", key, $"Item '{key}' started (in progress).", StateFacts(key));
    }

    /// <summary>Marks an open or in-progress item ready for sign-off (it needs evidence or a computation); an open case goes into review.</summary>
    public void MarkItemReady(string key, Actor by, DateTimeOffset now)
    {
        Mutable(key).MarkReady();
        BeginReviewIfOpen();
        Record(by, now, "item.state", key, $"Item '{key}' marked ready for sign-off.", StateFacts(key));
    }

    /// <summary>Returns an item ready for sign-off to in progress; refused once the item has a current sign-off.</summary>
    public void WithdrawItem(string key, Actor by, DateTimeOffset now)
    {
        Mutable(key).Withdraw();
        Record(by, now, "item.state", key, $"Item '{key}' returned to in progress.", StateFacts(key));
    }

    /// <summary>Adds a note, attachment or link; current sign-offs of the item become stale.</summary>
    public void AddEvidence(string key, EvidenceItem evidence, Actor by, DateTimeOffset now)
    {
        var item = Mutable(key);
        var stale = item.AddEvidence(evidence, now);
        BeginReviewIfOpen();
        Record(by, now, EvidenceAppend.EntryKind(evidence), key, EvidenceAppend.EntryText(key, evidence),
            EvidenceAppend.EntryFacts(key, evidence, item.State, State));
        AfterStale(key, stale, by, now);
    }

    /// <summary>
    /// Attaches a computation record; current sign-offs of the item become stale. When the record documents a freeze,
    /// <paramref name="frozen"/> is the configuration record frozen for this case in the same change: the entry records
    /// it too, so that it cannot later be edited or unfrozen unnoticed.
    /// </summary>
    /// <exception cref="ArgumentException">When <paramref name="frozen"/> is not frozen for this case.</exception>
    public void AddComputation(string key, ComputationRecord record, Actor by, DateTimeOffset now, ConfigurationSnapshot? frozen = null)
    {
        if (frozen is not null && (!frozen.IsFrozen || frozen.ReviewCaseId != Id))
        {
            throw new ArgumentException($"The configuration record of {frozen.SiteCode} is not frozen for case {CandidateId}.", nameof(frozen));
        }

        var item = Mutable(key);
        var stale = item.AddComputation(record, now);
        BeginReviewIfOpen();
        List<Fact> facts = [CaseFacts.Computation(key, record), CaseFacts.ItemState(key, item.State), CaseFacts.CaseState(State)];
        if (frozen is not null)
        {
            facts.Add(CaseFacts.Frozen(frozen));
        }

        Record(by, now, "computation." + record.Kind, key, $"Check '{record.Kind}' run on '{key}': {record.Verdict}. {record.Summary} Seal {record.Seal()}.", facts);
        AfterStale(key, stale, by, now);
    }

    /// <summary>Signs an item against the evidence fingerprint the signer saw.</summary>
    public SignOff SignItem(string key, Actor signer, SignOffMeaning meaning, string statement, string seenFingerprint, DateTimeOffset atUtc, GpsTime atGps)
    {
        var item = Mutable(key);
        var s = item.Sign(signer, meaning, statement, seenFingerprint, atUtc, atGps);
        Record(signer, atUtc, "signoff", key,
            $"{signer.DisplayName} signed '{key}' as {meaning.ToString().ToLowerInvariant()} against evidence {s.EvidenceFingerprint[..12]}: {s.Statement}" +
            (item.State == ItemState.SignedOff ? " Item signed off." : $" ({item.CurrentSignOffs.Count()} of {item.RequiredSignOffs}).") + $" Seal {s.Seal()}.",
            [CaseFacts.SignOff(key, s), CaseFacts.ItemState(key, item.State)]);
        return s;
    }

    private ChecklistItem Mutable(string key)
    {
        EnsureNotClosed();
        return Item(key);
    }

    private void EnsureNotClosed()
    {
        if (State == CaseState.Closed)
        {
            throw ClosedError(CandidateId);
        }
    }

    /// <summary>The refusal of any change to a closed case.</summary>
    public static DomainRuleException ClosedError(string candidateId) =>
        new("case-closed", $"Case {candidateId} is closed; nothing in it can change.");

    /// <summary>The case state once work on an item begins: an open case goes into review; any other state stays.</summary>
    internal static CaseState StateWhenWorkBegins(CaseState state) => state == CaseState.Open ? CaseState.InReview : state;

    private void BeginReviewIfOpen()
    {
        State = StateWhenWorkBegins(State);
    }

    private void AfterStale(string key, IReadOnlyList<SignOff> stale, Actor by, DateTimeOffset now)
    {
        if (stale.Count > 0)
        {
            Record(by, now, "signoff.stale", key, $"Evidence of '{key}' changed after signing: its sign-offs are now stale and the item is back to ready for sign-off.",
                stale.Select(s => CaseFacts.Stale(key, s)).Append(CaseFacts.ItemState(key, Item(key).State)));
        }

        if (stale.Count > 0 && State == CaseState.AwaitingDecision)
        {
            State = CaseState.InReview;
            Record(by, now, "case.state", null, "Case returned to review because a sign-off became stale.", [CaseFacts.CaseState(State)]);
        }
    }

    private List<Fact> StateFacts(string key) => [CaseFacts.ItemState(key, Item(key).State), CaseFacts.CaseState(State)];

    private void Record(Actor by, DateTimeOffset now, string kind, string? itemKey, string text, IEnumerable<Fact> facts)
    {
        var last = _timeline.Count == 0 ? null : _timeline.MaxBy(a => a.Sequence);
        _timeline.Add(new TimelineEntry(CandidateId, (last?.Sequence ?? 0) + 1, now, by, kind, itemKey, text, last?.Hash ?? TimelineEntry.GenesisHash, facts));
        UpdatedAt = _timeline[^1].At;
        Version++;
    }
}
