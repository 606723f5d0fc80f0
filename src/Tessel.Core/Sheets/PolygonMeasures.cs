using Tessel.Core.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>Sizes of plain polygons (rings of points, not closed by a repeated point) and polylines.</summary>
internal static class PolygonMeasures
{
    /// <summary>Shoelace area: positive when the ring runs counter-clockwise in a y-up frame.</summary>
    public static double SignedArea(Vec2[] ring)
    {
        double a = 0;
        for (int i = 0; i < ring.Length; i++) a += Vec2.Cross(ring[i], ring[(i + 1) % ring.Length]);
        return a / 2;
    }

    /// <summary>Width of a polygon: the least, over its edges, of the farthest vertex distance from the edge's line
    /// (exact for convex facets).</summary>
    public static double MinimumWidth(Vec2[] ring)
    {
        double best = double.PositiveInfinity;
        for (int i = 0; i < ring.Length; i++)
        {
            var a = ring[i]; var d = ring[(i + 1) % ring.Length] - a;
            double l = d.Length;
            if (l == 0) continue;
            double far = ring.Max(v => Math.Abs(Vec2.Cross(d, v - a)) / l);
            best = Math.Min(best, far);
        }
        return best;
    }

    /// <summary>Largest distance between two vertices.</summary>
    public static double MaxWidth(Vec2[] ring)
    {
        double best = 0;
        foreach (var a in ring) foreach (var b in ring) best = Math.Max(best, (b - a).Length);
        return best;
    }

    /// <summary>Length of a polyline, with the closing segment when <paramref name="closed"/>.</summary>
    public static double PathLength(Vec2[] points, bool closed)
    {
        double len = 0;
        for (int i = 0; i + 1 < points.Length; i++) len += (points[i + 1] - points[i]).Length;
        if (closed && points.Length > 1) len += (points[0] - points[^1]).Length;
        return len;
    }
}
