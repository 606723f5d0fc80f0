using Tessel.Core.Geometry;
using Tessel.Core.Model;

namespace Tessel.Core.Fitting.Residuals;

/// <summary>Signed fold (dihedral) angle of the hinge a-&gt;b between the triangle (a, b, l) on its left
/// and (b, a, r) on its right, in (-pi, pi): 0 when flat, positive for a mountain (the same convention
/// as <see cref="Tessel.Core.Model.CreaseMesh.FoldAngle"/>).</summary>
public static class FoldAngle
{
    /// <summary>The angle; <paramref name="grad"/> (12 numbers) receives d/da, d/db, d/dl, d/dr.</summary>
    /// <remarks>Wing gradients: moving a wing along its triangle's normal by delta turns that face by
    /// delta / (distance to the hinge) toward a valley; hinge-end gradients follow from invariance
    /// under translation and rotation (as in Bridson, Marino &amp; Fedkiw, SCA 2003).</remarks>
    public static double Evaluate(ReadOnlySpan<double> xyz, int a, int b, int l, int r, Span<double> grad)
    {
        var xa = Vec3.Read(xyz, a); var xb = Vec3.Read(xyz, b);
        var xl = Vec3.Read(xyz, l); var xr = Vec3.Read(xyz, r);
        var e = xb - xa;
        double elen = e.Length;
        var nl = Vec3.Cross(e, xl - xa);
        var nr = Vec3.Cross(xr - xa, e);
        double angle = Math.Atan2(Vec3.Dot(Vec3.Cross(nl, nr), e) / elen, Vec3.Dot(nl, nr));
        double nl2 = nl.LengthSquared, nr2 = nr.LengthSquared;
        if (nl2 == 0 || nr2 == 0 || elen == 0) { grad[..12].Clear(); return angle; }
        var gl = -elen / nl2 * nl;
        var gr = -elen / nr2 * nr;
        double tl = Vec3.Dot(xl - xa, e) / (elen * elen);
        double tr = Vec3.Dot(xr - xa, e) / (elen * elen);
        (-(1 - tl) * gl - (1 - tr) * gr).Write(grad, 0);
        (-tl * gl - tr * gr).Write(grad, 1);
        gl.Write(grad, 2);
        gr.Write(grad, 3);
        return angle;
    }

    /// <summary>The angle alone (the same number <see cref="Evaluate"/> returns).</summary>
    public static double Value(ReadOnlySpan<double> xyz, int a, int b, int l, int r)
    {
        var xa = Vec3.Read(xyz, a); var xb = Vec3.Read(xyz, b);
        var e = xb - xa;
        double elen = e.Length;
        var nl = Vec3.Cross(e, Vec3.Read(xyz, l) - xa);
        var nr = Vec3.Cross(Vec3.Read(xyz, r) - xa, e);
        return Math.Atan2(Vec3.Dot(Vec3.Cross(nl, nr), e) / elen, Vec3.Dot(nl, nr));
    }
}
