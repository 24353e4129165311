using EventReview.Core.Geodesy;
using EventReview.Core.Network;

namespace EventReview.Core.Tests.Geodesy;

public class DetectorTensorTests
{
    [Fact]
    public void Arms_along_x_and_y_give_diag_half_minus_half_zero()
    {
        var d = DetectorTensor.FromArms(new Vector3(1, 0, 0), new Vector3(0, 1, 0));

        // D = (x xᵀ - y yᵀ)/2 (Schutz 2011).
        Assert.Equal(0.5, d[0, 0], 1e-15);
        Assert.Equal(-0.5, d[1, 1], 1e-15);
        Assert.Equal(0.0, d[2, 2], 1e-15);
        Assert.Equal(0.0, d[0, 1], 1e-15);
    }

    [Fact]
    public void Site_arms_are_horizontal_unit_vectors_at_their_azimuths_and_the_tensor_is_traceless()
    {
        var site = new Site("TQ", "Site TQ", 30, 60, 0, 45, 135, 1e-4);
        var frame = SiteGeometry.Frame(site);
        var x = SiteGeometry.XArm(site);

        Assert.Equal(1.0, x.Length, 1e-12);
        Assert.Equal(0.0, Vector3.Dot(x, frame.Up), 1e-12);
        Assert.Equal(Math.Sqrt(0.5), Vector3.Dot(x, frame.North), 1e-12);
        Assert.Equal(Math.Sqrt(0.5), Vector3.Dot(x, frame.East), 1e-12);
        var d = SiteGeometry.Tensor(site);
        Assert.Equal(0.0, d[0, 0] + d[1, 1] + d[2, 2], 1e-12);
    }

    [Fact]
    public void A_tilted_arm_rises_above_the_horizontal()
    {
        var frame = LocalFrame.At(10, 20);
        var arm = frame.Direction(0, 1.0);

        Assert.Equal(Math.Sin(double.DegreesToRadians(1.0)), Vector3.Dot(arm, frame.Up), 1e-12);
        Assert.True((Vector3.Cross(frame.East, frame.North) - frame.Up).Length < 1e-15);
    }
}
