using Tessel.Core.Geometry;

namespace Tessel.Core.Checks;

/// <summary>Triangle-triangle overlap tests for panel collisions.</summary>
internal static class TriangleIntersection
{
    /// <summary>True when triangles (v0, v1, v2) and (u0, u1, u2) intersect or touch, by the interval-overlap
    /// test of Moller, "A fast triangle-triangle intersection test", J. Graphics Tools 2(2), 1997, with its
    /// coplanar branch (edge-edge and point-in-triangle tests in the dominant projection plane).</summary>
    /// <param name="epsilon">Plane distances below this (metres) count as zero.</param>
    public static bool Intersect(Vec3 v0, Vec3 v1, Vec3 v2, Vec3 u0, Vec3 u1, Vec3 u2, double epsilon)
    {
        var n1 = Vec3.Cross(v1 - v0, v2 - v0).Normalized();
        double du0 = Snap(Vec3.Dot(n1, u0 - v0), epsilon), du1 = Snap(Vec3.Dot(n1, u1 - v0), epsilon), du2 = Snap(Vec3.Dot(n1, u2 - v0), epsilon);
        if (du0 * du1 > 0 && du0 * du2 > 0) return false;
        var n2 = Vec3.Cross(u1 - u0, u2 - u0).Normalized();
        double dv0 = Snap(Vec3.Dot(n2, v0 - u0), epsilon), dv1 = Snap(Vec3.Dot(n2, v1 - u0), epsilon), dv2 = Snap(Vec3.Dot(n2, v2 - u0), epsilon);
        if (dv0 * dv1 > 0 && dv0 * dv2 > 0) return false;
        if (du0 == 0 && du1 == 0 && du2 == 0) return CoplanarIntersect(n1, v0, v1, v2, u0, u1, u2);
        var d = Vec3.Cross(n1, n2);
        // Project onto the coordinate axis closest to the intersection line: same ordering, cheaper.
        double ax = Math.Abs(d.X), ay = Math.Abs(d.Y), az = Math.Abs(d.Z);
        Func<Vec3, double> p = ax >= ay && ax >= az ? (q => q.X) : ay >= az ? (q => q.Y) : (q => q.Z);
        if (!Interval(p(v0), p(v1), p(v2), dv0, dv1, dv2, out double a0, out double a1)) return CoplanarIntersect(n1, v0, v1, v2, u0, u1, u2);
        if (!Interval(p(u0), p(u1), p(u2), du0, du1, du2, out double b0, out double b1)) return CoplanarIntersect(n1, v0, v1, v2, u0, u1, u2);
        if (a0 > a1) (a0, a1) = (a1, a0);
        if (b0 > b1) (b0, b1) = (b1, b0);
        return !(a1 < b0 || b1 < a0);
    }

    private static double Snap(double d, double epsilon) => Math.Abs(d) < epsilon ? 0 : d;

    // Where the other triangle's plane cuts this triangle, as an interval along the projected line.
    private static bool Interval(double p0, double p1, double p2, double d0, double d1, double d2, out double a, out double b)
    {
        if (d0 * d1 > 0) return Cut(p2, p0, p1, d2, d0, d1, out a, out b);
        if (d0 * d2 > 0) return Cut(p1, p0, p2, d1, d0, d2, out a, out b);
        if (d1 * d2 > 0 || d0 != 0) return Cut(p0, p1, p2, d0, d1, d2, out a, out b);
        if (d1 != 0) return Cut(p1, p0, p2, d1, d0, d2, out a, out b);
        if (d2 != 0) return Cut(p2, p0, p1, d2, d0, d1, out a, out b);
        a = b = 0;
        return false;
    }

    // Vertex k lies alone on its side: the cut points on its two edges.
    private static bool Cut(double pk, double pi, double pj, double dk, double di, double dj, out double a, out double b)
    {
        a = pk + (pi - pk) * dk / (dk - di);
        b = pk + (pj - pk) * dk / (dk - dj);
        return true;
    }

