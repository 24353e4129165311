namespace EventReview.Core.Geodesy;

/// <summary>
/// Detector tensor of an L-shaped interferometer, D = (x xᵀ - y yᵀ)/2 from the arm unit vectors
/// (e.g. Schutz 2011, Class. Quantum Grav. 28 125023). Symmetric, traceless when the arms are unit vectors.
/// </summary>
public static class DetectorTensor
{
    /// <summary>D[i, j] = (x_i x_j - y_i y_j)/2 as a new 3×3 array (index 0, 1, 2 = x, y, z components of the frame of the arms).</summary>
    /// <exception cref="ArgumentException">When an arm vector is not finite or not of unit length (to 1e-9).</exception>
    public static double[,] FromArms(Vector3 xArm, Vector3 yArm)
    {
        CheckUnit(xArm, nameof(xArm));
        CheckUnit(yArm, nameof(yArm));
        double[] x = [xArm.X, xArm.Y, xArm.Z];
        double[] y = [yArm.X, yArm.Y, yArm.Z];
        var d = new double[3, 3];
        for (var i = 0; i < 3; i++)
        {
            for (var j = 0; j < 3; j++)
            {
                d[i, j] = 0.5 * ((x[i] * x[j]) - (y[i] * y[j]));
            }
        }

        return d;
    }

    /// <summary>Full contraction A:B = Σ A_ij B_ij of two 3×3 tensors.</summary>
    public static double Contract(double[,] a, double[,] b)
    {
        var sum = 0.0;
        for (var i = 0; i < 3; i++)
        {
            for (var j = 0; j < 3; j++)
            {
                sum += a[i, j] * b[i, j];
            }
        }

        return sum;
    }

    private static void CheckUnit(Vector3 v, string name)
    {
        if (!v.IsFinite || Math.Abs(v.Length - 1.0) > 1e-9)
        {
            throw new ArgumentException($"{name} must be a finite unit vector.", name);
        }
    }
}
