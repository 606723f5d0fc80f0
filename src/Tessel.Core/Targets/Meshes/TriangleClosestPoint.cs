using Tessel.Core.Geometry;

namespace Tessel.Core.Targets.Meshes;

/// <summary>Closest point of a triangle to a point, by Voronoi regions of the vertices, edges and face
/// (Ericson, Real-Time Collision Detection, Morgan Kaufmann 2005, section 5.1.5).</summary>
public static class TriangleClosestPoint
{
    /// <summary>Barycentric weights (of a, b, c) of the point of triangle abc nearest to p.</summary>
    public static (double U, double V, double W) Find(Vec3 p, Vec3 a, Vec3 b, Vec3 c)
    {
        Vec3 ab = b - a, ac = c - a, ap = p - a;
        double d1 = Vec3.Dot(ab, ap), d2 = Vec3.Dot(ac, ap);
        if (d1 <= 0 && d2 <= 0) return (1, 0, 0);
        Vec3 bp = p - b;
        double d3 = Vec3.Dot(ab, bp), d4 = Vec3.Dot(ac, bp);
        if (d3 >= 0 && d4 <= d3) return (0, 1, 0);
        double vc = d1 * d4 - d3 * d2;
        if (vc <= 0 && d1 >= 0 && d3 <= 0)
        {
            double v = d1 / (d1 - d3);
            return (1 - v, v, 0);
        }
        Vec3 cp = p - c;
        double d5 = Vec3.Dot(ab, cp), d6 = Vec3.Dot(ac, cp);
        if (d6 >= 0 && d5 <= d6) return (0, 0, 1);
        double vb = d5 * d2 - d1 * d6;
        if (vb <= 0 && d2 >= 0 && d6 <= 0)
        {
            double w = d2 / (d2 - d6);
            return (1 - w, 0, w);
        }
        double va = d3 * d6 - d5 * d4;
        if (va <= 0 && d4 - d3 >= 0 && d5 - d6 >= 0)
        {
            double w = (d4 - d3) / ((d4 - d3) + (d5 - d6));
            return (0, 1 - w, w);
        }
        double denom = 1 / (va + vb + vc);
        double vv = vb * denom, ww = vc * denom;
        return (1 - vv - ww, vv, ww);
    }
}
