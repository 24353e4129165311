namespace EventReview.Core.Injections;

/// <summary>State of a hardware injection in the injection log.</summary>
public enum InjectionStatus
{
    /// <summary>Planned but not (yet) confirmed as performed.</summary>
    Scheduled,

    /// <summary>Actually put into the hardware.</summary>
    Performed,

    /// <summary>Planned, then cancelled or stopped before it ran.</summary>
    Aborted,
}
