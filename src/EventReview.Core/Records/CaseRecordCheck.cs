using System.Globalization;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;

namespace EventReview.Core.Records;

/// <summary>
/// Compares a case as stored (<see cref="StoredCase"/>) with what its signed timeline says it must be
/// (<see cref="RecordedCase"/>): every field, every arrival and item, every evidence, computation and sign-off row with its
/// stale mark, and every frozen configuration record. A recorded row that is not stored is reported missing; a stored row
/// that no entry records is reported unaccounted. Problems come in a fixed order: case fields, arrivals, items, rows by entry.
/// </summary>
public static class CaseRecordCheck
{
    /// <summary>The problems found comparing <paramref name="stored"/> with <paramref name="recorded"/>, in the order above; empty when they agree.</summary>
    public static IReadOnlyList<IntegrityProblem> Compare(string candidateId, RecordedCase recorded, StoredCase stored)
    {
        ArgumentNullException.ThrowIfNull(recorded);
        ArgumentNullException.ThrowIfNull(stored);
        var problems = new List<IntegrityProblem>();
        void Add(int? entry, string? item, string what) => problems.Add(new IntegrityProblem(candidateId, entry, item, what));

        foreach (var (entry, what) in recorded.Problems)
        {
            Add(entry, null, $"Timeline: entry {entry} cannot be replayed: {what}");
        }

        CompareFields(recorded, stored, Add);
        if (stored.UpdatedAtUtcTicks is { } updated && recorded.LastEntry > 0 && updated != recorded.LastAtUtcTicks)
        {
            Add(recorded.LastEntry, null, $"The case's last-change time is {Ticks(updated)} in the database, but its newest entry ({recorded.LastEntry}) is from {Ticks(recorded.LastAtUtcTicks)}.");
        }

        RowCheck.Compare(recorded, stored, Add);
        if (stored.Configurations is { } configurations)
        {
            RowCheck.CompareConfigurations(recorded, configurations, Add);
        }

        return problems;
    }

    private static void CompareFields(RecordedCase recorded, StoredCase stored, Action<int?, string?, string> add)
    {
        var recordedItems = ItemKeys(recorded.Fields.Keys);
        var storedItems = ItemKeys(stored.Fields.Keys);
        foreach (var key in recordedItems.Where(k => !storedItems.Contains(k)))
        {
            var entry = recorded.Fields[FactNames.Item(key, FactNames.Title)].Entry;
            add(entry, key, $"Item '{key}' (created in entry {entry}) is missing from the database.");
        }

        foreach (var key in storedItems.Where(k => !recordedItems.Contains(k)))
        {
            add(null, key, $"Item '{key}' is in the database, but no signed entry accounts for it (inserted afterwards).");
        }

        foreach (var name in recorded.Fields.Keys.Concat(stored.Fields.Keys).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).OrderBy(Rank))
        {
            _ = FactNames.TryParse(name, out var part, out var key, out var field);
            if (part == "item" && (!recordedItems.Contains(key!) || !storedItems.Contains(key!)))
            {
                continue;
            }

            var has = recorded.Fields.TryGetValue(name, out var r);
            var inDb = stored.Fields.TryGetValue(name, out var s);
            if (has && inDb && string.Equals(r.Value, s, StringComparison.Ordinal))
            {
                continue;
            }

            var subject = part switch
            {
                "case" => $"The case's {FactNames.Label(field)}",
                "arrival" => $"The arrival at {key}",
                _ => $"Item '{key}': its {FactNames.Label(field)}",
            };
            add(has ? r.Entry : null, part == "item" ? key : null, (has, inDb) switch
            {
                (true, false) => $"{subject}, recorded in entry {r.Entry}, is missing from the database.",
                (false, _) => $"{subject} is in the database, but no signed entry accounts for it (inserted afterwards).",
                _ => $"{subject} is {Show(field, s!)} in the database, but the signed record says {Show(field, r.Value)} (entry {r.Entry}).",
            });
        }
    }

    private static HashSet<string> ItemKeys(IEnumerable<string> names) =>
        names.Select(n => FactNames.TryParse(n, out var part, out var key, out _) && part == "item" ? key : null).OfType<string>().ToHashSet(StringComparer.Ordinal);

    private static int Rank(string name) => name.StartsWith("case.", StringComparison.Ordinal) ? 0 : name.StartsWith("arrival[", StringComparison.Ordinal) ? 1 : 2;

    /// <summary>A stored or recorded value in words: states and outcomes as their plain names, empty as "(none)", long values cut.</summary>
    internal static string Show(string field, string value)
    {
        if (value.Length == 0)
        {
            return "(none)";
        }

        var words = field switch
        {
            FactNames.State when Enum.TryParse<CaseState>(value, out var cs) && Enum.IsDefined(cs) => StateNames.Of(cs),
            FactNames.State when Enum.TryParse<ItemState>(value, out var its) && Enum.IsDefined(its) => StateNames.Of(its),
            FactNames.Outcome when Enum.TryParse<CaseOutcome>(value, out var o) && Enum.IsDefined(o) => StateNames.Of(o),
            _ => value,
        };
        return "'" + (words.Length > 80 ? words[..80] + "…" : words) + "'";
    }

    internal static string Ticks(long ticks) =>
        ticks is >= 0 and <= 3_155_378_975_999_999_999 ? new DateTime(ticks, DateTimeKind.Utc).ToString("yyyy-MM-dd HH:mm:ss.fff", CultureInfo.InvariantCulture) + " UTC" : $"(ticks {ticks})";
}
