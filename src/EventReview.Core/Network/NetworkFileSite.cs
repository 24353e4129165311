namespace EventReview.Core.Network;

/// <summary>One site as written in a network file (camelCase JSON). Nullable so that a missing field can be named in the error.</summary>
public sealed record NetworkFileSite(
    string? Code,
    string? Name,
    double? LatitudeDegrees,
    double? LongitudeDegrees,
    double? HeightMeters,
    double? XArmAzimuthDegrees,
    double? YArmAzimuthDegrees,
    double? TimingUncertaintySeconds);
