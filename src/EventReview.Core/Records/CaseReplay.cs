using System.Globalization;

namespace EventReview.Core.Records;

/// <summary>
/// Replays the facts of a case's timeline, oldest entry first, into the <see cref="RecordedCase"/> they describe: later
/// facts about a field replace earlier ones; row facts add rows; stale facts mark sign-offs added earlier. Never throws
/// for bad content: what cannot be read becomes a problem of its entry.
/// </summary>
public static class CaseReplay
{
    /// <summary>One timeline entry as the replay reads it.</summary>
    public readonly record struct Entry(int Sequence, string Kind, string ActorName, long AtUtcTicks, string? Facts);

    /// <summary>Replays <paramref name="entries"/> (any order; sorted by sequence here).</summary>
    public static RecordedCase Replay(IEnumerable<Entry> entries)
    {
        ArgumentNullException.ThrowIfNull(entries);
        var recorded = new RecordedCase();
        foreach (var e in entries.OrderBy(e => e.Sequence))
        {
            recorded.LastEntry = e.Sequence;
            recorded.LastAtUtcTicks = e.AtUtcTicks;
            if (e.Facts is null)
            {
                recorded.WithoutFacts.Add(e.Sequence);
                continue;
            }

            IReadOnlyList<Fact> facts;
            try
            {
                facts = FactText.Parse(e.Facts);
            }
            catch (FormatException ex)
            {
                recorded.Problems.Add((e.Sequence, "its facts cannot be read: " + ex.Message));
                continue;
            }

            foreach (var f in facts)
            {
                if (Apply(recorded, e, f) is { } problem)
                {
                    recorded.Problems.Add((e.Sequence, problem));
                }
            }
        }

        return recorded;
    }

    private static string? Apply(RecordedCase r, Entry e, Fact f)
    {
        if (!FactNames.TryParse(f.Name, out var part, out var key, out var rest))
        {
            return $"it holds the fact '{f.Name}', which this version does not know.";
        }

        var words = f.Value.Split(' ');
        switch (part, rest)
        {
            case ("case" or "arrival" or "item", _):
                r.Fields[f.Name] = (f.Value, e.Sequence);
                return null;
            case ("evidence", "+") when words.Length == 2:
                r.Rows.Add(new RecordedRow(part, key, words[0], words[1], e.Sequence, e.Kind, e.ActorName, e.AtUtcTicks));
                return null;
            case ("computation" or "signoff", "+") when words.Length == 1:
                r.Rows.Add(new RecordedRow(part, key, words[0], string.Empty, e.Sequence, e.Kind, e.ActorName, e.AtUtcTicks));
                return null;
            case ("configuration", "+") when words.Length == 3:
                r.Rows.Add(new RecordedRow(part, null, words[0], words[1] + " " + words[2], e.Sequence, e.Kind, e.ActorName, e.AtUtcTicks));
                return null;
            case ("signoff", "stale") when words.Length == 2 && long.TryParse(words[1], NumberStyles.None, CultureInfo.InvariantCulture, out var since):
                var signOff = r.Rows.LastOrDefault(x => x.Part == "signoff" && x.Item == key && x.Seal == words[0]);
                if (signOff is null)
                {
                    return $"it marks stale a sign-off of '{key}' (seal {Short(words[0])}) that no earlier entry added.";
                }

                signOff.Stale = (since, e.Sequence);
                return null;
            default:
                return $"its fact '{f.Name}' has the malformed value '{Short(f.Value)}'.";
        }
    }

    private static string Short(string s) => s.Length > 24 ? s[..24] + "…" : s;
}
