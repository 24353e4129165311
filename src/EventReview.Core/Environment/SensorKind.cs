namespace EventReview.Core.Environment;

/// <summary>What a sensor or auxiliary channel measures; lookup windows can differ per kind.</summary>
public enum SensorKind
{
    /// <summary>Ground motion (seismometers, accelerometers).</summary>
    Seismic,

    /// <summary>Sound (microphones).</summary>
    Acoustic,

    /// <summary>Magnetic field (magnetometers).</summary>
    Magnetic,

    /// <summary>Radio-frequency receivers.</summary>
    Radio,

    /// <summary>Wind and weather stations.</summary>
    Weather,

    /// <summary>Mains power monitors.</summary>
    Power,

    /// <summary>The instrument's own auxiliary channels.</summary>
    Instrument,

    /// <summary>Anything else, and channels missing from the inventory.</summary>
    Other,
}
