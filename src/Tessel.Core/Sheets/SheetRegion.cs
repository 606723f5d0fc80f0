using Tessel.Core.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>An axis-aligned rectangle on a sheet in millimetres, y down, given by its top-left
/// corner and size; used to say where annotations may go.</summary>
public sealed record SheetRegion(double X, double Y, double Width, double Height)
{
    /// <summary>x of the right edge.</summary>
    public double Right => X + Width;
    /// <summary>y of the bottom edge (y grows downwards).</summary>
    public double Bottom => Y + Height;

    /// <summary>True when <paramref name="p"/> lies inside or on the edge, with <paramref name="tolerance"/> mm slack.</summary>
    public bool Contains(Vec2 p, double tolerance = 1e-9) =>
        p.X >= X - tolerance && p.X <= Right + tolerance && p.Y >= Y - tolerance && p.Y <= Bottom + tolerance;

    /// <summary>True when the segment a-b passes through the open interior of the region
    /// (touching the edge does not count), by Liang-Barsky clipping.</summary>
    public bool SegmentEntersInterior(Vec2 a, Vec2 b)
    {
        const double eps = 1e-9;
        double t0 = 0, t1 = 1, dx = b.X - a.X, dy = b.Y - a.Y;
        // Clip against the region shrunk by eps so that a segment lying on the border stays outside.
        if (!Clip(-dx, a.X - (X + eps), ref t0, ref t1)) return false;
        if (!Clip(dx, (Right - eps) - a.X, ref t0, ref t1)) return false;
        if (!Clip(-dy, a.Y - (Y + eps), ref t0, ref t1)) return false;
        if (!Clip(dy, (Bottom - eps) - a.Y, ref t0, ref t1)) return false;
        return t0 <= t1;
    }

    private static bool Clip(double p, double q, ref double t0, ref double t1)
    {
        if (p == 0) return q >= 0;
        double r = q / p;
        if (p < 0) { if (r > t1) return false; if (r > t0) t0 = r; }
        else { if (r < t0) return false; if (r < t1) t1 = r; }
        return true;
    }
}
