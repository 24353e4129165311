using EventReview.Core.Checklists;
using EventReview.Core.Evidence;

namespace EventReview.Core.Cases;

/// <summary>
/// Adding one piece of evidence to an item, computed from the few stored values it depends on: the case's state and
/// timeline head and the item's state. <see cref="ReviewCase.AddEvidence"/> applies these rules to a loaded case; the
/// store's short append path, which does not load the case, applies them through <see cref="Plan"/>. An item with a
/// current sign-off needs the loaded case (its sign-offs become stale and more entries follow), so <see cref="Plan"/>
/// does not cover it.
/// </summary>
public static class EvidenceAppend
{
    /// <summary>What an append depends on, as stored before it.</summary>
    /// <param name="CandidateId">The case's candidate identifier.</param>
    /// <param name="CaseState">The case's state.</param>
    /// <param name="ItemKey">The item's key.</param>
    /// <param name="ItemState">The item's state.</param>
    /// <param name="LastSequence">Sequence of the newest timeline entry (0 when the timeline is empty).</param>
    /// <param name="LastHash">Hash of the newest timeline entry (<see cref="TimelineEntry.GenesisHash"/> when empty).</param>
    /// <param name="CurrentSignOffs">Sign-offs of the item that are not stale.</param>
    public sealed record Head(string CandidateId, CaseState CaseState, string ItemKey, ItemState ItemState, int LastSequence, string LastHash, int CurrentSignOffs);

    /// <summary>What an append stores besides the evidence row: one timeline entry and the new states.</summary>
    public sealed record Outcome(TimelineEntry Entry, ItemState ItemState, CaseState CaseState);

    /// <summary>True when <see cref="Plan"/> covers an append to this item (no current sign-off to make stale).</summary>
    public static bool Covers(Head head) => head.CurrentSignOffs == 0;

    /// <summary>The timeline entry and states after adding <paramref name="evidence"/>, exactly as <see cref="ReviewCase.AddEvidence"/> makes them.</summary>
    /// <exception cref="DomainRuleException">When the case is closed.</exception>
    /// <exception cref="InvalidOperationException">When the item has current sign-offs (see <see cref="Covers"/>).</exception>
    public static Outcome Plan(Head head, EvidenceItem evidence, Actor by, DateTimeOffset now)
    {
        if (head.CaseState == CaseState.Closed)
        {
            throw ReviewCase.ClosedError(head.CandidateId);
        }

        if (!Covers(head))
        {
            throw new InvalidOperationException($"Item '{head.ItemKey}' has current sign-offs; adding evidence makes them stale and needs the whole case.");
        }

        var itemState = ChecklistItem.StateAfterEvidence(head.ItemState, madeStale: false);
        var caseState = ReviewCase.StateWhenWorkBegins(head.CaseState);
        var entry = new TimelineEntry(head.CandidateId, head.LastSequence + 1, now, by, EntryKind(evidence), head.ItemKey, EntryText(head.ItemKey, evidence), head.LastHash,
            EntryFacts(head.ItemKey, evidence, itemState, caseState));
        return new Outcome(entry, itemState, caseState);
    }

    /// <summary>Facts of the timeline entry: the evidence row's seal and detail, then the item's and the case's state after it.</summary>
    public static IEnumerable<Records.Fact> EntryFacts(string key, EvidenceItem evidence, ItemState itemState, CaseState caseState) =>
        [Records.CaseFacts.Evidence(key, evidence), Records.CaseFacts.ItemState(key, itemState), Records.CaseFacts.CaseState(caseState)];

    /// <summary>Kind of the timeline entry: "evidence.note", "evidence.attachment" or "evidence.link".</summary>
    public static string EntryKind(EvidenceItem evidence) => "evidence." + evidence.Kind.ToString().ToLowerInvariant();

    /// <summary>Text of the timeline entry, ending with the evidence row's seal.</summary>
    public static string EntryText(string key, EvidenceItem evidence)
    {
        var what = evidence.Kind switch
        {
            EvidenceKind.Note => $"Note added to '{key}' (sha256 {evidence.ContentSha256}).",
            EvidenceKind.Attachment => $"File '{evidence.FileName}' ({evidence.SizeBytes} bytes, sha256 {evidence.ContentSha256}) attached to '{key}'" +
                (evidence.FileRole is { } role ? $" as {role.Title}." : "."),
            _ => $"Link {evidence.Url} added to '{key}'.",
        };
        return what + $" Seal {evidence.Seal()}.";
    }
}
