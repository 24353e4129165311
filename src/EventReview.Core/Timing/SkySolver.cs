using EventReview.Core.Geodesy;
using MathNet.Numerics.LinearAlgebra;

namespace EventReview.Core.Timing;

/// <summary>
/// Source directions from arrival times at three or more sites, for a plane wave: t_i = t0 - n·r_i/c with n the unit vector toward
/// the source. The residual of a direction is the RMS over sites of t_i - (t0 - n·r_i/c) with t0 fitted (seconds).
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
    public static SkyFit Solve(IReadOnlyList<Vector3> positionsMeters, IReadOnlyList<double> arrivalSeconds)
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

        if (positionsMeters.Count == 3 && TryThreeSites(positionsMeters, arrivalSeconds, out var exact))
        {
            return exact;
        }

        return LeastSquares(positionsMeters, arrivalSeconds);
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

    private static bool TryThreeSites(IReadOnlyList<Vector3> r, IReadOnlyList<double> t, out SkyFit fit)
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
        fit = Ordered(r, t, [n0 + (s * m), n0 - (s * m)], true);
        return true;
    }

    private static SkyFit LeastSquares(IReadOnlyList<Vector3> r, IReadOnlyList<double> t)
    {
        var c = PhysicalConstants.SpeedOfLightMetersPerSecond;
        var count = r.Count;
        var meanR = new Vector3(r.Average(p => p.X), r.Average(p => p.Y), r.Average(p => p.Z));
        var meanT = t.Average();
        var m = new double[3, 3];
        var v = new double[3];
        for (var i = 0; i < count; i++)
        {
            var rho = (r[i] - meanR) / c;
            double[] q = [rho.X, rho.Y, rho.Z];
            var tau = t[i] - meanT;
            for (var a = 0; a < 3; a++)
            {
                v[a] += tau * q[a];
                for (var b = 0; b < 3; b++)
                {
                    m[a, b] += q[a] * q[b];
                }
            }
        }

        // Minimise nᵀMn + 2vᵀn on |n| = 1: (M + λI) n = -v with λ ≥ -μmin (trust-region subproblem).
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
            return Ordered(r, t, [vectors[0], -vectors[0]], true);
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
            return Ordered(r, t, [partial + (s * vectors[0]), partial - (s * vectors[0])], null);
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

        return Ordered(r, t, [n.Normalized()], null);
    }

    private static SkyFit Ordered(IReadOnlyList<Vector3> r, IReadOnlyList<double> t, Vector3[] candidates, bool? exact)
    {
        var solutions = candidates
            .Select(n => n.Normalized())
            .Select(n => new SkyFitDirection(n, Residual(r, t, n)))
            .OrderBy(s => s.ResidualSeconds)
            .ToArray();
        var best = solutions[0].ResidualSeconds;

        // Exact (three crossing rings) or, for a fit, a residual below one nanosecond (the resolution of GPS times).
        return new SkyFit(solutions, exact ?? best <= 1e-9, best);
    }
}
