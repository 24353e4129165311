namespace EventReview.Core.Live;

/// <summary>
/// One heartbeat of someone with a case open: who (account id and display name), where (the item, or null for the case
/// as a whole) and what they are doing ("editing a note"), sent every few seconds while the page is open and once with
/// <paramref name="Leaving"/> set when it closes. Presence is never stored: it lives in memory and expires
/// (<see cref="PresenceBoard.Expiry"/>).
/// </summary>
/// <param name="CandidateId">The case's candidate id.</param>
/// <param name="SessionId">One open page (a browser tab), so one person in two tabs is two sessions.</param>
/// <param name="UserId">Account id of the person.</param>
/// <param name="DisplayName">Their display name, as the page shows it.</param>
/// <param name="ItemKey">Checklist item open in that page, or null.</param>
/// <param name="Doing">What they are doing there in a few words ("editing a note"), or null for viewing.</param>
/// <param name="Leaving">True on the last beat of a page that closes.</param>
public sealed record PresenceBeat(string CandidateId, string SessionId, string UserId, string DisplayName, string? ItemKey, string? Doing, bool Leaving = false);
