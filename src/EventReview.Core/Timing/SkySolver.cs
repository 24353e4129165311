using EventReview.Core.Geodesy;
using MathNet.Numerics.LinearAlgebra;

namespace EventReview.Core.Timing;

/// <summary>
/// Source directions from arrival times at three or more sites, for a plane wave: t_i = t0 - n·r_i/c with n the unit vector toward
/// the source. The residual of a direction is the RMS over sites of t_i - (t0 - n·r_i/c) with t0 fitted (seconds); its chi-square
/// is Σ ((t_i - t0 + n·r_i/c) / σ_i)² with t0 the σ-weighted fit (dimensionless).
/// </summary>
public static class SkySolver
{
    /// <summary>
    /// Three sites: the two exact solutions n0 ± s m (mirror images through the plane of the sites) when the rings meet; otherwise the
    /// single direction of least residual. Four or more: the least-squares direction on the unit sphere (global minimum of the
    /// residual, found exactly as a trust-region subproblem via the eigen-decomposition of the 3×3 normal matrix; Moré and Sorensen
    /// 1983), or two mirror solutions when the sites are coplanar and the fit is degenerate.
    /// </summary>
    /// <param name="positionsMeters">ECEF site positions, metres.</param>
    /// <param name="arrivalSeconds">Arrival times in seconds from any common reference, same order.</param>
    /// <exception cref="ArgumentException">Fewer than three sites, lengths differ, or a value is not finite.</exception>
    public static SkyFit Solve(IReadOnlyList<Vector3> positionsMeters, IReadOnlyList<double> arrivalSeconds) =>
        Solve(positionsMeters, arrivalSeconds, null);

    /// <summary>
    /// As <see cref="Solve(IReadOnlyList{Vector3}, IReadOnlyList{double})"/>, with each arrival weighted by 1/σ_i² in the
    /// least-squares fit (the fit that minimises the chi-square). Null sigmas weigh every site equally (σ = 1 s).
    /// </summary>
    /// <param name="positionsMeters">ECEF site positions, metres.</param>
    /// <param name="arrivalSeconds">Arrival times in seconds from any common reference, same order.</param>
    /// <param name="sigmasSeconds">One-sigma timing uncertainty of each site, seconds (&gt; 0), same order; or null.</param>
    /// <exception cref="ArgumentException">Fewer than three sites, lengths differ, a value is not finite or a sigma is not positive.</exception>
    public static SkyFit Solve(IReadOnlyList<Vector3> positionsMeters, IReadOnlyList<double> arrivalSeconds, IReadOnlyList<double>? sigmasSeconds)
    {
        ArgumentNullException.ThrowIfNull(positionsMeters);
        ArgumentNullException.ThrowIfNull(arrivalSeconds);
        if (positionsMeters.Count != arrivalSeconds.Count || positionsMeters.Count < 3)
        {
            throw new ArgumentException("Need the same number (at least three) of positions and arrival times.", nameof(positionsMeters));
        }

        if (positionsMeters.Any(p => !p.IsFinite) || arrivalSeconds.Any(t => !double.IsFinite(t)))
        {
            throw new ArgumentException("Positions and arrival times must be finite.", nameof(arrivalSeconds));
        }

        var sigmas = sigmasSeconds ?? Enumerable.Repeat(1.0, positionsMeters.Count).ToArray();
        if (sigmas.Count != positionsMeters.Count || sigmas.Any(s => !(s > 0) || !double.IsFinite(s)))
        {
            throw new ArgumentException("Need one finite, positive timing uncertainty (seconds) per site.", nameof(sigmasSeconds));
        }

        if (positionsMeters.Count == 3 && TryThreeSites(positionsMeters, arrivalSeconds, sigmas, out var exact))
        {
            return exact;
        }

        return LeastSquares(positionsMeters, arrivalSeconds, sigmas);
    }

