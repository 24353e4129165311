namespace EventReview.Core.Evidence.Roles;

/// <summary>
/// What an attached file is for: the input a built-in check reads it as. The stored word of each kind
/// (<see cref="FileRole.Word"/>) is part of an evidence row's seal, so a kind's word never changes.
/// </summary>
public enum FileRoleKind
{
    /// <summary>Not an input of a built-in check (a report, a screenshot, a log extract).</summary>
    Other,

    /// <summary>Strain of one site: text "gps_time value" per line, or HDF5.</summary>
    Strain,

    /// <summary>Data-quality segments: CSV site,flag,start_gps,end_gps[,comment].</summary>
    DataQualitySegments,

    /// <summary>Auxiliary and environmental triggers: CSV site,channel,gps_time,snr[,frequency_hz,duration_s].</summary>
    AuxiliaryTriggers,

    /// <summary>Sensor inventory: CSV site,channel,kind,location[,coupling_file,data_file].</summary>
    SensorInventory,

    /// <summary>A sensor's coupling function: CSV frequency_hz,coupling.</summary>
    CouplingFunction,

    /// <summary>A sensor's own time series: text "gps_time value" per line, in the sensor's unit.</summary>
    SensorSeries,

    /// <summary>Hardware-injection log: CSV site,start_gps,end_gps,kind,waveform_ref,status.</summary>
    InjectionLog,

    /// <summary>A sealed blind-injection record revealed by its holders (same layout as the injection log).</summary>
    BlindInjectionRecord,

    /// <summary>One site's search triggers for the time-slide background: CSV gps_time,snr[,chirp_mass].</summary>
    SearchTriggers,

    /// <summary>One site's analysed time for the time-slide background: CSV start_gps,end_gps.</summary>
    AnalysedTime,

    /// <summary>Recorded input of a data-chain stage: text "gps_time value" per line.</summary>
    StageInput,

    /// <summary>Recorded output of a data-chain stage: text "gps_time value" per line.</summary>
    StageOutput,

    /// <summary>Data-chain stage models: JSON {"stages": [...]}.</summary>
    StageModel,

    /// <summary>A configuration snapshot: "key = value" lines or JSON.</summary>
    Configuration,
}
