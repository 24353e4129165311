using EventReview.Core.Cases;

namespace EventReview.Web.Services.Live;

/// <summary>
/// One "who did what" line for a teammate's change, made from the timeline entry the page read back through the normal
/// query: "Ana Example signed 3.2 (Timing across sites)".
/// </summary>
public sealed record ChangeLine(int Sequence, string Who, string What, string? ItemKey, string? ItemTitle, DateTimeOffset At)
{
    /// <summary>Most lines kept on a page (newest first).</summary>
    public const int MaxShown = 3;

    /// <summary>The lines for the entries of <paramref name="fresh"/> after <paramref name="seenSequence"/> made by someone other than <paramref name="myUserId"/>, newest first.</summary>
    public static IReadOnlyList<ChangeLine> Since(ReviewCase fresh, int seenSequence, string myUserId) =>
        fresh.Timeline.Where(e => e.Sequence > seenSequence && e.ActorId != myUserId).OrderByDescending(e => e.Sequence)
            .Select(e => Of(e, e.ItemKey is null ? null : fresh.Items.FirstOrDefault(i => i.Key == e.ItemKey)?.Title)).ToList();

    /// <summary>The line for one entry.</summary>
    public static ChangeLine Of(TimelineEntry entry, string? itemTitle) =>
        new(entry.Sequence, entry.ActorName, Verb(entry), entry.ItemKey, itemTitle, entry.At);

    /// <summary>The newest sequence number of a case's timeline (0 for none).</summary>
    public static int Newest(ReviewCase c) => c.Timeline.Count == 0 ? 0 : c.Timeline.Max(e => e.Sequence);

    private static string Verb(TimelineEntry e) => e.Kind switch
    {
        "signoff" => "signed",
        "signoff.stale" => "changed evidence, which made the sign-offs stale on",
        "evidence.note" => "added a note to",
        "evidence.attachment" => "attached a file to",
        "evidence.link" => "added a link to",
        "item.state" => "changed the state of",
        "item.assigned" => "changed the owner of",
        "item.due" => "changed the due date of",
        "case.state" => "changed the case's state",
        "case.closed" => "closed the case",
        "override" => "overrode a rule on",
        _ when e.Kind.StartsWith("computation.", StringComparison.Ordinal) => $"ran the {e.Kind["computation.".Length..]} check on",
        _ => FirstSentence(e.Text),
    };

    private static string FirstSentence(string text)
    {
        var end = text.IndexOf(". ", StringComparison.Ordinal);
        var first = end < 0 ? text.TrimEnd('.') : text[..end];
        first = first.Length > 90 ? first[..89] + "…" : first;
        return "made a change: " + first;
    }
}
