using EventReview.Core.Plots;

namespace EventReview.Core.Tests.Plots;

public class EqualAreaProjectionTests
{
    [Fact]
    public void Mollweide_matches_the_PROJ_reference_value()
    {
        // PROJ test suite, test/gie/builtins.gie, "operation +proj=moll +a=6400000": accept 2 1 (lon 2°, lat 1°),
        // expect 201113.698641813 124066.283433860 (metres on a sphere of radius 6 400 000 m), tolerance 0.1 mm.
        const double r = 6400000;
        var (x, y) = EqualAreaProjection.Mollweide(double.DegreesToRadians(2), double.DegreesToRadians(1));
        Assert.Equal(201113.698641813, x * r, 1e-4);
        Assert.Equal(124066.283433860, y * r, 1e-4);
    }

    [Theory]
    [InlineData(0.3, 0.2)]
    [InlineData(-2.5, 1.1)]
    [InlineData(3.0, -1.4)]
    [InlineData(1.0, 0.0)]
    public void Both_projections_are_equal_area(double lambda, double phi)
    {
        // Equal area on the unit sphere: the Jacobian |d(x,y)/d(λ,φ)| equals cos φ (the sphere's area element),
        // Snyder 1987 p. 24 (from memory); checked by central differences.
        foreach (var project in new Func<double, double, (double X, double Y)>[] { EqualAreaProjection.Mollweide, EqualAreaProjection.Hammer })
        {
            const double h = 1e-6;
            var (xl1, yl1) = project(lambda + h, phi);
            var (xl0, yl0) = project(lambda - h, phi);
            var (xp1, yp1) = project(lambda, phi + h);
            var (xp0, yp0) = project(lambda, phi - h);
            double j = (((xl1 - xl0) * (yp1 - yp0)) - ((xp1 - xp0) * (yl1 - yl0))) / (4 * h * h);
            Assert.Equal(Math.Cos(phi), Math.Abs(j), 1e-5);
        }
    }

    [Fact]
    public void The_whole_sphere_fills_the_two_to_one_ellipse()
    {
        double s2 = Math.Sqrt(2);
        var (x, _) = EqualAreaProjection.Mollweide(Math.PI, 0);
        Assert.Equal(2 * s2, x, 1e-12);
        Assert.Equal(s2, EqualAreaProjection.Mollweide(0, Math.PI / 2).Y, 1e-9);
        Assert.Equal(2 * s2, EqualAreaProjection.Hammer(Math.PI, 0).X, 1e-12);
        Assert.Equal(s2, EqualAreaProjection.Hammer(0, Math.PI / 2).Y, 1e-12);
    }
}
