namespace EventReview.Data.Auth;

/// <summary>
/// What an API token may do. A token gets exactly its scopes and nothing else: it never signs, runs checks, edits the
/// network or manages people, whatever its scopes.
/// </summary>
public static class TokenScopes
{
    /// <summary>Read cases, sites, the network file, attachments and dossiers.</summary>
    public const string CasesRead = "cases:read";

    /// <summary>Open a case for a candidate (idempotent on the candidate id).</summary>
    public const string CasesOpen = "cases:open";

    /// <summary>Add notes and attachments to checklist items.</summary>
    public const string EvidenceAdd = "evidence:add";

    /// <summary>Every scope, in display order.</summary>
    public static IReadOnlyList<string> All { get; } = [CasesRead, CasesOpen, EvidenceAdd];

    /// <summary>What a search pipeline needs: open cases and add evidence (the answers carry the ids it needs next).</summary>
    public static IReadOnlyList<string> Pipeline { get; } = [CasesOpen, EvidenceAdd];

    /// <summary>Plain-language help for a scope (shown on the tokens page and by the CLI).</summary>
    public static string Describe(string scope) => scope switch
    {
        CasesRead => "read cases, sites, attachments and dossiers",
        CasesOpen => "open a case for a new candidate",
        EvidenceAdd => "add notes and files to checklist items",
        _ => "unknown scope",
    };

    /// <summary>
    /// Parses scopes separated by commas or spaces (case-insensitive), removing repeats; null or empty gives
    /// <see cref="Pipeline"/>.
    /// </summary>
    /// <exception cref="ArgumentException">When a scope is unknown (the message names it and lists the known ones).</exception>
    public static IReadOnlyList<string> Parse(IEnumerable<string>? values)
    {
        var parts = (values ?? [])
            .SelectMany(v => (v ?? string.Empty).Split([',', ' ', ';'], StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
            .Select(p => p.ToLowerInvariant())
            .ToList();
        if (parts.Count == 0)
        {
            return Pipeline;
        }

        foreach (var p in parts)
        {
            if (!All.Contains(p))
            {
                throw new ArgumentException($"Unknown scope '{p}'; use one or more of {string.Join(", ", All)}.", "scopes");
            }
        }

        return All.Where(parts.Contains).ToList();
    }

    /// <summary>The stored form: known scopes in display order, separated by single spaces.</summary>
    public static string Join(IEnumerable<string> scopes) => string.Join(' ', All.Where(scopes.Contains));

    /// <summary>The stored form split back into scopes (unknown words are dropped, so a token never gains anything).</summary>
    public static IReadOnlyList<string> Split(string? stored) =>
        (stored ?? string.Empty).Split(' ', StringSplitOptions.RemoveEmptyEntries).Where(All.Contains).ToList();
}
