using Tessel.Core.Geometry;

namespace Tessel.Core.Targets;

/// <summary>Height and its first and second partial derivatives at one (x, y).</summary>
public readonly record struct HeightJet(double Z, double Zx, double Zy, double Zxx, double Zxy, double Zyy);

/// <summary>A target given as a graph z = f(x, y). Subclasses supply f and its derivatives; normals,
/// curvatures and closest points follow from the standard formulas for a graph surface
/// (do Carmo, Differential Geometry of Curves and Surfaces, section 3-3, Monge patch).</summary>
public abstract class GraphSurface : ITargetSurface
{
    protected GraphSurface(Footprint footprint) => Footprint = footprint;

    public abstract string Description { get; }
    public Footprint Footprint { get; }

    /// <summary>f and its derivatives at (x, y); Z is NaN where the surface is undefined.</summary>
    public abstract HeightJet Jet(double x, double y);

    public double HeightAt(double x, double y) => Jet(x, y).Z;

    public Vec3 NormalAt(double x, double y)
    {
        var j = Jet(x, y);
        return new Vec3(-j.Zx, -j.Zy, 1).Normalized();
    }

    public Curvatures CurvaturesAt(double x, double y) => CurvaturesOf(Jet(x, y));

    /// <summary>Principal curvatures of a Monge patch: K = (fxx fyy - fxy^2) / W^4,
    /// H = ((1+fy^2) fxx - 2 fx fy fxy + (1+fx^2) fyy) / (2 W^3), W^2 = 1 + fx^2 + fy^2.</summary>
    /// <remarks>Computed as the eigenvalues of the shape operator S = I^-1 II, written
    /// [[a, b], [c, d]]: k = (a+d)/2 +- sqrt(((a-d)/2)^2 + b c). Unlike sqrt(H^2 - K), this keeps full
    /// precision at umbilic points (spheres), where H^2 - K cancels to rounding noise.</remarks>
    public static Curvatures CurvaturesOf(HeightJet j)
    {
        double e = 1 + j.Zx * j.Zx, f = j.Zx * j.Zy, g = 1 + j.Zy * j.Zy;
        double w2 = e + j.Zy * j.Zy;
        double w3 = w2 * Math.Sqrt(w2);
        double a = (g * j.Zxx - f * j.Zxy) / w3;
        double b = (g * j.Zxy - f * j.Zyy) / w3;
        double c = (e * j.Zxy - f * j.Zxx) / w3;
        double d = (e * j.Zyy - f * j.Zxy) / w3;
        double h = 0.5 * (a + d), half = 0.5 * (a - d);
        double disc = Math.Sqrt(Math.Max(0, half * half + b * c));
        return new Curvatures(h + disc, h - disc);
    }

    /// <summary>Nearest surface point by Newton's method on the squared distance over (u, v),
    /// started at the vertical projection; falls back to damped steps where the Hessian is not
    /// positive definite (far from the surface on its concave side).</summary>
    public virtual SurfacePoint ClosestPoint(Vec3 p)
    {
        double u = p.X, v = p.Y;
        var j = Jet(u, v);
        if (!double.IsFinite(j.Z)) (u, v, j) = ClampIntoDomain(p);
        for (int it = 0; it < 50; it++)
        {
            // d = (u, v, f) - p;  g = grad(|d|^2 / 2);  H = Hessian of the same.
            double dx = u - p.X, dy = v - p.Y, dz = j.Z - p.Z;
            double gu = dx + dz * j.Zx, gv = dy + dz * j.Zy;
            double huu = 1 + j.Zx * j.Zx + dz * j.Zxx;
            double huv = j.Zx * j.Zy + dz * j.Zxy;
            double hvv = 1 + j.Zy * j.Zy + dz * j.Zyy;
            double det = huu * hvv - huv * huv;
            double su, sv;
            if (huu > 0 && det > 1e-12 * (huu * hvv + 1e-300))
            {
                su = -(hvv * gu - huv * gv) / det;
                sv = -(huu * gv - huv * gu) / det;
            }
            else
            {
                double scale = 1 + j.Zx * j.Zx + j.Zy * j.Zy;
                su = -gu / scale; sv = -gv / scale;
            }
            double f0 = dx * dx + dy * dy + dz * dz;
            double t = 1;
            HeightJet jn = j;
            double un = u, vn = v;
            for (int ls = 0; ls < 30; ls++)
            {
                un = u + t * su; vn = v + t * sv;
                jn = Jet(un, vn);
                if (double.IsFinite(jn.Z))
                {
                    double ex = un - p.X, ey = vn - p.Y, ez = jn.Z - p.Z;
                    if (ex * ex + ey * ey + ez * ez <= f0 + 1e-300) break;
                }
                t *= 0.5;
            }
            if (!double.IsFinite(jn.Z)) break;
            double step = Math.Abs(un - u) + Math.Abs(vn - v);
            u = un; v = vn; j = jn;
            if (step <= 1e-15 * (1 + Math.Abs(u) + Math.Abs(v))) break;
        }
        var point = new Vec3(u, v, j.Z);
        var n = new Vec3(-j.Zx, -j.Zy, 1).Normalized();
        return new SurfacePoint(point, n, Vec3.Dot(p - point, n));
    }

    /// <summary>Starting point when the query lies outside the surface's domain: walk from the
    /// footprint centre toward it while the surface stays defined.</summary>
    private (double U, double V, HeightJet J) ClampIntoDomain(Vec3 p)
    {
        double cx = 0.5 * (Footprint.MinX + Footprint.MaxX), cy = 0.5 * (Footprint.MinY + Footprint.MaxY);
        double lo = 0, hi = 1;
        for (int i = 0; i < 60; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (double.IsFinite(Jet(cx + mid * (p.X - cx), cy + mid * (p.Y - cy)).Z)) lo = mid; else hi = mid;
        }
        double u = cx + lo * (p.X - cx), v = cy + lo * (p.Y - cy);
        return (u, v, Jet(u, v));
    }
}
