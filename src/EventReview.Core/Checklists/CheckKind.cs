namespace EventReview.Core.Checklists;

/// <summary>The built-in computations a checklist item may name; later capabilities fill each in.</summary>
public static class CheckKind
{
    public const string Timing = "timing";
    public const string Overlap = "overlap";
    public const string Environment = "environment";
    public const string Injections = "injections";
    public const string Background = "background";
    public const string Chain = "chain";
    public const string Configuration = "configuration";

    /// <summary>Every known kind.</summary>
    public static IReadOnlyList<string> All { get; } = [Timing, Overlap, Environment, Injections, Background, Chain, Configuration];

    /// <summary>True when <paramref name="kind"/> is one of <see cref="All"/>.</summary>
    public static bool IsKnown(string? kind) => kind is not null && All.Contains(kind);
}
