namespace EventReview.Core.Verdicts;

/// <summary>
/// Every verdict a built-in check can give, typed. The stored word of each member (<see cref="VerdictWords.Word"/>) is
/// part of a computation record's content hash, so a member's word never changes; a new meaning gets a new member
/// (and the record format's version says which words a record may hold). A verdict flags; people decide.
/// </summary>
public enum Verdict
{
    /// <summary>No record yet, or the check could not run.</summary>
    NotRun,

    /// <summary>The numbers agree with the stated tolerance (timing, overlap, antenna response).</summary>
    Consistent,

    /// <summary>The numbers disagree with the stated tolerance.</summary>
    Inconsistent,

    /// <summary>Nothing found that needs a person's attention (environment, injections).</summary>
    Clear,

    /// <summary>Something a person must look at before signing.</summary>
    Concern,

    /// <summary>Legacy data-chain word of record format 1: no excess above the threshold.</summary>
    NothingAdded,

    /// <summary>Legacy data-chain word of record format 1: an excess above the threshold.</summary>
    SomethingAdded,

    /// <summary>The configuration compared equal to the frozen one.</summary>
    NoDrift,

    /// <summary>The configuration changed, outside the freeze period.</summary>
    Drift,
}
