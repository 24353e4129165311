using EventReview.Core.Geodesy;

namespace EventReview.Core.Antenna;

/// <summary>
/// Antenna patterns of an L-shaped interferometer: F_A = D_ij e_A^ij with D = (x xᵀ - y yᵀ)/2
/// (Thorne 1987, "300 Years of Gravitation"; Schutz 2011, Class. Quantum Grav. 28 125023).
/// <para>Conventions. n is the unit vector from the detector toward the source (the wave travels along -n).
/// θ, φ are the polar and azimuthal angles of n in the frame of the tensor (for an ECEF tensor: colatitude from
/// the north pole and longitude east, so e_φ points east on the sky, toward increasing RA, and e_θ points south,
/// toward decreasing declination). e_θ = ∂n/∂θ, e_φ = ẑ × n / |ẑ × n|. The polarisation axes are
/// p = cos ψ e_θ + sin ψ e_φ and q = sin ψ e_θ - cos ψ e_φ, and e+ = p pᵀ - q qᵀ, e× = p qᵀ + q pᵀ.
/// With the arms along x and y this gives F+ = 1 at θ = 0, ψ = 0 and F× = 1 at θ = 0, ψ = 45°.
/// At the poles of the frame (sin θ = 0) φ is taken as 0.</para>
/// </summary>
public static class AntennaPattern
{
    /// <summary>F+ and F× of a detector tensor (3×3, any frame) for the source direction n (same frame, any non-zero length) and polarisation angle ψ (radians).</summary>
    public static AntennaResponse Response(double[,] detectorTensor, Vector3 direction, double psiRadians)
    {
        ArgumentNullException.ThrowIfNull(detectorTensor);
        if (detectorTensor.GetLength(0) != 3 || detectorTensor.GetLength(1) != 3)
        {
            throw new ArgumentException("The detector tensor must be 3×3.", nameof(detectorTensor));
        }

        if (!double.IsFinite(psiRadians))
        {
            throw new ArgumentOutOfRangeException(nameof(psiRadians), psiRadians, "Polarisation angle must be finite.");
        }

        var (p, q) = PolarisationAxes(direction, psiRadians);
        double[] pv = [p.X, p.Y, p.Z];
        double[] qv = [q.X, q.Y, q.Z];
        double fPlus = 0, fCross = 0;
        for (var i = 0; i < 3; i++)
        {
            for (var j = 0; j < 3; j++)
            {
                var d = detectorTensor[i, j];
                fPlus += d * ((pv[i] * pv[j]) - (qv[i] * qv[j]));
                fCross += d * ((pv[i] * qv[j]) + (qv[i] * pv[j]));
            }
        }

        return new AntennaResponse(fPlus, fCross);
    }

    /// <summary>The polarisation axes p and q (unit vectors orthogonal to n) for direction n and angle ψ (radians), as defined in the class remarks.</summary>
    public static (Vector3 P, Vector3 Q) PolarisationAxes(Vector3 direction, double psiRadians)
    {
        var n = direction.Normalized();
        var theta = Math.Acos(Math.Clamp(n.Z, -1.0, 1.0));
        var horizontal = Math.Sqrt((n.X * n.X) + (n.Y * n.Y));
        var phi = horizontal > 1e-15 ? Math.Atan2(n.Y, n.X) : 0.0;
        var (sinTheta, cosTheta) = Math.SinCos(theta);
        var (sinPhi, cosPhi) = Math.SinCos(phi);
        var eTheta = new Vector3(cosTheta * cosPhi, cosTheta * sinPhi, -sinTheta);
        var ePhi = new Vector3(-sinPhi, cosPhi, 0);
        var (sinPsi, cosPsi) = Math.SinCos(psiRadians);
        return ((cosPsi * eTheta) + (sinPsi * ePhi), (sinPsi * eTheta) - (cosPsi * ePhi));
    }

    /// <summary>
    /// Closed form in the detector frame (x arm along x, y arm along y, z up), angles in radians:
    /// F+ = ½(1 + cos²θ) cos 2φ cos 2ψ - cos θ sin 2φ sin 2ψ, F× = ½(1 + cos²θ) cos 2φ sin 2ψ + cos θ sin 2φ cos 2ψ
    /// (Thorne 1987). Used to cross-check <see cref="Response"/>.
    /// </summary>
    public static AntennaResponse DetectorFrame(double thetaRadians, double phiRadians, double psiRadians)
    {
        var cosTheta = Math.Cos(thetaRadians);
        var a = 0.5 * (1 + (cosTheta * cosTheta)) * Math.Cos(2 * phiRadians);
        var b = cosTheta * Math.Sin(2 * phiRadians);
        var (s, c) = Math.SinCos(2 * psiRadians);
        return new AntennaResponse((a * c) - (b * s), (a * s) + (b * c));
    }
}
