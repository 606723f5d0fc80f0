namespace Tessel.Core.Targets;

/// <summary>Horizontal plane z = height.</summary>
public sealed class PlaneSurface(Footprint footprint, double height = 0) : GraphSurface(footprint)
{
    public double Height { get; } = height;
    public override string Description => $"plane at z = {Height:0.###} m";
    public override HeightJet Jet(double x, double y) => new(Height, 0, 0, 0, 0, 0);
}

/// <summary>Barrel vault: a circular cylinder of radius R with its axis along x and its crown at
/// z = rise over y = 0: z = rise - R + sqrt(R^2 - y^2).</summary>
public sealed class CylinderSurface(Footprint footprint, double radius, double rise) : GraphSurface(footprint)
{
    public double Radius { get; } = radius;
    public double Rise { get; } = rise;
    public override string Description => $"barrel vault R = {Radius:0.###} m, crown {Rise:0.###} m";
    public override HeightJet Jet(double x, double y)
    {
        double r2 = Radius * Radius, s2 = r2 - y * y;
        if (s2 <= 0) return new(double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN);
        double s = Math.Sqrt(s2);
        return new(Rise - Radius + s, 0, -y / s, 0, 0, -r2 / (s2 * s));
    }
}

/// <summary>Dome: a spherical cap of radius R with its apex at z = rise over the origin:
/// z = rise - R + sqrt(R^2 - x^2 - y^2).</summary>
public sealed class SphericalCapSurface(Footprint footprint, double radius, double rise) : GraphSurface(footprint)
{
    public double Radius { get; } = radius;
    public double Rise { get; } = rise;
    public override string Description => $"spherical cap R = {Radius:0.###} m, apex {Rise:0.###} m";
    public override HeightJet Jet(double x, double y)
    {
        double r2 = Radius * Radius, s2 = r2 - x * x - y * y;
        if (s2 <= 0) return new(double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN);
        double s = Math.Sqrt(s2), s3 = s2 * s;
        return new(Rise - Radius + s, -x / s, -y / s,
            -(r2 - y * y) / s3, -x * y / s3, -(r2 - x * x) / s3);
    }

    /// <summary>Exact closest point on the full sphere, used instead of Newton iteration.</summary>
    public override SurfacePoint ClosestPoint(Geometry.Vec3 p)
    {
        var c = new Geometry.Vec3(0, 0, Rise - Radius);
        var d = p - c;
        double len = d.Length;
        if (len == 0 || d.Z <= 0) return base.ClosestPoint(p);
        var n = d / len;
        return new SurfacePoint(c + Radius * n, n, len - Radius);
    }
}

/// <summary>Saddle canopy: hyperbolic paraboloid z = rise + x*y / c.</summary>
public sealed class HyperbolicParaboloidSurface(Footprint footprint, double c, double rise = 0) : GraphSurface(footprint)
{
    public double C { get; } = c;
    public double Rise { get; } = rise;
    public override string Description => Rise == 0
        ? $"hyperbolic paraboloid z = x*y/{C:0.###} m"
        : $"hyperbolic paraboloid z = {Rise:0.###} + x*y/{C:0.###} m";
    public override HeightJet Jet(double x, double y) => new(Rise + x * y / C, y / C, x / C, 0, 1 / C, 0);
}

/// <summary>Elliptic paraboloid with apex curvature radii rx, ry:
/// z = rise - x^2 / (2 rx) - y^2 / (2 ry) (a dome when both radii are positive).</summary>
public sealed class EllipticParaboloidSurface(Footprint footprint, double radiusX, double radiusY, double rise) : GraphSurface(footprint)
{
    public double RadiusX { get; } = radiusX;
    public double RadiusY { get; } = radiusY;
    public double Rise { get; } = rise;
    public override string Description => $"elliptic paraboloid rx = {RadiusX:0.###} m, ry = {RadiusY:0.###} m";
    public override HeightJet Jet(double x, double y) =>
        new(Rise - x * x / (2 * RadiusX) - y * y / (2 * RadiusY), -x / RadiusX, -y / RadiusY, -1 / RadiusX, 0, -1 / RadiusY);
}

/// <summary>Corrugated wave running along x: z = rise + amplitude * sin(2 pi x / wavelength + phase).</summary>
public sealed class SinusoidalWaveSurface(Footprint footprint, double amplitude, double wavelength, double phase = 0, double rise = 0) : GraphSurface(footprint)
{
    public double Amplitude { get; } = amplitude;
    public double Wavelength { get; } = wavelength;
    public double Phase { get; } = phase;
    public double Rise { get; } = rise;
    public override string Description => $"sinusoidal wave amplitude {Amplitude:0.###} m, wavelength {Wavelength:0.###} m";
    public override HeightJet Jet(double x, double y)
    {
        double k = 2 * Math.PI / Wavelength, a = k * x + Phase;
        double s = Math.Sin(a), c = Math.Cos(a);
        return new(Rise + Amplitude * s, Amplitude * k * c, 0, -Amplitude * k * k * s, 0, 0);
    }
}
