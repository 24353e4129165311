using EventReview.Core.Signal;
using EventReview.Core.Signal.Simulation;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Signal;

/// <summary>Test data builder: two invented sites seeing one simulated chirp.</summary>
internal static class SimulatedPair
{
    public static readonly GpsTime Start = GpsTime.FromSeconds(1300000000m);

    /// <summary>Search limit of the pair's lag: its delay plus a few milliseconds of timing tolerance (invented geometry), seconds.</summary>
    public const double MaxLagSeconds = 0.018;

    public static readonly SiteProjection[] Sites =
    [
        new("KX", 0.0, 0.8, 0.1),
        new("MV", 0.0124, -0.6, -0.075),
    ];

    public static SimulationResult Make(int seed, double snr = 30, double chirpMass = 8, double duration = 16, double fs = 4096) =>
        NetworkSimulator.Simulate(Sites, new SimulationOptions(
            Start, duration, fs, seed, new ChirpParameters(chirpMass, InclinationRad: 0.3), null, snr));

    public static GpsTime Coalescence(double duration = 16) => Start.AddSeconds(duration / 2);

    public static TimeSeries A(SimulationResult r) => r.Sites[0].Strain;

    public static TimeSeries B(SimulationResult r) => r.Sites[1].Strain;
}
