namespace EventReview.Core.Network;

/// <summary>
/// One detector site of the network. Angles in degrees; azimuths clockwise from true north;
/// height above the WGS-84 ellipsoid in metres; timing uncertainty (one sigma) in seconds.
/// </summary>
public sealed class Site
{
    private Site()
    {
        Code = string.Empty;
        Name = string.Empty;
    }

    /// <summary>Creates a validated site.</summary>
    /// <exception cref="ArgumentOutOfRangeException">When a value is out of its range (named in the message).</exception>
    public Site(string code, string name, double latitudeDegrees, double longitudeDegrees, double heightMeters,
        double xArmAzimuthDegrees, double yArmAzimuthDegrees, double timingUncertaintySeconds)
    {
        Code = string.Empty;
        Name = string.Empty;
        Update(code, name, latitudeDegrees, longitudeDegrees, heightMeters, xArmAzimuthDegrees, yArmAzimuthDegrees, timingUncertaintySeconds);
    }

    /// <summary>Database key of the site.</summary>
    public int Id { get; private set; }

    /// <summary>Short unique code, 1-8 letters or digits, upper case (e.g. "KX").</summary>
    public string Code { get; private set; }

    /// <summary>The site's name, for people.</summary>
    public string Name { get; private set; }

    /// <summary>Geodetic latitude, degrees north, in [-90, 90].</summary>
    public double LatitudeDegrees { get; private set; }

    /// <summary>Geodetic longitude, degrees east, in [-180, 180].</summary>
    public double LongitudeDegrees { get; private set; }

    /// <summary>Height above the WGS-84 ellipsoid, metres.</summary>
    public double HeightMeters { get; private set; }

    /// <summary>Azimuth of the x arm, degrees clockwise from true north, in [0, 360).</summary>
    public double XArmAzimuthDegrees { get; private set; }

    /// <summary>Azimuth of the y arm, degrees clockwise from true north, in [0, 360).</summary>
    public double YArmAzimuthDegrees { get; private set; }

    /// <summary>One-sigma timing uncertainty of the site's arrival times, seconds (&gt; 0).</summary>
    public double TimingUncertaintySeconds { get; private set; }

    /// <summary>Replaces every field after validating them all; nothing changes when one is invalid.</summary>
    public void Update(string code, string name, double latitudeDegrees, double longitudeDegrees, double heightMeters,
        double xArmAzimuthDegrees, double yArmAzimuthDegrees, double timingUncertaintySeconds)
    {
        code = (code ?? string.Empty).Trim().ToUpperInvariant();
        if (code.Length is < 1 or > 8 || !code.All(char.IsAsciiLetterOrDigit))
        {
            throw new ArgumentOutOfRangeException(nameof(code), code, "Site code must be 1-8 letters or digits.");
        }

        if (string.IsNullOrWhiteSpace(name))
        {
            throw new ArgumentOutOfRangeException(nameof(name), name, "Site name must not be empty.");
        }

        name = Inputs.InputGuard.Identifier(name, Inputs.InputLimits.MaxNameLength, nameof(name));

        Check(latitudeDegrees, -90, 90, nameof(latitudeDegrees), "Latitude must be within [-90, 90] degrees.");
        Check(longitudeDegrees, -180, 180, nameof(longitudeDegrees), "Longitude must be within [-180, 180] degrees.");
        Check(heightMeters, -12_000, 10_000, nameof(heightMeters), "Height must be within [-12000, 10000] m of the ellipsoid.");
        if (!double.IsFinite(xArmAzimuthDegrees) || xArmAzimuthDegrees < 0 || xArmAzimuthDegrees >= 360)
        {
            throw new ArgumentOutOfRangeException(nameof(xArmAzimuthDegrees), xArmAzimuthDegrees, "x-arm azimuth must be within [0, 360) degrees.");
        }

        if (!double.IsFinite(yArmAzimuthDegrees) || yArmAzimuthDegrees < 0 || yArmAzimuthDegrees >= 360)
        {
            throw new ArgumentOutOfRangeException(nameof(yArmAzimuthDegrees), yArmAzimuthDegrees, "y-arm azimuth must be within [0, 360) degrees.");
        }

        if (!double.IsFinite(timingUncertaintySeconds) || timingUncertaintySeconds <= 0 || timingUncertaintySeconds > 1)
        {
            throw new ArgumentOutOfRangeException(nameof(timingUncertaintySeconds), timingUncertaintySeconds, "Timing uncertainty must be > 0 s and at most 1 s.");
        }

        Code = code;
        Name = name.Trim();
        LatitudeDegrees = latitudeDegrees;
        LongitudeDegrees = longitudeDegrees;
        HeightMeters = heightMeters;
        XArmAzimuthDegrees = xArmAzimuthDegrees;
        YArmAzimuthDegrees = yArmAzimuthDegrees;
        TimingUncertaintySeconds = timingUncertaintySeconds;
    }

    private static void Check(double value, double min, double max, string name, string message)
    {
        if (!double.IsFinite(value) || value < min || value > max)
        {
            throw new ArgumentOutOfRangeException(name, value, message);
        }
    }
}
