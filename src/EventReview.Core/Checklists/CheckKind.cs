namespace EventReview.Core.Checklists;

/// <summary>The built-in computations a checklist item may name; later capabilities fill each in.</summary>
public static class CheckKind
{
    /// <summary>Arrival times across the sites: each pair's light-travel window and, for three or more sites, a sky-direction fit.</summary>
    public const string Timing = "timing";
    /// <summary>Correlation of two sites' whitened strain around the candidate: lag, phase and sign within the allowed lags.</summary>
    public const string Overlap = "overlap";
    /// <summary>Data-quality segments and auxiliary or environmental triggers near each arrival, with veto safety and coupling.</summary>
    public const string Environment = "environment";
    /// <summary>The injection log and the sealed blind-injection records against the candidate's time.</summary>
    public const string Injections = "injections";
    /// <summary>Time-slide background of trigger lists: false-alarm rate and significance of the candidate.</summary>
    public const string Background = "background";
    /// <summary>Each stage of the data chain modelled as zero-pole-gain and its output predicted from its input: residual excursions on-source.</summary>
    public const string Chain = "chain";
    /// <summary>Each site's frozen configuration record compared with later snapshots (drift).</summary>
    public const string Configuration = "configuration";

    /// <summary>Every known kind.</summary>
    public static IReadOnlyList<string> All { get; } = [Timing, Overlap, Environment, Injections, Background, Chain, Configuration];

    /// <summary>True when <paramref name="kind"/> is one of <see cref="All"/>.</summary>
    public static bool IsKnown(string? kind) => kind is not null && All.Contains(kind);
}
