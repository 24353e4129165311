namespace EventReview.Core.Plots;

/// <summary>
/// Equal-area projections of the whole sphere for sky and globe maps, on a unit sphere (R = 1), longitude λ and
/// latitude φ in radians, central meridian 0. Formulas from J. P. Snyder, "Map Projections: A Working Manual",
/// USGS Professional Paper 1395 (1987): Mollweide pp. 249–252, Hammer (Hammer-Aitoff) p. 233.
/// </summary>
public static class EqualAreaProjection
{
    /// <summary>
    /// Mollweide: x = (2√2/π) λ cos θ, y = √2 sin θ, with 2θ + sin 2θ = π sin φ solved by Newton's method
    /// (to 1e-12 rad). The ellipse spans x ∈ [−2√2, 2√2], y ∈ [−√2, √2].
    /// </summary>
    public static (double X, double Y) Mollweide(double lambda, double phi)
    {
        double target = Math.PI * Math.Sin(phi);
        double theta = phi;
        if (Math.Abs(Math.Abs(phi) - (Math.PI / 2)) > 1e-12)
        {
            for (int k = 0; k < 50; k++)
            {
                double d = 2 + (2 * Math.Cos(2 * theta));
                if (d < 1e-15)
                {
                    break;
                }

                double step = ((2 * theta) + Math.Sin(2 * theta) - target) / d;
                theta -= step;
                if (Math.Abs(step) < 1e-12)
                {
                    break;
                }
            }
        }

        return (2 * Math.Sqrt(2) / Math.PI * lambda * Math.Cos(theta), Math.Sqrt(2) * Math.Sin(theta));
    }

    /// <summary>
    /// Hammer: x = 2√2 cos φ sin(λ/2) / √(1 + cos φ cos(λ/2)), y = √2 sin φ / √(1 + cos φ cos(λ/2)); the same
    /// ellipse as Mollweide.
    /// </summary>
    public static (double X, double Y) Hammer(double lambda, double phi)
    {
        double d = Math.Sqrt(1 + (Math.Cos(phi) * Math.Cos(lambda / 2)));
        return (2 * Math.Sqrt(2) * Math.Cos(phi) * Math.Sin(lambda / 2) / d, Math.Sqrt(2) * Math.Sin(phi) / d);
    }
}
