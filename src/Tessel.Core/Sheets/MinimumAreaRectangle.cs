using NetTopologySuite.Algorithm;
using NetTopologySuite.Geometries;
using Tessel.Core.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>Smallest enclosing rectangles of point sets by rotating calipers on the convex hull: the
/// minimum-area rectangle has a side collinear with a hull edge (Freeman &amp; Shapira, CACM 18(7), 1975),
/// so trying each hull edge's direction is exact.</summary>
public static class MinimumAreaRectangle
{
    /// <summary>Convex hull of the points (NTS), counter-clockwise in x-right/y-up terms, not closed.</summary>
    public static Vec2[] ConvexHull(IReadOnlyList<Vec2> points)
    {
        var coords = points.Select(p => new Coordinate(p.X, p.Y)).ToArray();
        var hull = new ConvexHull(coords, NtsGeometry.Factory).GetConvexHull();
        var ring = hull.Coordinates;
        int n = ring.Length > 1 && ring[0].Equals2D(ring[^1]) ? ring.Length - 1 : ring.Length;
        var result = new Vec2[n];
        for (int i = 0; i < n; i++) result[i] = new Vec2(ring[i].X, ring[i].Y);
        return result;
    }

    /// <summary>The axis-aligned box of the points after turning them by <paramref name="angle"/>.</summary>
    public static OrientedBox BoxAt(IReadOnlyList<Vec2> points, double angle)
    {
        double minX = double.PositiveInfinity, minY = double.PositiveInfinity;
        double maxX = double.NegativeInfinity, maxY = double.NegativeInfinity;
        foreach (var p in points)
        {
            var q = p.Rotated(angle);
            minX = Math.Min(minX, q.X); maxX = Math.Max(maxX, q.X);
            minY = Math.Min(minY, q.Y); maxY = Math.Max(maxY, q.Y);
        }
        return new OrientedBox(angle, maxX - minX, maxY - minY, new Vec2(minX, minY));
    }

    /// <summary>Candidate turning angles: every hull edge brought onto the x axis (the calipers' positions)
    /// and the same turned a quarter, in hull order; deduplicated to 1e-12 rad.</summary>
    public static double[] CaliperAngles(Vec2[] hull)
    {
        var angles = new List<double> { 0, Math.PI / 2 };
        for (int i = 0; i < hull.Length; i++)
        {
            var d = hull[(i + 1) % hull.Length] - hull[i];
            if (d.Length == 0) continue;
            double a = -Math.Atan2(d.Y, d.X);
            angles.Add(a);
            angles.Add(a + Math.PI / 2);
        }
        var unique = new List<double>();
        foreach (var a in angles)
        {
            double n = Normalise(a);
            if (!unique.Any(u => Math.Abs(u - n) < 1e-12)) unique.Add(n);
        }
        return unique.ToArray();
    }

    /// <summary>The minimum-area enclosing rectangle of a convex hull, turned so that its long side runs
    /// along x. Ties keep the first caliper position, so the result is deterministic.</summary>
    public static OrientedBox Of(Vec2[] hull)
    {
        OrientedBox best = BoxAt(hull, 0);
        foreach (double a in CaliperAngles(hull))
        {
            var box = BoxAt(hull, a);
            if (box.Area < best.Area - 1e-9 * Math.Max(1, best.Area)
                || (Math.Abs(box.Area - best.Area) <= 1e-9 * Math.Max(1, best.Area) && box.Width > best.Width + 1e-9))
                best = box;
        }
        return best.Width >= best.Height ? best : BoxAt(hull, Normalise(best.Angle + Math.PI / 2));
    }

    /// <summary>A turning of the hull whose enclosing box fits in width x height, preferring the smallest
    /// box area; tries the caliper positions and then every whole degree. Null when nothing fits.</summary>
    /// <param name="extraAngles">More turnings to try (e.g. those that made a sub-shape fit).</param>
    public static OrientedBox? FittingBox(Vec2[] hull, double width, double height, IEnumerable<double>? extraAngles = null)
    {
        OrientedBox? best = null;
        var angles = CaliperAngles(hull).Concat(Enumerable.Range(0, 180).Select(d => d * Math.PI / 180))
            .Concat(extraAngles ?? []);
        foreach (double a in angles)
        {
            var box = BoxAt(hull, a);
            if (box.Width <= width + 1e-9 && box.Height <= height + 1e-9 && (best is null || box.Area < best.Value.Area - 1e-9))
                best = box;
        }
        return best;
    }

    private static double Normalise(double a)
    {
        a %= 2 * Math.PI;
        if (a < 0) a += 2 * Math.PI;
        return a;
    }
}
