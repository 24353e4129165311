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

    /// <summary>A configuration snapshot frozen for the case (the freeze record itself; format 1 already stored this word).</summary>
    Frozen,

    /// <summary>Data chain, record format 2: the residual is consistent with noise and the stage model fits.</summary>
    ResidualIsNoise,

    /// <summary>Data chain, record format 2: an excursion above the trials-corrected threshold inside the on-source window, with a model that fits.</summary>
    ExcessFound,

    /// <summary>Data chain, record format 2: the residual is dominated by a stage model that does not fit the data, so the check cannot tell.</summary>
    ModelDoesNotFit,

    /// <summary>Background, record format 2: a measured significance below 3 sigma (a statement, not a pass or fail).</summary>
    BelowThreeSigma,

    /// <summary>Background, record format 2: a measured significance from 3 up to 5 sigma.</summary>
    ThreeToFiveSigma,

    /// <summary>Background, record format 2: a significance of 5 sigma or more (measured, or a lower bound at or above 5).</summary>
    FiveSigmaOrMore,

    /// <summary>Background, record format 2: nothing in the background was as loud, and the lower bound on the significance lies from 3 up to 5 sigma.</summary>
    AtLeastThreeSigma,

    /// <summary>Veto safety: no channel tested responds to hardware injections.</summary>
    VetoSafe,

    /// <summary>Veto safety: at least one channel responds to hardware injections and must not be used to veto.</summary>
    VetoUnsafe,

    /// <summary>A sealed record whose salt and bytes match the commitment.</summary>
    SealValid,

    /// <summary>A sealed record whose salt or bytes do not match the commitment.</summary>
    SealInvalid,

    /// <summary>A blind-injection record is sealed and not yet opened: no case may be closed as astrophysical.</summary>
    Sealed,
}
