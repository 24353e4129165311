using EventReview.Core.Environment;

namespace EventReview.Web.Services.Checks;

/// <summary>What an environment computation record stores as its result (record format 2; format-1 records have no "format").</summary>
/// <param name="Format">Record format (<see cref="Core.Verdicts.RecordFormat"/>); 0 when read from a format-1 record.</param>
/// <param name="Report">The lookup: hits, active segments, cross-site coincidences, per-site verdicts, assumptions.</param>
/// <param name="Safety">Veto safety of every channel against the injection log, or null when no log was given.</param>
/// <param name="LightTravelWindowSeconds">Cross-site window used, seconds, and where it came from in <paramref name="LightTravelSource"/>.</param>
/// <param name="LightTravelSource">"network (largest light-travel time between the case's sites)" or "given".</param>
/// <param name="Notes">Import notes (merged segments), coupling files not found, coupling not estimated, and similar.</param>
/// <param name="Files">Every input file with its role and SHA-256.</param>
public sealed record EnvironmentRecordResult(
    int Format,
    EnvironmentReport Report,
    VetoSafetyReport? Safety,
    double LightTravelWindowSeconds,
    string LightTravelSource,
    IReadOnlyList<string> Notes,
    IReadOnlyList<CheckFileRef> Files);
