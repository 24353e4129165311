namespace EventReview.Core.Signal.Chirps;

/// <summary>
/// Leading-order (Newtonian) inspiral relations. Masses in solar masses, frequencies are gravitational-wave frequencies
/// in Hz (twice the orbital frequency), times in seconds. G Mc / c³ = Mc · <see cref="SolarMassSeconds"/>.
/// </summary>
// Peters and Mathews, Phys. Rev. 131 (1963) 435; frequency evolution as in Cutler and Flanagan, Phys. Rev. D 49 (1994) 2658, eq. 2.
public static class Chirp
{
    /// <summary>G M_sun / c³ in seconds (IAU 2015 B3 nominal GM_sun and exact c): 4.925490947641e-6 s.</summary>
    public const double SolarMassSeconds = 4.925490947641e-6;

    /// <summary>Chirp mass (m1 m2)^{3/5} / (m1 + m2)^{1/5} in the unit of the inputs (solar masses).</summary>
    /// <exception cref="ArgumentOutOfRangeException">When a mass is not positive.</exception>
    public static double ChirpMass(double m1, double m2)
    {
        if (!(m1 > 0) || !(m2 > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(m1), m1, "Component masses must be positive (solar masses).");
        }

        return Math.Pow(m1 * m2, 0.6) / Math.Pow(m1 + m2, 0.2);
    }

    /// <summary>df/dt = (96/5) π^{8/3} (G Mc/c³)^{5/3} f^{11/3} in Hz/s.</summary>
    public static double FrequencyDerivative(double chirpMassMsun, double frequencyHz)
    {
        double m = chirpMassMsun * SolarMassSeconds;
        return 96.0 / 5 * Math.Pow(Math.PI, 8.0 / 3) * Math.Pow(m, 5.0 / 3) * Math.Pow(frequencyHz, 11.0 / 3);
    }

    /// <summary>Time to coalescence τ = (5/256) (G Mc/c³)^{−5/3} (π f)^{−8/3} in seconds.</summary>
    public static double TimeToCoalescence(double chirpMassMsun, double frequencyHz)
    {
        double m = chirpMassMsun * SolarMassSeconds;
        return 5.0 / 256 * Math.Pow(m, -5.0 / 3) * Math.Pow(Math.PI * frequencyHz, -8.0 / 3);
    }

    /// <summary>Frequency τ seconds before coalescence: f = (1/8π) (5/τ)^{3/8} (G Mc/c³)^{−5/8}, Hz (infinite at τ ≤ 0).</summary>
    public static double FrequencyAt(double chirpMassMsun, double tauSeconds)
    {
        if (tauSeconds <= 0)
        {
            return double.PositiveInfinity;
        }

        double m = chirpMassMsun * SolarMassSeconds;
        return Math.Pow(5 / tauSeconds, 3.0 / 8) * Math.Pow(m, -5.0 / 8) / (8 * Math.PI);
    }

    /// <summary>Gravitational-wave phase τ seconds before coalescence relative to the coalescence phase: −2 (τ / (5 G Mc/c³))^{5/8} rad.</summary>
    public static double PhaseAt(double chirpMassMsun, double tauSeconds)
    {
        double m = chirpMassMsun * SolarMassSeconds;
        return -2 * Math.Pow(Math.Max(tauSeconds, 0) / (5 * m), 5.0 / 8);
    }

    /// <summary>
    /// Chirp mass (solar masses) from the slope of f^{−8/3} against time: f^{−8/3} = (8π)^{8/3} (G Mc/c³)^{5/3} (tc − t) / 5,
    /// so slope = −(8π)^{8/3} (G Mc/c³)^{5/3} / 5 (in Hz^{−8/3} per second; must be negative).
    /// </summary>
    public static double ChirpMassFromSlope(double slope)
    {
        if (!(slope < 0))
        {
            return double.NaN;
        }

        return Math.Pow(-5 * slope / Math.Pow(8 * Math.PI, 8.0 / 3), 3.0 / 5) / SolarMassSeconds;
    }

    /// <summary>Gravitational-wave frequency at the innermost stable circular orbit of an equal-mass binary with this chirp mass, Hz.</summary>
    public static double EqualMassIscoFrequency(double chirpMassMsun)
    {
        double totalMsun = chirpMassMsun * Math.Pow(2, 6.0 / 5);
        return 1 / (Math.Pow(6, 1.5) * Math.PI * totalMsun * SolarMassSeconds);
    }
}
