using Tessel.Core.Geometry;

namespace Tessel.Core.Fitting.Residuals;

/// <summary>Whether two opposite corners of a quadrilateral facet turn the same way: the dot product of
/// their corner normals n_a = (a - d) x (b - a) and n_c = (c - b) x (d - c), for the facet a, b, c, d in
/// face order, divided by a fixed length^4 (the draped facet's). A simple convex facet has it positive
/// (sin alpha_a sin alpha_c for a planar one); a corner turned inside out (reflex) or a facet crossed
/// into a bow-tie makes it negative. The sector-angle bound sees neither: it measures the unsigned angle,
/// which reads the same for a corner of 185 deg as for one of 175 deg.</summary>
public static class FacetCornerOrder
{
    /// <summary>The value and its gradient (12 numbers: d/da .. d/dd).</summary>
    /// <param name="scale">Fixed divisor (the product of the four corner edge lengths in the drape).</param>
    public static double Evaluate(ReadOnlySpan<double> xyz, int a, int b, int c, int d, double scale, Span<double> grad)
    {
        var xa = Vec3.Read(xyz, a); var xb = Vec3.Read(xyz, b);
        var xc = Vec3.Read(xyz, c); var xd = Vec3.Read(xyz, d);
        Vec3 p = xa - xd, q = xb - xa, r = xc - xb, s = xd - xc;
        Vec3 na = Vec3.Cross(p, q), nc = Vec3.Cross(r, s);
        // d(na . nc) = dp . (q x nc) + dq . (nc x p) + dr . (s x na) + ds . (na x r).
        Vec3 gp = Vec3.Cross(q, nc) / scale, gq = Vec3.Cross(nc, p) / scale;
        Vec3 gr = Vec3.Cross(s, na) / scale, gs = Vec3.Cross(na, r) / scale;
        (gp - gq).Write(grad, 0);
        (gq - gr).Write(grad, 1);
        (gr - gs).Write(grad, 2);
        (gs - gp).Write(grad, 3);
        return Vec3.Dot(na, nc) / scale;
    }

    /// <summary>The value alone (the same number <see cref="Evaluate"/> returns).</summary>
    public static double Value(ReadOnlySpan<double> xyz, int a, int b, int c, int d, double scale)
    {
        var xa = Vec3.Read(xyz, a); var xb = Vec3.Read(xyz, b);
        var xc = Vec3.Read(xyz, c); var xd = Vec3.Read(xyz, d);
        return Vec3.Dot(Vec3.Cross(xa - xd, xb - xa), Vec3.Cross(xc - xb, xd - xc)) / scale;
    }

    /// <summary>The divisor that makes the value dimensionless: the four edge lengths at the corners' of
    /// the facet a, b, c, d in <paramref name="xyz"/> (the drape), multiplied.</summary>
    public static double Scale(ReadOnlySpan<double> xyz, int a, int b, int c, int d)
    {
        var xa = Vec3.Read(xyz, a); var xb = Vec3.Read(xyz, b);
        var xc = Vec3.Read(xyz, c); var xd = Vec3.Read(xyz, d);
        return (xa - xd).Length * (xb - xa).Length * (xc - xb).Length * (xd - xc).Length;
    }
}
