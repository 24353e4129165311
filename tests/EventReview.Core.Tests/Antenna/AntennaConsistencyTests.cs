using EventReview.Core.Antenna;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Timing;

namespace EventReview.Core.Tests.Antenna;

public class AntennaConsistencyTests
{
    private static readonly Site KX = new("KX", "Site KX", 40, -100, 0, 30, 120, 1e-4);
    private static readonly Site KXTwin = new("KA", "Twin of KX", 40, -100, 0, 30, 120, 1e-4);
    private static readonly Site KXSwapped = new("KB", "KX with arms swapped", 40, -100, 0, 120, 30, 1e-4);
    private static readonly Site MV = new("MV", "Site MV", 19, -71, 0, 200, 290, 1e-4);

    private static IReadOnlyList<Vector3> Ring() => SkyRing.Directions(new Vector3(0.3, -0.5, 0.8), 0.2, 72);

    [Fact]
    public void Identical_detectors_always_agree_in_sign_with_ratio_one()
    {
        var same = AntennaConsistency.Evaluate(KX, KXTwin, Ring(), new AntennaObservation(1, 1.0));
        var flipped = AntennaConsistency.Evaluate(KX, KXTwin, Ring(), new AntennaObservation(-1, 1.0));

        Assert.Equal("consistent", same.Verdict);
        Assert.Equal(1.0, same.FractionAllowingSignAndRatio);
        Assert.Equal(1.0, same.MinExpectedRatio, 1e-9);
        Assert.Equal(1.0, same.MaxExpectedRatio, 1e-9);
        Assert.Equal("inconsistent", flipped.Verdict);
        Assert.Equal(0.0, flipped.FractionAllowingSign);
    }

    [Fact]
    public void Swapped_arms_always_flip_the_sign()
    {
        var result = AntennaConsistency.Evaluate(KX, KXSwapped, Ring(), new AntennaObservation(-1, 1.0));

        Assert.Equal(1.0, result.FractionAllowingSignAndRatio);
        Assert.Equal(0.0, AntennaConsistency.Evaluate(KX, KXSwapped, Ring(), new AntennaObservation(1, 1.0)).FractionAllowingSign);
    }

    [Fact]
    public void A_simulated_observation_is_allowed_at_its_own_direction()
    {
        var random = new Random(7);
        for (var trial = 0; trial < 50; trial++)
        {
            var n = SkyRing.Directions(new Vector3(random.NextDouble() - 0.5, random.NextDouble() - 0.5, random.NextDouble() - 0.5), 0, 1)[0];
            var psi = Math.PI * random.NextDouble();
            var cosIota = random.NextDouble();
            var p = NetworkProjection.Project([KX, MV], n, psi);
            var aPlus = 0.5 * (1 + (cosIota * cosIota));
            var za = Math.Sqrt(Math.Pow(p[0].FPlus * aPlus, 2) + Math.Pow(p[0].FCross * cosIota, 2));
            var zb = Math.Sqrt(Math.Pow(p[1].FPlus * aPlus, 2) + Math.Pow(p[1].FCross * cosIota, 2));
            var correlation = (p[0].FPlus * p[1].FPlus * aPlus * aPlus) + (p[0].FCross * p[1].FCross * cosIota * cosIota);
            // Skip near-blind geometries: there the sign is ill-defined and the ψ grid cannot reach ratios near zero.
            if (za < 0.05 || zb / za is < 0.1 or > 10 || Math.Abs(correlation) < 0.05 * za * zb)
            {
                continue;
            }

            var result = AntennaConsistency.Evaluate(KX, MV, [n], new AntennaObservation(Math.Sign(correlation), zb / za));

            Assert.True(result.Verdict == "consistent", $"trial {trial}: psi {psi}, cos iota {cosIota}, ratio {zb / za}, corr {correlation}, sign {result.FractionAllowingSign}, ratio {result.FractionAllowingRatio} range {result.MinExpectedRatio}..{result.MaxExpectedRatio}");
            Assert.InRange(zb / za, result.MinExpectedRatio / 1.3, result.MaxExpectedRatio * 1.3);
        }
    }

    [Fact]
    public void Bad_observations_are_rejected()
    {
        Assert.Throws<ArgumentException>(() => AntennaConsistency.Evaluate(KX, MV, Ring(), new AntennaObservation(0, 1.0)));
        Assert.Throws<ArgumentException>(() => AntennaConsistency.Evaluate(KX, MV, Ring(), new AntennaObservation(1, double.NaN)));
    }

    [Fact]
    public void Allowed_sky_cells_cover_the_whole_sky_for_identical_detectors()
    {
        var cells = AntennaSkyRegion.AllowedCells(KX, KXTwin, new AntennaObservation(1, 1.0), 0, 10);

        Assert.Equal(18 * 36, cells.Count);
    }
}
