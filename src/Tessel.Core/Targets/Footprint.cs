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
