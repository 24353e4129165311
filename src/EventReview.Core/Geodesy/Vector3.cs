namespace EventReview.Core.Geodesy;

/// <summary>
/// A 3-vector of doubles (metres for positions, dimensionless for unit vectors), usually in the
/// Earth-centred, Earth-fixed (ECEF) frame: x toward latitude 0 / longitude 0, z toward the north pole.
/// Serialises as <c>{"x":..,"y":..,"z":..}</c>.
/// </summary>
public readonly record struct Vector3(double X, double Y, double Z)
{
    /// <summary>The zero vector.</summary>
    public static Vector3 Zero => new(0, 0, 0);

    /// <summary>Euclidean length (same unit as the components).</summary>
    public double Length => Math.Sqrt((X * X) + (Y * Y) + (Z * Z));

    /// <summary>This vector scaled to unit length.</summary>
    /// <exception cref="InvalidOperationException">When the length is zero or not finite.</exception>
    public Vector3 Normalized()
    {
        var length = Length;
        if (!(length > 0) || !double.IsFinite(length))
        {
            throw new InvalidOperationException("Cannot normalise a zero or non-finite vector.");
        }

        return this / length;
    }

    /// <summary>True when every component is finite.</summary>
    public bool IsFinite => double.IsFinite(X) && double.IsFinite(Y) && double.IsFinite(Z);

    /// <summary>Scalar (dot) product.</summary>
    public static double Dot(Vector3 a, Vector3 b) => (a.X * b.X) + (a.Y * b.Y) + (a.Z * b.Z);

    /// <summary>Vector (cross) product a × b (right-handed).</summary>
    public static Vector3 Cross(Vector3 a, Vector3 b) =>
        new((a.Y * b.Z) - (a.Z * b.Y), (a.Z * b.X) - (a.X * b.Z), (a.X * b.Y) - (a.Y * b.X));

    /// <summary>Angle between two non-zero vectors, radians in [0, π] (robust atan2 form).</summary>
    public static double AngleBetween(Vector3 a, Vector3 b) => Math.Atan2(Cross(a, b).Length, Dot(a, b));

    /// <summary>Component-wise sum a + b.</summary>
    public static Vector3 operator +(Vector3 a, Vector3 b) => new(a.X + b.X, a.Y + b.Y, a.Z + b.Z);
    /// <summary>Component-wise difference a − b.</summary>
    public static Vector3 operator -(Vector3 a, Vector3 b) => new(a.X - b.X, a.Y - b.Y, a.Z - b.Z);
    /// <summary>The opposite vector −a.</summary>
    public static Vector3 operator -(Vector3 a) => new(-a.X, -a.Y, -a.Z);
    /// <summary>Every component multiplied by <paramref name="s"/>.</summary>
    public static Vector3 operator *(double s, Vector3 a) => new(s * a.X, s * a.Y, s * a.Z);
    /// <summary>Every component multiplied by <paramref name="s"/>.</summary>
    public static Vector3 operator *(Vector3 a, double s) => new(s * a.X, s * a.Y, s * a.Z);
    /// <summary>Every component divided by <paramref name="s"/> (s = 0 gives infinite or NaN components).</summary>
    public static Vector3 operator /(Vector3 a, double s) => new(a.X / s, a.Y / s, a.Z / s);
}
