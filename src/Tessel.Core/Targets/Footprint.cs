using Tessel.Core.Geometry;

namespace Tessel.Core.Targets;

/// <summary>The plan region a tessellation covers: a simple polygon in metres, counter-clockwise.</summary>
/// <remarks>A rectangle is stored as its four corners so that every consumer handles one shape kind.</remarks>
public sealed class Footprint
{
    public Vec2[] Corners { get; }
    public double MinX { get; }
    public double MaxX { get; }
    public double MinY { get; }
    public double MaxY { get; }
    public bool IsRectangle { get; }

    private Footprint(Vec2[] corners, bool isRectangle)
    {
        Corners = corners;
        IsRectangle = isRectangle;
        MinX = corners.Min(c => c.X); MaxX = corners.Max(c => c.X);
        MinY = corners.Min(c => c.Y); MaxY = corners.Max(c => c.Y);
    }

    public double Width => MaxX - MinX;
    public double Depth => MaxY - MinY;

    /// <summary>A width x depth rectangle centred on the origin.</summary>
    public static Footprint Rectangle(double width, double depth)
    {
        if (!(width > 0) || !(depth > 0) || !double.IsFinite(width) || !double.IsFinite(depth))
            throw new ArgumentOutOfRangeException(nameof(width), "footprint width and depth must be positive finite numbers");
        double w = width / 2, d = depth / 2;
        return new Footprint([new(-w, -d), new(w, -d), new(w, d), new(-w, d)], true);
    }

    /// <summary>A simple polygon; its orientation is normalised to counter-clockwise.</summary>
    public static Footprint Polygon(IReadOnlyList<Vec2> corners)
    {
        if (corners.Count < 3) throw new ArgumentException("a footprint polygon needs at least 3 corners");
        var c = corners.ToArray();
        if (SignedArea(c) < 0) Array.Reverse(c);
        if (Math.Abs(SignedArea(c)) <= 0) throw new ArgumentException("footprint polygon has zero area");
        return new Footprint(c, false);
    }

    public double Area => Math.Abs(SignedArea(Corners));

    private static double SignedArea(Vec2[] c)
    {
        double a = 0;
        for (int i = 0; i < c.Length; i++) a += Vec2.Cross(c[i], c[(i + 1) % c.Length]);
        return a / 2;
    }

    /// <summary>A polygon footprint over an axis-aligned box, treated as a rectangle (no trimming).</summary>
    public static Footprint Box(double minX, double minY, double maxX, double maxY)
    {
        if (!(maxX > minX) || !(maxY > minY) || !double.IsFinite(maxX - minX) || !double.IsFinite(maxY - minY))
            throw new ArgumentOutOfRangeException(nameof(maxX), "footprint box must have a positive finite width and depth");
        return new Footprint([new(minX, minY), new(maxX, minY), new(maxX, maxY), new(minX, maxY)], true);
    }

    /// <summary>Distance in plan below which a point next to the border counts as on it: rounding in a
    /// grid laid over the bounding box (min + n (max - min) / n) must not push its last row outside.</summary>
    public double BorderTolerance => 1e-9 * Math.Max(Width, Depth);

    /// <summary>Whether (x, y) lies inside or within <see cref="BorderTolerance"/> of the border.</summary>
    public bool Covers(double x, double y) => Covers(x, y, BorderTolerance);

    /// <summary>Whether (x, y) lies inside or within <paramref name="tolerance"/> of the border.</summary>
    public bool Covers(double x, double y, double tolerance)
    {
        if (x < MinX - tolerance || x > MaxX + tolerance || y < MinY - tolerance || y > MaxY + tolerance) return false;
        if (Contains(x, y)) return true;
        var p = new Vec2(x, y);
        for (int i = 0, j = Corners.Length - 1; i < Corners.Length; j = i++)
            if (DistanceToSegment(p, Corners[j], Corners[i]) <= tolerance) return true;
        return false;
    }

    private static double DistanceToSegment(Vec2 p, Vec2 a, Vec2 b)
    {
        var ab = b - a;
        double len2 = Vec2.Dot(ab, ab);
        double t = len2 > 0 ? Math.Clamp(Vec2.Dot(p - a, ab) / len2, 0, 1) : 0;
        return (p - (a + t * ab)).Length;
    }

    /// <summary>Even-odd point-in-polygon test; points on the border count as inside.</summary>
    public bool Contains(double x, double y)
    {
        if (x < MinX || x > MaxX || y < MinY || y > MaxY) return false;
        if (IsRectangle) return true;
        bool inside = false;
        for (int i = 0, j = Corners.Length - 1; i < Corners.Length; j = i++)
        {
            var a = Corners[i]; var b = Corners[j];
            if ((a.Y > y) != (b.Y > y) && x < (b.X - a.X) * (y - a.Y) / (b.Y - a.Y) + a.X) inside = !inside;
        }
        return inside;
    }
}