    private static bool CoplanarIntersect(Vec3 n, Vec3 v0, Vec3 v1, Vec3 v2, Vec3 u0, Vec3 u1, Vec3 u2)
    {
        double ax = Math.Abs(n.X), ay = Math.Abs(n.Y), az = Math.Abs(n.Z);
        Func<Vec3, Vec2> p = ax >= ay && ax >= az ? (q => new Vec2(q.Y, q.Z)) : ay >= az ? (q => new Vec2(q.X, q.Z)) : (q => new Vec2(q.X, q.Y));
        Vec2[] a = [p(v0), p(v1), p(v2)], b = [p(u0), p(u1), p(u2)];
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++)
                if (SegmentsIntersect(a[i], a[(i + 1) % 3], b[j], b[(j + 1) % 3])) return true;
        return PointInTriangle(a[0], b) || PointInTriangle(b[0], a);
    }

    private static bool SegmentsIntersect(Vec2 p, Vec2 q, Vec2 r, Vec2 s)
    {
        double d1 = Vec2.Cross(s - r, p - r), d2 = Vec2.Cross(s - r, q - r);
        double d3 = Vec2.Cross(q - p, r - p), d4 = Vec2.Cross(q - p, s - p);
        if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return true;
        return (d1 == 0 && OnSegment(r, s, p)) || (d2 == 0 && OnSegment(r, s, q)) ||
               (d3 == 0 && OnSegment(p, q, r)) || (d4 == 0 && OnSegment(p, q, s));
    }

    private static bool OnSegment(Vec2 a, Vec2 b, Vec2 c) =>
        Math.Min(a.X, b.X) <= c.X && c.X <= Math.Max(a.X, b.X) && Math.Min(a.Y, b.Y) <= c.Y && c.Y <= Math.Max(a.Y, b.Y);

    private static bool PointInTriangle(Vec2 q, Vec2[] t)
    {
        double c0 = Vec2.Cross(t[1] - t[0], q - t[0]), c1 = Vec2.Cross(t[2] - t[1], q - t[1]), c2 = Vec2.Cross(t[0] - t[2], q - t[2]);
        return (c0 >= 0 && c1 >= 0 && c2 >= 0) || (c0 <= 0 && c1 <= 0 && c2 <= 0);
    }

    /// <summary>For two triangles (v, b, c) and (v, d, e) that share the corner v (and possibly an edge): true when they
    /// overlap in more than v and their shared edge, i.e. some direction from v lies strictly inside both corners.
    /// Each triangle lies in the cone of its corner at v, so the overlap, if any, reaches v (derived here).</summary>
    /// <param name="angleTolerance">Sine of the angle below which directions are treated as equal or planes as parallel.</param>
    public static bool CornersOverlap(Vec3 v, Vec3 b, Vec3 c, Vec3 d, Vec3 e, double angleTolerance)
    {
        var u1 = (b - v).Normalized(); var u2 = (c - v).Normalized();
        var w1 = (d - v).Normalized(); var w2 = (e - v).Normalized();
        var n1 = Vec3.Cross(u1, u2).Normalized();
        var n2 = Vec3.Cross(w1, w2).Normalized();
        var line = Vec3.Cross(n1, n2);
        if (line.Length > angleTolerance)
        {
            var l = line.Normalized();
            return (Inside(l, u1, u2, n1, angleTolerance) && Inside(l, w1, w2, n2, angleTolerance)) ||
                   (Inside(-l, u1, u2, n1, angleTolerance) && Inside(-l, w1, w2, n2, angleTolerance));
        }
        // Coplanar (panels folded flat onto each other or lying side by side): do the two corners overlap?
        var bu = (u1 + u2).Normalized(); var bw = (w1 + w2).Normalized();
        return Inside(w1, u1, u2, n1, angleTolerance) || Inside(w2, u1, u2, n1, angleTolerance) || Inside(bw, u1, u2, n1, angleTolerance) ||
               Inside(u1, w1, w2, n2, angleTolerance) || Inside(u2, w1, w2, n2, angleTolerance) || Inside(bu, w1, w2, n2, angleTolerance);
    }

    // Strictly inside the corner swept counter-clockwise (about n) from a to b; corners are below 180 degrees.
    private static bool Inside(Vec3 dir, Vec3 a, Vec3 b, Vec3 n, double tolerance) =>
        Vec3.Dot(Vec3.Cross(a, dir), n) > tolerance && Vec3.Dot(Vec3.Cross(dir, b), n) > tolerance;
}
