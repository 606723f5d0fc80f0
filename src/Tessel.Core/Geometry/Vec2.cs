namespace Tessel.Core.Geometry;

/// <summary>A point or direction in the plane (flat crease pattern, sheet coordinates).</summary>
public readonly record struct Vec2(double X, double Y)
{
    public static readonly Vec2 Zero = new(0, 0);

    // The generated record ToString would print Perp, itself a Vec2, and recurse without end.
    public override string ToString() => FormattableString.Invariant($"({X}, {Y})");

    public static Vec2 operator +(Vec2 a, Vec2 b) => new(a.X + b.X, a.Y + b.Y);
    public static Vec2 operator -(Vec2 a, Vec2 b) => new(a.X - b.X, a.Y - b.Y);
    public static Vec2 operator -(Vec2 a) => new(-a.X, -a.Y);
    public static Vec2 operator *(double s, Vec2 a) => new(s * a.X, s * a.Y);
    public static Vec2 operator *(Vec2 a, double s) => new(s * a.X, s * a.Y);
    public static Vec2 operator /(Vec2 a, double s) => new(a.X / s, a.Y / s);

    public static double Dot(Vec2 a, Vec2 b) => a.X * b.X + a.Y * b.Y;
    /// <summary>z component of the 3D cross product; positive when b is counter-clockwise of a.</summary>
    public static double Cross(Vec2 a, Vec2 b) => a.X * b.Y - a.Y * b.X;

    public double Length => Math.Sqrt(X * X + Y * Y);
    public Vec2 Normalized() { double l = Length; return l > 0 ? this / l : Zero; }
    /// <summary>This vector turned 90 degrees counter-clockwise.</summary>
    public Vec2 Perp => new(-Y, X);
    public Vec2 Rotated(double radians)
    {
        double c = Math.Cos(radians), s = Math.Sin(radians);
        return new(c * X - s * Y, s * X + c * Y);
    }
}
