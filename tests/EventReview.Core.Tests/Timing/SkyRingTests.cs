using EventReview.Core.Geodesy;
using EventReview.Core.Timing;

namespace EventReview.Core.Tests.Timing;

public class SkyRingTests
{
    private static readonly Vector3 R1 = Vector3.Zero;
    private static readonly Vector3 R2 = new(3_000_000, 0, 0);

    [Fact]
    public void Five_ms_over_3000_km_opens_the_ring_at_60_022882_degrees_from_minus_x()
    {
        // ref (CHECKS.md, cos θ = c Δt / d about r1 - r2 = -x).
        Assert.Equal(60.022882, SkyRing.AngleDegrees(R1, R2, 5e-3)!.Value, 1e-6);
    }

    [Fact]
    public void Minus_3_ms_over_3000_km_opens_the_ring_at_107_445138_degrees()
    {
        // ref (CHECKS.md).
        Assert.Equal(107.445138, SkyRing.AngleDegrees(R1, R2, -3e-3)!.Value, 1e-6);
    }

    [Fact]
    public void A_difference_beyond_the_light_travel_time_has_no_ring_rather_than_nan()
    {
        Assert.Null(SkyRing.AngleDegrees(R1, R2, 10.5e-3));
    }

    [Fact]
    public void Ring_directions_are_unit_vectors_at_the_ring_angle()
    {
        var axis = R1 - R2;
        var cos = Math.Cos(double.DegreesToRadians(60.022882));
        foreach (var n in SkyRing.Directions(axis, cos, 36))
        {
            Assert.Equal(1.0, n.Length, 1e-12);
            Assert.Equal(cos, Vector3.Dot(n, axis.Normalized()), 1e-12);
        }
    }
}
