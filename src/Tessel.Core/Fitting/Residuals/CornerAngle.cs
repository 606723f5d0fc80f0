using Tessel.Core.Geometry;

namespace Tessel.Core.Fitting.Residuals;

/// <summary>The angle at corner c between the edges c-&gt;p and c-&gt;q (a sector angle), in radians,
/// with its analytic gradient.</summary>
public static class CornerAngle
{
    /// <summary>Angle in [0, pi] by the atan2 form. <paramref name="grad"/> (9 numbers) receives
    /// d/dc, d/dp, d/dq. The gradient is undefined for a degenerate (0 or pi) corner and is then zero.</summary>
    public static double Evaluate(ReadOnlySpan<double> xyz, int c, int p, int q, Span<double> grad)
    {
        var x = Vec3.Read(xyz, c);
        var u = Vec3.Read(xyz, p) - x;
        var w = Vec3.Read(xyz, q) - x;
        var cross = Vec3.Cross(u, w);
        double sin = cross.Length;
        double angle = Math.Atan2(sin, Vec3.Dot(u, w));
        if (sin <= 0 || u.LengthSquared == 0 || w.LengthSquared == 0) { grad[..9].Clear(); return angle; }
        var n = cross / sin;
        // Turning u away from w (about n) opens the corner: d/dp = (u x n)/|u|^2, d/dq = (n x w)/|w|^2.
        var gp = Vec3.Cross(u, n) / u.LengthSquared;
        var gq = Vec3.Cross(n, w) / w.LengthSquared;
        (-(gp + gq)).Write(grad, 0);
        gp.Write(grad, 1);
        gq.Write(grad, 2);
        return angle;
    }

    /// <summary>Value only.</summary>
    public static double Value(ReadOnlySpan<double> xyz, int c, int p, int q)
    {
        var x = Vec3.Read(xyz, c);
        return Vec3.Angle(Vec3.Read(xyz, p) - x, Vec3.Read(xyz, q) - x);
    }
}
