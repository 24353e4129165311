using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Inputs;
using EventReview.Core.Time;

namespace EventReview.Core.Checklists;

/// <summary>
/// One item of a case's checklist. Its state changes only through the methods here, which refuse invalid
/// transitions with a <see cref="DomainRuleException"/> and change nothing when they refuse. Changes are
/// normally made through <see cref="ReviewCase"/>, which also records them on the case timeline.
/// </summary>
public sealed class ChecklistItem
{
    private readonly List<EvidenceItem> _evidence = [];
    private readonly List<ComputationRecord> _computations = [];
    private readonly List<SignOff> _signOffs = [];

    private ChecklistItem()
    {
        Key = string.Empty;
        SectionKey = string.Empty;
        SectionTitle = string.Empty;
        Title = string.Empty;
        Guidance = string.Empty;
    }

    internal ChecklistItem(TemplateSection section, int sectionOrder, TemplateItem item, int order, DateOnly? due)
    {
        Key = item.Key;
        SectionKey = section.Key;
        SectionTitle = section.Title;
        SectionOrder = sectionOrder;
        Order = order;
        Title = item.Title;
        Guidance = item.Guidance;
        CheckKind = item.Check;
        RequiredSignOffs = item.Signoffs;
        OwnerMaySign = item.OwnerMaySign;
        DueDate = due;
        State = ItemState.Open;
    }

    public int Id { get; private set; }

    public int ReviewCaseId { get; private set; }

    public string Key { get; private set; }

    public string SectionKey { get; private set; }

    public string SectionTitle { get; private set; }

    public int SectionOrder { get; private set; }

    public int Order { get; private set; }

    public string Title { get; private set; }

    /// <summary>Guidance in Markdown (rendered sanitised).</summary>
    public string Guidance { get; private set; }

    /// <summary>The computed check this item is served by, if any (<see cref="Checklists.CheckKind"/>).</summary>
    public string? CheckKind { get; private set; }

    public string? OwnerId { get; private set; }

    public string? OwnerName { get; private set; }

    public DateOnly? DueDate { get; private set; }

    public ItemState State { get; private set; }

    /// <summary>Distinct current sign-offs needed.</summary>
    public int RequiredSignOffs { get; private set; }

    /// <summary>Whether the owner may be one of the signers (false: four-eyes).</summary>
    public bool OwnerMaySign { get; private set; }

    /// <summary>Optimistic-concurrency version, bumped by every change of the item.</summary>
    public int Version { get; private set; }

    public IReadOnlyList<EvidenceItem> Evidence => _evidence;

    public IReadOnlyList<ComputationRecord> Computations => _computations;

    public IReadOnlyList<SignOff> SignOffs => _signOffs;

    /// <summary>Sign-offs that still count (not stale).</summary>
    public IEnumerable<SignOff> CurrentSignOffs => _signOffs.Where(s => !s.IsStale);

    /// <summary>True when a sign-off was made stale by later evidence and the item is not signed again.</summary>
    public bool HasStaleSignOffs => _signOffs.Any(s => s.IsStale) && State != ItemState.SignedOff;

    /// <summary>The current evidence fingerprint (see <see cref="EvidenceFingerprint"/>).</summary>
    public string Fingerprint() => EvidenceFingerprint.Compute(_evidence, _computations);

    /// <summary>The newest computation record of the item's check kind, if any.</summary>
    public ComputationRecord? LatestComputation =>
        _computations.OrderByDescending(c => c.RunAt).ThenByDescending(c => c.Id).FirstOrDefault();

    internal void Assign(string? ownerId, string? ownerName)
    {
        if (State == ItemState.SignedOff)
        {
            throw new DomainRuleException("signed-item-locked", $"Item '{Key}' is signed off; its owner can no longer change.");
        }

        OwnerId = string.IsNullOrWhiteSpace(ownerId) ? null : ownerId;
        OwnerName = OwnerId is null ? null : ownerName;
        Version++;
    }

    internal void SetDue(DateOnly? due)
    {
        Version++;
        DueDate = due;
    }

    internal void Start()
    {
        if (State != ItemState.Open)
        {
            throw new DomainRuleException("invalid-transition", $"Item '{Key}' can only be started from 'open'; it is '{StateNames.Of(State)}'.");
        }

        State = ItemState.InProgress;
        Version++;
    }

