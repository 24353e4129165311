namespace EventReview.Core.Signal.Simulation;

/// <summary>
/// An invented, smooth amplitude spectral density for simulated detectors (strain/√Hz):
/// ASD(f) = Floor · sqrt((Seismic/f)^16 + (Thermal/f)^2 · 2 + 1 + (f/Shot)^2), with f clamped to at least 5 Hz.
/// Not a model of any real instrument; it only has the usual "bucket" shape.
/// </summary>
/// <param name="FloorPerRtHz">Bucket level in strain/√Hz (default 4e-24).</param>
/// <param name="SeismicKneeHz">Frequency below which the steep low-frequency wall dominates (default 15).</param>
/// <param name="ThermalKneeHz">Frequency below which the gentle 1/f rise dominates (default 60).</param>
/// <param name="ShotKneeHz">Frequency above which the high-frequency rise dominates (default 300).</param>
public sealed record AsdShape(double FloorPerRtHz = 4e-24, double SeismicKneeHz = 15, double ThermalKneeHz = 60, double ShotKneeHz = 300)
{
    /// <summary>ASD at <paramref name="frequencyHz"/> in strain/√Hz.</summary>
    public double Evaluate(double frequencyHz)
    {
        double f = Math.Max(frequencyHz, 5);
        double seismic = Math.Pow(SeismicKneeHz / f, 16);
        double thermal = 2 * Math.Pow(ThermalKneeHz / f, 2);
        double shot = Math.Pow(f / ShotKneeHz, 2);
        return FloorPerRtHz * Math.Sqrt(seismic + thermal + 1 + shot);
    }
}
