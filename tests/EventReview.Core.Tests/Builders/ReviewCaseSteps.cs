using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Builders;

/// <summary>Short-hands for the usual steps of a review in tests.</summary>
public static class ReviewCaseSteps
{
    public static void AddNote(this ReviewCase c, string key, string text, Actor by, DateTimeOffset at) =>
        c.AddEvidence(key, EvidenceItem.Note(text, by, at), by, at);

    /// <summary>Adds a note by <paramref name="by"/> and marks the item ready for sign-off.</summary>
    public static void PrepareForSignOff(this ReviewCase c, string key, Actor by, DateTimeOffset at)
    {
        c.AddNote(key, $"Evidence for {key}.", by, at);
        c.MarkItemReady(key, by, at);
    }

    /// <summary>Signs against the item's current fingerprint.</summary>
    public static SignOff SignNow(this ReviewCase c, string key, Actor signer, DateTimeOffset at, string statement = "Checked the evidence.") =>
        c.SignItem(key, signer, SignOffMeaning.Reviewed, statement, c.Item(key).Fingerprint(), at, GpsUtc.FromUtc(at.UtcDateTime));

    /// <summary>Prepares and signs every item with as many distinct reviewers as it needs (none of them the owner).</summary>
    public static void SignEverything(this ReviewCase c, DateTimeOffset at)
    {
        Actor[] signers = [People.ReviewerB, People.ReviewerC, People.Coordinator];
        foreach (var item in c.Items.ToList())
        {
            if (item.State is ItemState.SignedOff)
            {
                continue;
            }

            if (item.State is not ItemState.ReadyForSignOff)
            {
                c.PrepareForSignOff(item.Key, People.ReviewerA, at);
            }

            for (var k = item.CurrentSignOffs.Count(); k < item.RequiredSignOffs; k++)
            {
                c.SignNow(item.Key, signers[k], at);
            }
        }
    }
}
