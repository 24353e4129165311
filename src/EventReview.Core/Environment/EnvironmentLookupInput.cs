using EventReview.Core.Time;

namespace EventReview.Core.Environment;

/// <summary>Everything the environment lookup reads for one case.</summary>
/// <param name="CaseTime">Case (candidate) GPS time; used for any site without an arrival time.</param>
/// <param name="Arrivals">Per-site arrival times keyed by site code (case-insensitive match).</param>
/// <param name="Sites">Sites to look up; sites named in <paramref name="Arrivals"/> are added.</param>
/// <param name="Segments">Data-quality segments (merged as imported).</param>
/// <param name="Triggers">Auxiliary and environmental triggers.</param>
/// <param name="Sensors">Sensor inventory; channels missing from it are treated as kind <see cref="SensorKind.Other"/>.</param>
/// <param name="Safety">Veto-safety results, or null when not tested (every channel then has safety "unknown").</param>
/// <param name="CouplingFunctions">Coupling functions keyed by <see cref="ChannelName.Qualified"/> (site and channel), or null.</param>
/// <param name="ObservingSegments">Spans of analysable data per site, or null; hits outside them are reported as warnings.</param>
public sealed record EnvironmentLookupInput(
    GpsTime CaseTime,
    IReadOnlyDictionary<string, GpsTime> Arrivals,
    IReadOnlyList<string> Sites,
    IReadOnlyList<DataQualitySegment> Segments,
    IReadOnlyList<AuxiliaryTrigger> Triggers,
    IReadOnlyList<Sensor> Sensors,
    VetoSafetyReport? Safety = null,
    IReadOnlyDictionary<string, FrequencyTable>? CouplingFunctions = null,
    IReadOnlyList<DataQualitySegment>? ObservingSegments = null);
