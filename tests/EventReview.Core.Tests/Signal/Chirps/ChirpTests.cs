using EventReview.Core.Signal.Chirps;

namespace EventReview.Core.Tests.Signal.Chirps;

public class ChirpTests
{
    [Fact]
    public void Chirp_masses_match_the_reference_values()
    {
        // ref (CHECKS.md "Chirp" rows, formula of Peters and Mathews 1963)
        Assert.Equal(1.2187707886, Chirp.ChirpMass(1.4, 1.4), 1e-9);
        Assert.Equal(14.6507802579, Chirp.ChirpMass(30, 10), 1e-9);
    }

    [Theory]
    [InlineData(1.2187707886, 100, 17.36414853, 2.159622162)]
    [InlineData(30, 50, 284.8014559, 0.06583533761)]
    public void Frequency_derivative_and_time_to_coalescence_match_the_reference_values(double mc, double f, double dfdt, double tau)
    {
        // ref (CHECKS.md "Chirp" rows), 1e-6 relative
        Assert.Equal(dfdt, Chirp.FrequencyDerivative(mc, f), dfdt * 1e-6);
        Assert.Equal(tau, Chirp.TimeToCoalescence(mc, f), tau * 1e-6);
    }

    [Fact]
    public void Frequency_at_time_to_coalescence_inverts_and_the_slope_gives_the_mass_back()
    {
        double tau = Chirp.TimeToCoalescence(14.65, 60);
        // identity: f(tau(f)) = f
        Assert.Equal(60, Chirp.FrequencyAt(14.65, tau), 1e-9);
        // identity: slope of f^(-8/3) between two times gives the mass back
        double t1 = -1.0, t2 = -0.2;
        double slope = (Math.Pow(Chirp.FrequencyAt(14.65, -t2), -8.0 / 3) - Math.Pow(Chirp.FrequencyAt(14.65, -t1), -8.0 / 3)) / (t2 - t1);
        Assert.Equal(14.65, Chirp.ChirpMassFromSlope(slope), 1e-9);
    }
}
