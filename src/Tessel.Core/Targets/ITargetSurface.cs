using Tessel.Core.Geometry;

namespace Tessel.Core.Targets;

/// <summary>The curved surface a studio wants to model, in metres at full scale, z up.</summary>
/// <remarks>Every target answers the same questions so that later stages never care which kind it is.
/// Normals point to the upper side (+z component for graph surfaces); the folded model's top layer
/// lies on the target, its bottom layer on the offset surface below it.</remarks>
public interface ITargetSurface
{
    /// <summary>One line saying what this is, for summaries ("spherical cap R = 12 m").</summary>
    string Description { get; }

    /// <summary>The region of the xy-plane to cover with the tessellation.</summary>
    Footprint Footprint { get; }

    /// <summary>Height z above (x, y); NaN where the surface has no point above (x, y).</summary>
    double HeightAt(double x, double y);

    /// <summary>Unit normal at the surface point above (x, y), upper side.</summary>
    Vec3 NormalAt(double x, double y);

    /// <summary>The surface point nearest to <paramref name="p"/>, its normal and the signed distance
    /// (positive when p is on the normal side).</summary>
    SurfacePoint ClosestPoint(Vec3 p);

    /// <summary>Principal curvatures at the surface point above (x, y); sign convention in
    /// <see cref="Curvatures"/>.</summary>
    Curvatures CurvaturesAt(double x, double y);
}

/// <summary>A point on a target with its unit normal and the signed distance of the query to it.</summary>
public readonly record struct SurfacePoint(Vec3 Point, Vec3 Normal, double SignedDistance);

/// <summary>Principal curvatures K1 &gt;= K2 (1/m), Gaussian curvature K = K1*K2 and mean H = (K1+K2)/2.
/// Sign convention: curvature is positive where the surface bends toward its (upper) normal, so a
/// dome seen from above has K1, K2 &lt; 0 and K &gt; 0; a saddle has K &lt; 0.</summary>
public readonly record struct Curvatures(double K1, double K2)
{
    public double Gaussian => K1 * K2;
    public double Mean => 0.5 * (K1 + K2);
}
