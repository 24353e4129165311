namespace EventReview.Core.Dossier;

/// <summary>A network site as defined when the dossier was built (degrees; azimuths clockwise from north; metres; seconds).</summary>
public sealed record DossierSite(
    string Code,
    string Name,
    double LatitudeDegrees,
    double LongitudeDegrees,
    double HeightMeters,
    double XArmAzimuthDegrees,
    double YArmAzimuthDegrees,
    double TimingUncertaintySeconds);
