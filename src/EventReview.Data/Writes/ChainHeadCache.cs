using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;

namespace EventReview.Data.Writes;

/// <summary>
/// What PostgreSQL's single writer remembers of the cases it appended to: each case's state, version and timeline head,
/// and of each item its id, state, version, current sign-offs and fingerprint lines, as they stood after the writer's own
/// last append. An append to a remembered item needs no read (<see cref="EvidenceAppendPostgres"/>). The database stays
/// the judge: the append stores its entry at the next sequence, which the unique index on (case, sequence) refuses if
/// anything else added an entry since, and every change of a case adds one (its version moves with its timeline); then
/// the entry is forgotten and the case read again. The writer forgets a case whenever another kind of unit changes it,
/// and forgets everything when a batch fails. Used by the writer's loop only (one thread at a time).
/// </summary>
internal sealed class ChainHeadCache
{
    /// <summary>Most cases remembered; past it the cache starts again empty.</summary>
    public const int MaxCases = 4096;

    private readonly Dictionary<int, CaseHead> _cases = [];
    private readonly Dictionary<string, int> _byChain = new(StringComparer.Ordinal);

    /// <summary>A case as the writer last stored it.</summary>
    public sealed class CaseHead(int id, string candidateId, CaseState state, int version, int lastSequence, string lastHash)
    {
        public int Id { get; } = id;

        public string CandidateId { get; } = candidateId;

        public CaseState State { get; set; } = state;

        public int Version { get; set; } = version;

        public int LastSequence { get; set; } = lastSequence;

        public string LastHash { get; set; } = lastHash;

        public Dictionary<string, ItemHead> Items { get; } = new(StringComparer.Ordinal);
    }

    /// <summary>An item as the writer last stored it, with its fingerprint lines in canonical order (time added, then id).</summary>
    public sealed class ItemHead(int id, ItemState state, int version, int currentSignOffs, List<(long Ticks, int Id, EvidenceLine Line)> evidence, List<ComputationLine> computations)
    {
        public int Id { get; } = id;

        public ItemState State { get; set; } = state;

        public int Version { get; set; } = version;

        public int CurrentSignOffs { get; } = currentSignOffs;

        public List<(long Ticks, int Id, EvidenceLine Line)> Evidence { get; } = evidence;

        public List<ComputationLine> Computations { get; } = computations;

        /// <summary>Adds a stored evidence row's line at its canonical place.</summary>
        public void AddEvidence(long ticks, int id, EvidenceLine line)
        {
            var at = Evidence.Count;
            while (at > 0 && (Evidence[at - 1].Ticks > ticks || (Evidence[at - 1].Ticks == ticks && Evidence[at - 1].Id > id)))
            {
                at--;
            }

            Evidence.Insert(at, (ticks, id, line));
        }

        /// <summary>The item's evidence fingerprint (<see cref="EvidenceFingerprint"/>).</summary>
        public string Fingerprint() => EvidenceFingerprint.Compute(Evidence.Select(e => e.Line), Computations);
    }

    /// <summary>Appends stored from a remembered head, without reading the case.</summary>
    public long Hits { get; private set; }

    /// <summary>Remembered heads found out of date by the database (the case was read again).</summary>
    public long Stale { get; private set; }

    public void CountHit() => Hits++;

    public void CountStale() => Stale++;

    /// <summary>Number of cases remembered.</summary>
    public int Count => _cases.Count;

    public CaseHead? Find(int caseId) => _cases.GetValueOrDefault(caseId);

    /// <summary>Remembers <paramref name="head"/>, replacing what was remembered of its case.</summary>
    public void Keep(CaseHead head)
    {
        ArgumentNullException.ThrowIfNull(head);
        if (_cases.Count >= MaxCases && !_cases.ContainsKey(head.Id))
        {
            Clear();
        }

        _cases[head.Id] = head;
        _byChain[EventReview.Core.Records.EntryMac.CaseChain(head.CandidateId)] = head.Id;
    }

    public void Forget(int caseId)
    {
        if (_cases.Remove(caseId, out var head))
        {
            _byChain.Remove(EventReview.Core.Records.EntryMac.CaseChain(head.CandidateId));
        }
    }

    /// <summary>Forgets the cases whose chains another unit wrote (by the heads it reported for the witness).</summary>
    public void ForgetChains(IEnumerable<Records.WitnessedHead> heads)
    {
        foreach (var h in heads)
        {
            if (_byChain.TryGetValue(h.Chain, out var id))
            {
                Forget(id);
            }
        }
    }

    public void Clear()
    {
        _cases.Clear();
        _byChain.Clear();
    }
}
