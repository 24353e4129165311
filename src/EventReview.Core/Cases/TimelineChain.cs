namespace EventReview.Core.Cases;

/// <summary>Verifies a case's timeline hash chain.</summary>
public static class TimelineChain
{
    /// <summary>
    /// Checks sequence numbers (1, 2, 3, ... without gaps), each entry's link to the previous hash and each entry's own hash.
    /// Returns null when the chain is intact, otherwise a sentence naming the first entry that does not match.
    /// </summary>
    public static string? FirstProblem(IEnumerable<TimelineEntry> entries) => Check(entries).Problem;

    /// <summary>As <see cref="FirstProblem"/>, also giving the sequence number of the first entry that does not verify.</summary>
    public static (int? Entry, string? Problem) Check(IEnumerable<TimelineEntry> entries)
    {
        var prev = TimelineEntry.GenesisHash;
        var expected = 1;
        foreach (var e in entries.OrderBy(e => e.Sequence))
        {
            if (e.Sequence != expected)
            {
                return (e.Sequence, $"Entry {expected} is missing (entry {e.Sequence} follows entry {expected - 1}).");
            }

            if (!string.Equals(e.PreviousHash, prev, StringComparison.Ordinal))
            {
                return (e.Sequence, $"Entry {e.Sequence} ({e.Kind}) does not link to entry {e.Sequence - 1}: previous-hash mismatch.");
            }

            if (!e.HashMatches())
            {
                return (e.Sequence, $"Entry {e.Sequence} ({e.Kind}, {e.At.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC by {e.ActorName}) was altered: its content no longer matches its hash.");
            }

            prev = e.Hash;
            expected++;
        }

        return (null, null);
    }
}
