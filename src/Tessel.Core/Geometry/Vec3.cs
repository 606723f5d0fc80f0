namespace Tessel.Core.Geometry;

/// <summary>A point or direction in 3D. Immutable; all arithmetic returns new values.</summary>
public readonly record struct Vec3(double X, double Y, double Z)
{
    public static readonly Vec3 Zero = new(0, 0, 0);
    public static readonly Vec3 UnitZ = new(0, 0, 1);

    public static Vec3 operator +(Vec3 a, Vec3 b) => new(a.X + b.X, a.Y + b.Y, a.Z + b.Z);
    public static Vec3 operator -(Vec3 a, Vec3 b) => new(a.X - b.X, a.Y - b.Y, a.Z - b.Z);
    public static Vec3 operator -(Vec3 a) => new(-a.X, -a.Y, -a.Z);
    public static Vec3 operator *(double s, Vec3 a) => new(s * a.X, s * a.Y, s * a.Z);
    public static Vec3 operator *(Vec3 a, double s) => new(s * a.X, s * a.Y, s * a.Z);
    public static Vec3 operator /(Vec3 a, double s) => new(a.X / s, a.Y / s, a.Z / s);

    public static double Dot(Vec3 a, Vec3 b) => a.X * b.X + a.Y * b.Y + a.Z * b.Z;
    public static Vec3 Cross(Vec3 a, Vec3 b) =>
        new(a.Y * b.Z - a.Z * b.Y, a.Z * b.X - a.X * b.Z, a.X * b.Y - a.Y * b.X);

    public double Length => Math.Sqrt(X * X + Y * Y + Z * Z);
    public double LengthSquared => X * X + Y * Y + Z * Z;

    /// <summary>Unit vector in the same direction; the zero vector stays zero.</summary>
    public Vec3 Normalized()
    {
        double l = Length;
        return l > 0 ? this / l : Zero;
    }

    public bool IsFinite => double.IsFinite(X) && double.IsFinite(Y) && double.IsFinite(Z);

    /// <summary>Reads vertex <paramref name="i"/> from a flat xyz array (length 3N).</summary>
    public static Vec3 Read(ReadOnlySpan<double> xyz, int i) => new(xyz[3 * i], xyz[3 * i + 1], xyz[3 * i + 2]);

    /// <summary>Writes this vector as vertex <paramref name="i"/> of a flat xyz array.</summary>
    public void Write(Span<double> xyz, int i)
    {
        xyz[3 * i] = X; xyz[3 * i + 1] = Y; xyz[3 * i + 2] = Z;
    }

    /// <summary>Angle between two vectors in radians, robust near 0 and pi (atan2 form).</summary>
    public static double Angle(Vec3 a, Vec3 b) => Math.Atan2(Cross(a, b).Length, Dot(a, b));
}