    internal void MarkReady()
    {
        if (State is not (ItemState.Open or ItemState.InProgress))
        {
            throw new DomainRuleException("invalid-transition", $"Item '{Key}' is '{StateNames.Of(State)}'; only an open or in-progress item can be marked ready for sign-off.");
        }

        if (_evidence.Count == 0 && _computations.Count == 0)
        {
            throw new DomainRuleException("evidence-required", $"Item '{Key}' has no evidence yet; add a note, file, link or computation before asking for sign-off.");
        }

        State = ItemState.ReadyForSignOff;
        Version++;
    }

    internal void Withdraw()
    {
        if (State != ItemState.ReadyForSignOff)
        {
            throw new DomainRuleException("invalid-transition", $"Item '{Key}' is '{StateNames.Of(State)}'; only an item ready for sign-off can go back to in progress.");
        }

        if (CurrentSignOffs.Any())
        {
            throw new DomainRuleException("withdraw-signed", $"Item '{Key}' already has a current sign-off; add evidence instead (which marks it stale) to reopen the work.");
        }

        State = ItemState.InProgress;
        Version++;
    }

    /// <summary>Adds evidence; returns the sign-offs it made stale.</summary>
    internal IReadOnlyList<SignOff> AddEvidence(EvidenceItem evidence, DateTimeOffset now)
    {
        _evidence.Add(evidence);
        return AfterEvidenceChanged(now);
    }

    /// <summary>Adds a computation record; returns the sign-offs it made stale.</summary>
    internal IReadOnlyList<SignOff> AddComputation(ComputationRecord record, DateTimeOffset now)
    {
        _computations.Add(record);
        return AfterEvidenceChanged(now);
    }

    internal SignOff Sign(Actor signer, SignOffMeaning meaning, string statement, string seenFingerprint, DateTimeOffset atUtc, GpsTime atGps)
    {
        if (State != ItemState.ReadyForSignOff)
        {
            throw new DomainRuleException("not-ready", $"Item '{Key}' is '{StateNames.Of(State)}'; it can be signed only when ready for sign-off.");
        }

        if (string.IsNullOrWhiteSpace(statement))
        {
            throw new DomainRuleException("statement-required", "A sign-off needs a statement saying what was checked.");
        }

        InputGuard.Text(statement.Trim(), InputLimits.MaxStatementLength, nameof(statement));
        if (!Enum.IsDefined(meaning))
        {
            throw new ArgumentOutOfRangeException(nameof(meaning), meaning, "meaning: not a known sign-off meaning.");
        }

        var current = Fingerprint();
        if (!string.Equals(seenFingerprint, current, StringComparison.Ordinal))
        {
            throw new DomainRuleException("evidence-changed", $"The evidence of item '{Key}' changed since you opened it (fingerprint {Short(seenFingerprint)} is now {Short(current)}); review the new evidence and sign again.");
        }

        if (!OwnerMaySign && OwnerId is not null && OwnerId == signer.UserId)
        {
            throw new DomainRuleException("four-eyes", $"Item '{Key}' needs a signer other than its owner ({OwnerName}): four-eyes rule.");
        }

        if (CurrentSignOffs.Any(s => s.UserId == signer.UserId))
        {
            throw new DomainRuleException("distinct-signers", $"{signer.DisplayName} has already signed item '{Key}'; each sign-off must come from a different person.");
        }

        var signOff = new SignOff(signer, atUtc, atGps, meaning, statement.Trim(), current);
        _signOffs.Add(signOff);
        if (CurrentSignOffs.Count() >= RequiredSignOffs)
        {
            State = ItemState.SignedOff;
        }

        Version++;
        return signOff;
    }

    private List<SignOff> AfterEvidenceChanged(DateTimeOffset now)
    {
        var madeStale = _signOffs.Where(s => !s.IsStale).ToList();
        foreach (var s in madeStale)
        {
            s.MarkStale(now);
        }

        State = StateAfterEvidence(State, madeStale.Count > 0);
        Version++;
        return madeStale;
    }

    /// <summary>
    /// The item state after evidence is added: back to ready for sign-off when sign-offs were made stale (or it was
    /// signed off); an open item goes in progress; otherwise unchanged.
    /// </summary>
    internal static ItemState StateAfterEvidence(ItemState state, bool madeStale) =>
        madeStale || state == ItemState.SignedOff ? ItemState.ReadyForSignOff
        : state == ItemState.Open ? ItemState.InProgress
        : state;

    private static string Short(string hash) => hash.Length > 12 ? hash[..12] : hash;
}