    /// <summary>RMS arrival-time residual (seconds) of direction n, with the geocentre time t0 fitted.</summary>
    public static double Residual(IReadOnlyList<Vector3> positionsMeters, IReadOnlyList<double> arrivalSeconds, Vector3 direction)
    {
        var c = PhysicalConstants.SpeedOfLightMetersPerSecond;
        var t0 = new double[positionsMeters.Count];
        for (var i = 0; i < t0.Length; i++)
        {
            t0[i] = arrivalSeconds[i] + (Vector3.Dot(direction, positionsMeters[i]) / c);
        }

        var mean = t0.Average();
        return Math.Sqrt(t0.Sum(x => (x - mean) * (x - mean)) / t0.Length);
    }

    /// <summary>
    /// Chi-square of direction n: Σ ((t_i - t0 + n·r_i/c) / σ_i)² with the geocentre time t0 fitted with weights 1/σ_i²
    /// (dimensionless). Times and sigmas in seconds, positions in metres.
    /// </summary>
    public static double ChiSquare(IReadOnlyList<Vector3> positionsMeters, IReadOnlyList<double> arrivalSeconds, IReadOnlyList<double> sigmasSeconds, Vector3 direction)
    {
        ArgumentNullException.ThrowIfNull(positionsMeters);
        ArgumentNullException.ThrowIfNull(arrivalSeconds);
        ArgumentNullException.ThrowIfNull(sigmasSeconds);
        var c = PhysicalConstants.SpeedOfLightMetersPerSecond;
        double sw = 0, swt = 0;
        var t0 = new double[positionsMeters.Count];
        for (var i = 0; i < t0.Length; i++)
        {
            var w = 1 / (sigmasSeconds[i] * sigmasSeconds[i]);
            t0[i] = arrivalSeconds[i] + (Vector3.Dot(direction, positionsMeters[i]) / c);
            sw += w;
            swt += w * t0[i];
        }

        var mean = swt / sw;
        double chi2 = 0;
        for (var i = 0; i < t0.Length; i++)
        {
            var z = (t0[i] - mean) / sigmasSeconds[i];
            chi2 += z * z;
        }

        return chi2;
    }

    private static bool TryThreeSites(IReadOnlyList<Vector3> r, IReadOnlyList<double> t, IReadOnlyList<double> sigmas, out SkyFit fit)
    {
        var c = PhysicalConstants.SpeedOfLightMetersPerSecond;
        var b2 = r[0] - r[1];
        var b3 = r[0] - r[2];
        var c2 = c * (t[1] - t[0]);
        var c3 = c * (t[2] - t[0]);
        var g11 = Vector3.Dot(b2, b2);
        var g12 = Vector3.Dot(b2, b3);
        var g22 = Vector3.Dot(b3, b3);
        var det = (g11 * g22) - (g12 * g12);
        fit = null!;
        if (det <= 1e-12 * g11 * g22)
        {
            return false;
        }

        var alpha = ((c2 * g22) - (c3 * g12)) / det;
        var beta = ((c3 * g11) - (c2 * g12)) / det;
        var n0 = (alpha * b2) + (beta * b3);
        var s2 = 1 - Vector3.Dot(n0, n0);
        if (s2 < 0)
        {
            return false;
        }

        var m = Vector3.Cross(b2, b3).Normalized();
        var s = Math.Sqrt(s2);
        fit = Ordered(r, t, sigmas, [n0 + (s * m), n0 - (s * m)], true);
        return true;
    }

