using EventReview.Core.Antenna;
using EventReview.Core.Geodesy;

namespace EventReview.Core.Tests.Antenna;

public class AntennaPatternTests
{
    private static readonly double[,] DetectorFrameTensor = DetectorTensor.FromArms(new Vector3(1, 0, 0), new Vector3(0, 1, 0));

    private static AntennaResponse Tensor(double thetaDeg, double phiDeg, double psiDeg)
    {
        var (t, p) = (double.DegreesToRadians(thetaDeg), double.DegreesToRadians(phiDeg));
        var n = new Vector3(Math.Sin(t) * Math.Cos(p), Math.Sin(t) * Math.Sin(p), Math.Cos(t));
        return AntennaPattern.Response(DetectorFrameTensor, n, double.DegreesToRadians(psiDeg));
    }

    [Theory]
    // The standard frame (arms along x and y, ψ from e_θ toward e_φ): F+ = ½(1 + cos²θ) cos 2φ cos 2ψ − cos θ sin 2φ sin 2ψ,
    // F× = ½(1 + cos²θ) cos 2φ sin 2ψ + cos θ sin 2φ cos 2ψ, from memory of Thorne's 1987 review and the usual textbook (Schutz 2011).
    [InlineData(0, 0, 0, 1, 0)] // textbook (from memory)
    [InlineData(0, 0, 45, 0, 1)] // textbook (from memory)
    [InlineData(90, 0, 0, 0.5, 0)] // textbook (from memory)
    [InlineData(90, 45, 0, 0, 0)] // textbook (from memory)
    [InlineData(30, 40, 20, -0.431818881166, 0.751001734531)] // ref: the closed form above evaluated with numpy (CHECKS.md)
    [InlineData(60, 120, 75, 0.487139289629, 0.218750000000)] // ref: same (CHECKS.md)
    public void Tensor_form_matches_the_checks_rows(double theta, double phi, double psi, double fPlus, double fCross)
    {
        var f = Tensor(theta, phi, psi);

        Assert.Equal(fPlus, f.FPlus, 1e-12);
        Assert.Equal(fCross, f.FCross, 1e-12);
    }

    [Theory]
    [InlineData(30, 40, 20, -0.431818881166, 0.751001734531)] // ref (CHECKS.md; Thorne 1987 closed form, from memory)
    [InlineData(60, 120, 75, 0.487139289629, 0.218750000000)] // ref (CHECKS.md)
    [InlineData(0, 0, 45, 0, 1)] // textbook (from memory)
    public void Closed_form_matches_the_checks_rows(double theta, double phi, double psi, double fPlus, double fCross)
    {
        var f = AntennaPattern.DetectorFrame(double.DegreesToRadians(theta), double.DegreesToRadians(phi), double.DegreesToRadians(psi));

        Assert.Equal(fPlus, f.FPlus, 1e-12);
        Assert.Equal(fCross, f.FCross, 1e-12);
    }

    [Fact]
    public void Tensor_and_closed_form_agree_everywhere_and_the_sum_of_squares_ignores_psi()
    {
        var random = new Random(20240611);
        for (var i = 0; i < 500; i++)
        {
            var theta = Math.Acos((2 * random.NextDouble()) - 1);
            var phi = 2 * Math.PI * random.NextDouble();
            var psi = Math.PI * random.NextDouble();
            var tensor = Tensor(double.RadiansToDegrees(theta), double.RadiansToDegrees(phi), double.RadiansToDegrees(psi));
            var closed = AntennaPattern.DetectorFrame(theta, phi, psi);
            var other = Tensor(double.RadiansToDegrees(theta), double.RadiansToDegrees(phi), 17.0);

            Assert.Equal(closed.FPlus, tensor.FPlus, 1e-12);
            Assert.Equal(closed.FCross, tensor.FCross, 1e-12);

            // Identity: F+² + F×² does not depend on ψ.
            Assert.Equal(tensor.SumOfSquares, other.SumOfSquares, 1e-12);
        }
    }

    [Fact]
    public void Sky_and_polarisation_average_of_each_squared_pattern_is_one_fifth()
    {
        var random = new Random(12345);
        const int samples = 1_000_000;
        double sumPlus = 0, sumCross = 0;
        for (var i = 0; i < samples; i++)
        {
            var cosTheta = (2 * random.NextDouble()) - 1;
            var phi = 2 * Math.PI * random.NextDouble();
            var sinTheta = Math.Sqrt(1 - (cosTheta * cosTheta));
            var n = new Vector3(sinTheta * Math.Cos(phi), sinTheta * Math.Sin(phi), cosTheta);
            var f = AntennaPattern.Response(DetectorFrameTensor, n, Math.PI * random.NextDouble());
            sumPlus += f.FPlus * f.FPlus;
            sumCross += f.FCross * f.FCross;
        }

        // Textbook: <F+²> = <F×²> = 1/5, sum 2/5 (Monte Carlo, tolerance 1e-3 from CHECKS.md).
        Assert.Equal(0.2, sumPlus / samples, 1e-3);
        Assert.Equal(0.2, sumCross / samples, 1e-3);
        Assert.Equal(0.4, (sumPlus + sumCross) / samples, 1e-3);
    }

    [Fact]
    public void Rotating_the_polarisation_matches_a_direct_evaluation()
    {
        var f0 = Tensor(50, 200, 10);
        var rotated = f0.RotatePolarisation(double.DegreesToRadians(35));
        var direct = Tensor(50, 200, 45);

        Assert.Equal(direct.FPlus, rotated.FPlus, 1e-12);
        Assert.Equal(direct.FCross, rotated.FCross, 1e-12);
    }
}
