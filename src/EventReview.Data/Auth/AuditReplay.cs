using EventReview.Core.Records;

namespace EventReview.Data.Auth;

/// <summary>
/// Replays the facts of the sign-in audit and compares them with the stored accounts and roles, API tokens and sealed
/// injection records (each described by <see cref="AuditFacts"/>): a stored value that differs, a recorded row that is
/// missing, and a stored row that no entry accounts for (an account promoted by hand, a token given a wider scope or
/// un-revoked, a seal marked opened) are each named.
/// </summary>
public static class AuditReplay
{
    /// <summary>The problems found, or an empty list. <paramref name="stored"/> are the facts of the stored rows.</summary>
    public static IReadOnlyList<string> Compare(IEnumerable<AccountEvent> chain, IEnumerable<Fact> stored)
    {
        var recorded = new Dictionary<string, (string Value, long Entry)>(StringComparer.Ordinal);
        var problems = new List<string>();
        foreach (var e in chain.OrderBy(e => e.Sequence))
        {
            if (e.Facts is null)
            {
                problems.Add($"Sign-in audit entry {e.Sequence} carries no facts: accounts, tokens and sealed records cannot be recomputed from the audit.");
                return problems;
            }

            try
            {
                foreach (var f in FactText.Parse(e.Facts))
                {
                    recorded[f.Name] = (f.Value, e.Sequence);
                }
            }
            catch (FormatException ex)
            {
                problems.Add($"Sign-in audit entry {e.Sequence}: its facts cannot be read ({ex.Message}).");
            }
        }

        var inDb = StoredCase.ToDictionary(stored);
        var recordedSubjects = recorded.Keys.Select(Subject).ToHashSet(StringComparer.Ordinal);
        var storedSubjects = inDb.Keys.Select(Subject).ToHashSet(StringComparer.Ordinal);
        foreach (var s in recordedSubjects.Where(s => !storedSubjects.Contains(s)).Order(StringComparer.Ordinal))
        {
            var entry = recorded.Where(kv => Subject(kv.Key) == s).Min(kv => kv.Value.Entry);
            problems.Add($"{Describe(s)}, recorded in sign-in audit entry {entry}, is missing from the database.");
        }

        foreach (var s in storedSubjects.Where(s => !recordedSubjects.Contains(s)).Order(StringComparer.Ordinal))
        {
            problems.Add($"{Describe(s)} is in the database, but no sign-in audit entry accounts for it (added by hand).");
        }

        foreach (var name in inDb.Keys.Where(n => recordedSubjects.Contains(Subject(n))).Order(StringComparer.Ordinal))
        {
            if (!recorded.TryGetValue(name, out var r))
            {
                problems.Add($"{Describe(Subject(name))}, {Field(name)}: '{Show(inDb[name])}' is in the database, but no sign-in audit entry accounts for it.");
            }
            else if (!string.Equals(r.Value, inDb[name], StringComparison.Ordinal))
            {
                problems.Add($"{Describe(Subject(name))}, {Field(name)}: '{Show(inDb[name])}' in the database, but the sign-in audit says '{Show(r.Value)}' (entry {r.Entry}).");
            }
        }

        foreach (var name in recorded.Keys.Where(n => storedSubjects.Contains(Subject(n)) && !inDb.ContainsKey(n)).Order(StringComparer.Ordinal))
        {
            problems.Add($"{Describe(Subject(name))}, {Field(name)}: '{Show(recorded[name].Value)}' (sign-in audit entry {recorded[name].Entry}) is missing from the database.");
        }

        return problems;
    }

    private static string Subject(string name) => name[..(name.IndexOf(']', StringComparison.Ordinal) + 1)];

    private static string Field(string name) => name[(name.IndexOf("].", StringComparison.Ordinal) + 2)..] switch
    {
        "name" => "display name",
        "revoked" => "revoked at (UTC ticks)",
        "expires" => "expires at (UTC ticks)",
        "created" => "created at (UTC ticks)",
        "sealed" => "sealed at (UTC ticks)",
        "opened" => "opened at (UTC ticks)",
        "opened-summary" => "opening summary (SHA-256)",
        "opened-record" => "opened record (SHA-256)",
        var f => f,
    };

    private static string Describe(string subject)
    {
        var open = subject.IndexOf('[', StringComparison.Ordinal);
        var (part, key) = (subject[..open], subject[(open + 1)..^1]);
        return part switch
        {
            "account" => $"The account {key}",
            "token" => $"API token {key}",
            "seal" => $"Sealed injection record {key}",
            _ => subject,
        };
    }

    private static string Show(string value) => value.Length == 0 ? "(none)" : value.Length > 64 ? value[..64] + "…" : value;
}
