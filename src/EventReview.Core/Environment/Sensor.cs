namespace EventReview.Core.Environment;

/// <summary>One entry of a site's sensor inventory.</summary>
/// <param name="Site">Upper-case site code.</param>
/// <param name="Channel">Channel name, matched exactly against trigger channel names.</param>
/// <param name="Kind">What the sensor measures.</param>
/// <param name="Location">Where the sensor sits (free text).</param>
/// <param name="CouplingFile">File name of the channel's coupling function, or null.</param>
/// <param name="DataFile">File name of the sensor's own series around the event ("gps_time value" per line), from which its noise
/// amplitude is read for the coupling estimate, or null (then the typed noise amplitude is used).</param>
public sealed record Sensor(string Site, string Channel, SensorKind Kind, string Location, string? CouplingFile, string? DataFile = null);
