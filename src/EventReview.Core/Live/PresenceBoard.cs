namespace EventReview.Core.Live;

/// <summary>
/// Who has a case open right now, in memory only (presence is not a record: nothing of it is stored): the latest beat
/// of every open page, forgotten <see cref="Expiry"/> after its last beat or at once when it says it is leaving. Pages
/// beat every <see cref="BeatEvery"/>, so a page that vanished without a word (a closed laptop, a dropped instance) is
/// gone within <see cref="Expiry"/>. Safe to use from several threads.
/// </summary>
public sealed class PresenceBoard
{
    /// <summary>How long a beat counts (30 s): three missed beats.</summary>
    public static readonly TimeSpan Expiry = TimeSpan.FromSeconds(30);

    /// <summary>How often an open page beats (10 s).</summary>
    public static readonly TimeSpan BeatEvery = TimeSpan.FromSeconds(10);

    private readonly Lock _lock = new();
    private readonly Dictionary<string, (PresenceBeat Beat, DateTimeOffset At)> _sessions = new(StringComparer.Ordinal);

    /// <summary>
    /// Takes a beat heard at <paramref name="now"/>; returns true when what others see changed (someone arrived, left,
    /// moved to another item or started doing something else), false for a mere renewal.
    /// </summary>
    public bool Apply(PresenceBeat beat, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(beat);
        lock (_lock)
        {
            var known = _sessions.TryGetValue(beat.SessionId, out var before) && now - before.At <= Expiry;
            if (beat.Leaving)
            {
                return _sessions.Remove(beat.SessionId) && known;
            }

            _sessions[beat.SessionId] = (beat, now);
            return !known || before.Beat != beat;
        }
    }

    /// <summary>The open pages of a case at <paramref name="now"/> (expired ones are dropped), ordered by name.</summary>
    public IReadOnlyList<PresenceBeat> Here(string candidateId, DateTimeOffset now)
    {
        lock (_lock)
        {
            foreach (var gone in _sessions.Where(s => now - s.Value.At > Expiry).Select(s => s.Key).ToList())
            {
                _sessions.Remove(gone);
            }

            return _sessions.Values.Select(s => s.Beat).Where(b => b.CandidateId == candidateId)
                .OrderBy(b => b.DisplayName, StringComparer.Ordinal).ThenBy(b => b.SessionId, StringComparer.Ordinal).ToList();
        }
    }
}
