namespace EventReview.Core.Live;

/// <summary>
/// A message read from the live channel: the instance that sent it (<see cref="Origin"/>) and either a change or a
/// presence beat; or, for a malformed payload, neither and the <see cref="Problem"/> that made it unreadable.
/// </summary>
public sealed record LiveMessage(string? Origin, CaseChanged? Change, PresenceBeat? Presence, string? Problem)
{
    /// <summary>True when the payload was read (exactly one of <see cref="Change"/> and <see cref="Presence"/> is set).</summary>
    public bool Ok => Problem is null;

    /// <summary>A payload that could not be read, with the reason.</summary>
    public static LiveMessage Refused(string problem) => new(null, null, null, problem);
}
