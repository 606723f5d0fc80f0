using Tessel.Core.Geometry;

namespace Tessel.Core.Fitting.Residuals;

/// <summary>Planarity of a quadrilateral facet as the scaled triple product
/// P = (x2-x1) . ((x3-x1) x (x4-x1)) / l^3, l = mean of the four side lengths (dimensionless, 0 when
/// planar). Chosen over the facet angle sum, whose gradient vanishes at planarity
/// (docs/reference/geometry.md section 1).</summary>
public static class QuadPlanarity
{
    /// <summary>P and its gradient (12 numbers: d/dx1 .. d/dx4), l's dependence on the corners included.</summary>
    public static double Evaluate(ReadOnlySpan<double> xyz, int v1, int v2, int v3, int v4, Span<double> grad)
    {
        var x1 = Vec3.Read(xyz, v1); var x2 = Vec3.Read(xyz, v2);
        var x3 = Vec3.Read(xyz, v3); var x4 = Vec3.Read(xyz, v4);
        Vec3 a = x2 - x1, b = x3 - x1, c = x4 - x1;
        double t = Vec3.Dot(a, Vec3.Cross(b, c));
        Vec3 e12 = x2 - x1, e23 = x3 - x2, e34 = x4 - x3, e41 = x1 - x4;
        double l12 = e12.Length, l23 = e23.Length, l34 = e34.Length, l41 = e41.Length;
        double l = 0.25 * (l12 + l23 + l34 + l41);
        double l3 = l * l * l;
        // dT: d/da = b x c, d/db = c x a, d/dc = a x b, d/dx1 = -(sum).
        Vec3 ta = Vec3.Cross(b, c), tb = Vec3.Cross(c, a), tc = Vec3.Cross(a, b);
        // dl: each side length contributes its unit vector to its two ends, a quarter each.
        Vec3 u12 = e12 / l12, u23 = e23 / l23, u34 = e34 / l34, u41 = e41 / l41;
        Vec3 dl1 = 0.25 * (u41 - u12), dl2 = 0.25 * (u12 - u23), dl3 = 0.25 * (u23 - u34), dl4 = 0.25 * (u34 - u41);
        double k = 3 * t / (l3 * l);
        (-(ta + tb + tc) / l3 - k * dl1).Write(grad, 0);
        (ta / l3 - k * dl2).Write(grad, 1);
        (tb / l3 - k * dl3).Write(grad, 2);
        (tc / l3 - k * dl4).Write(grad, 3);
        return t / l3;
    }
}
