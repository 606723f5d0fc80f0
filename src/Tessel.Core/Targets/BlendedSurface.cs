using Tessel.Core.Geometry;

namespace Tessel.Core.Targets;

/// <summary>The graph z = (1 - s) p(x, y) + s f(x, y) between a plane p and a target f over the target's
/// footprint: s = 0 is the plane, s = 1 the target. The fit's continuation moves its target along s so
/// that a pattern that is buildable on the plane stays buildable while it bends toward the target.</summary>
/// <remarks>Derivatives of f come from its own jet when it is a graph surface; otherwise slopes come from
/// its normals and second derivatives are taken as zero (a mesh is piecewise linear), which only slows
/// the closest-point iteration, not its answer.</remarks>
public sealed class BlendedSurface : GraphSurface
{
    private readonly ITargetSurface _target;
    private readonly double _a, _b, _c, _s;

    /// <param name="plane">Coefficients of the plane z = a + b x + c y.</param>
    /// <param name="share">s in [0, 1]: how far from the plane toward the target.</param>
    public BlendedSurface(ITargetSurface target, (double A, double B, double C) plane, double share) : base(target.Footprint)
    {
        if (share is < 0 or > 1 || double.IsNaN(share)) throw new ArgumentOutOfRangeException(nameof(share), "must lie in [0, 1]");
        _target = target; (_a, _b, _c) = plane; _s = share;
    }

    public override string Description => _s == 1 ? _target.Description : $"{_s:0.###} of the way from its best-fit plane to {_target.Description}";

    public override HeightJet Jet(double x, double y)
    {
        double pz = _a + _b * x + _c * y;
        if (_s == 0) return new HeightJet(pz, _b, _c, 0, 0, 0);
        HeightJet f;
        if (_target is GraphSurface graph) f = graph.Jet(x, y);
        else
        {
            double z = _target.HeightAt(x, y);
            if (!double.IsFinite(z)) return new HeightJet(double.NaN, 0, 0, 0, 0, 0);
            var n = _target.NormalAt(x, y);
            f = new HeightJet(z, -n.X / n.Z, -n.Y / n.Z, 0, 0, 0);
        }
        double t = 1 - _s;
        return new HeightJet(t * pz + _s * f.Z, t * _b + _s * f.Zx, t * _c + _s * f.Zy, _s * f.Zxx, _s * f.Zxy, _s * f.Zyy);
    }

    /// <summary>Least-squares plane z = a + b x + c y through the target's heights on a
    /// <paramref name="samples"/> x <paramref name="samples"/> grid over the footprint (points outside the
    /// footprint or without a height are skipped).</summary>
    public static (double A, double B, double C) BestFitPlane(ITargetSurface target, int samples = 33)
    {
        var fp = target.Footprint;
        // Normal equations of the 3-parameter fit, centred on the footprint for conditioning.
        double cx = 0.5 * (fp.MinX + fp.MaxX), cy = 0.5 * (fp.MinY + fp.MaxY);
        double n = 0, sx = 0, sy = 0, sxx = 0, sxy = 0, syy = 0, sz = 0, sxz = 0, syz = 0;
        for (int i = 0; i < samples; i++)
            for (int j = 0; j < samples; j++)
            {
                double x = fp.MinX + fp.Width * (i + 0.5) / samples, y = fp.MinY + fp.Depth * (j + 0.5) / samples;
                if (!fp.Contains(x, y)) continue;
                double z = target.HeightAt(x, y);
                if (!double.IsFinite(z)) continue;
                double u = x - cx, v = y - cy;
                n++; sx += u; sy += v; sxx += u * u; sxy += u * v; syy += v * v; sz += z; sxz += u * z; syz += v * z;
            }
        if (n < 3) return (target.HeightAt(cx, cy) is var z0 && double.IsFinite(z0) ? z0 : 0, 0, 0);
        var m = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseOfArray(new[,] { { n, sx, sy }, { sx, sxx, sxy }, { sy, sxy, syy } });
        var r = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense([sz, sxz, syz]);
        var p = m.Solve(r);
        // Back from centred coordinates: z = p0 + p1 (x - cx) + p2 (y - cy).
        return (p[0] - p[1] * cx - p[2] * cy, p[1], p[2]);
    }
}