    private static SkyFit LeastSquares(IReadOnlyList<Vector3> r, IReadOnlyList<double> t, IReadOnlyList<double> sigmas)
    {
        var c = PhysicalConstants.SpeedOfLightMetersPerSecond;
        var count = r.Count;
        var weights = sigmas.Select(s => 1 / (s * s)).ToArray();
        var sw = weights.Sum();
        var meanR = Vector3.Zero;
        var meanT = 0.0;
        for (var i = 0; i < count; i++)
        {
            meanR += weights[i] / sw * r[i];
            meanT += weights[i] / sw * t[i];
        }

        var m = new double[3, 3];
        var v = new double[3];
        for (var i = 0; i < count; i++)
        {
            var rho = (r[i] - meanR) / c;
            double[] q = [rho.X, rho.Y, rho.Z];
            var tau = t[i] - meanT;
            for (var a = 0; a < 3; a++)
            {
                v[a] += weights[i] * tau * q[a];
                for (var b = 0; b < 3; b++)
                {
                    m[a, b] += weights[i] * q[a] * q[b];
                }
            }
        }

        // Minimise nᵀMn + 2vᵀn on |n| = 1 (the chi-square with t0 fitted): (M + λI) n = -v with λ ≥ -μmin (trust-region subproblem).
        var evd = Matrix<double>.Build.DenseOfArray(m).Evd(Symmetricity.Symmetric);
        var order = Enumerable.Range(0, 3).OrderBy(k => evd.EigenValues[k].Real).ToArray();
        var mu = order.Select(k => evd.EigenValues[k].Real).ToArray();
        var vectors = order.Select(k => new Vector3(evd.EigenVectors[0, k], evd.EigenVectors[1, k], evd.EigenVectors[2, k])).ToArray();
        var vv = new Vector3(v[0], v[1], v[2]);
        var w = vectors.Select(q => Vector3.Dot(q, vv)).ToArray();
        var wNorm = Math.Sqrt(w.Sum(x => x * x));
        if (wNorm == 0)
        {
            // All arrivals simultaneous with no geometry to fit: the plane-normal directions fit exactly.
            return Ordered(r, t, sigmas, [vectors[0], -vectors[0]], true);
        }

        var scale = mu[2] > 0 ? mu[2] : 1;
        var partial = Vector3.Zero;
        for (var k = 1; k < 3; k++)
        {
            var gap = mu[k] - mu[0];
            partial = gap > 1e-14 * scale ? partial - (w[k] / gap * vectors[k]) : partial;
        }

        var partialSq = Vector3.Dot(partial, partial);
        if (Math.Abs(w[0]) <= 1e-9 * wNorm && partialSq <= 1)
        {
            var s = Math.Sqrt(1 - partialSq);
            return Ordered(r, t, sigmas, [partial + (s * vectors[0]), partial - (s * vectors[0])], null);
        }

        double lo = -mu[0], hi = -mu[0] + wNorm;
        for (var iter = 0; iter < 400; iter++)
        {
            var mid = 0.5 * (lo + hi);
            if (mid <= lo || mid >= hi)
            {
                break;
            }

            var phi = -1.0;
            for (var k = 0; k < 3; k++)
            {
                phi += w[k] * w[k] / ((mu[k] + mid) * (mu[k] + mid));
            }

            if (phi > 0)
            {
                lo = mid;
            }
            else
            {
                hi = mid;
            }
        }

        var n = Vector3.Zero;
        for (var k = 0; k < 3; k++)
        {
            n -= w[k] / (mu[k] + hi) * vectors[k];
        }

        return Ordered(r, t, sigmas, [n.Normalized()], null);
    }

    private static SkyFit Ordered(IReadOnlyList<Vector3> r, IReadOnlyList<double> t, IReadOnlyList<double> sigmas, Vector3[] candidates, bool? exact)
    {
        var solutions = candidates
            .Select(n => n.Normalized())
            .Select(n => new SkyFitDirection(n, Residual(r, t, n), ChiSquare(r, t, sigmas, n)))
            .OrderBy(s => s.ChiSquare)
            .ThenBy(s => s.ResidualSeconds)
            .ToArray();
        var best = solutions[0];

        // Exact (three crossing rings) or, for a fit, a residual below one nanosecond (the resolution of GPS times).
        return new SkyFit(solutions, exact ?? best.ResidualSeconds <= 1e-9, best.ResidualSeconds, best.ChiSquare);
    }
}
