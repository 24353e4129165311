using EventReview.Core.Checklists;
using EventReview.Core.Configuration;
using EventReview.Core.Evidence;
using EventReview.Core.Inputs;
using EventReview.Core.Records;
using EventReview.Core.Time;

namespace EventReview.Core.Cases;

/// <summary>The end of a review: submission for decision, return to review, recorded coordinator overrides, and closing with an outcome.</summary>
public sealed partial class ReviewCase
{
    /// <summary>Moves the case to "awaiting decision"; every item must be signed off with current signatures.</summary>
    public void SubmitForDecision(Actor by, DateTimeOffset now)
    {
        EnsureNotClosed();
        if (State is not (CaseState.Open or CaseState.InReview))
        {
            throw new DomainRuleException("invalid-transition", $"Case is '{StateNames.Of(State)}'; only an open or in-review case can go to the decision board.");
        }

        EnsureAllSigned("submit it for decision");
        State = CaseState.AwaitingDecision;
        Record(by, now, "case.state", null, "Case submitted for decision: every item signed off.", [CaseFacts.CaseState(State)]);
    }

    /// <summary>Sends a case awaiting decision back to review.</summary>
    public void ReturnToReview(string reason, Actor by, DateTimeOffset now)
    {
        if (State != CaseState.AwaitingDecision)
        {
            throw new DomainRuleException("invalid-transition", $"Case is '{StateNames.Of(State)}'; only a case awaiting decision can return to review.");
        }

        InputGuard.Text(reason, InputLimits.MaxStatementLength, nameof(reason));

        State = CaseState.InReview;
        Record(by, now, "case.state", null, $"Case returned to review: {reason}", [CaseFacts.CaseState(State)]);
    }

    /// <summary>
    /// Records in the timeline that a coordinator overrode a review rule on an item (for example opening the sealed
    /// blind-injection record before the review is complete), with the coordinator's written reason.
    /// </summary>
    /// <exception cref="ArgumentException">When the rule or reason is empty, or the reason is over the statement limit.</exception>
    public void RecordOverride(string key, string rule, string reason, Actor by, DateTimeOffset now)
    {
        Mutable(key);
        if (string.IsNullOrWhiteSpace(rule) || string.IsNullOrWhiteSpace(reason))
        {
            throw new ArgumentException("reason: an override needs the rule it overrides and a written reason.", nameof(reason));
        }

        InputGuard.Text(reason.Trim(), InputLimits.MaxStatementLength, nameof(reason));
        Record(by, now, "override", key, $"Coordinator override of rule '{rule}' on '{key}': {reason.Trim()}", []);
    }

    /// <summary>Closes the case with an outcome; every item must be signed off and no sign-off stale.</summary>
    public void Close(CaseOutcome outcome, string statement, Actor by, DateTimeOffset now)
    {
        EnsureNotClosed();
        if (string.IsNullOrWhiteSpace(statement))
        {
            throw new DomainRuleException("statement-required", "Closing a case needs a statement of the decision.");
        }

        InputGuard.Text(statement.Trim(), InputLimits.MaxStatementLength, nameof(statement));
        if (!Enum.IsDefined(outcome))
        {
            throw new ArgumentOutOfRangeException(nameof(outcome), outcome, "outcome: not a known case outcome.");
        }

        EnsureAllSigned("close it");
        State = CaseState.Closed;
        Outcome = outcome;
        ClosingStatement = statement.Trim();
        Record(by, now, "case.closed", null, $"Case closed as {StateNames.Of(outcome)}: {ClosingStatement}",
            [CaseFacts.CaseState(State), .. CaseFacts.Closed(Outcome, ClosingStatement)]);
    }

    private void EnsureAllSigned(string action)
    {
        var stale = _items.Where(i => i.HasStaleSignOffs).Select(i => i.Key).ToList();
        if (stale.Count > 0)
        {
            throw new DomainRuleException("stale-signoff", $"Cannot {action}: {stale.Count} item(s) have stale sign-offs ({string.Join(", ", stale.Take(5))}).");
        }

        var unsigned = _items.Where(i => i.State != ItemState.SignedOff).Select(i => i.Key).ToList();
        if (unsigned.Count > 0)
        {
            throw new DomainRuleException("unsigned-items", $"Cannot {action}: {unsigned.Count} required item(s) are not signed off ({string.Join(", ", unsigned.Take(5))}{(unsigned.Count > 5 ? ", ..." : string.Empty)}).");
        }
    }
}
