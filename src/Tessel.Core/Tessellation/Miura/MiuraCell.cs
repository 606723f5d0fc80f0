namespace Tessel.Core.Tessellation.Miura;

/// <summary>Closed-form Miura-ori unit cell (Schenk &amp; Guest, "Geometry of Miura-folded
/// metamaterials", PNAS 110(9), 2013). Facets are parallelograms with sides a, b and acute angle
/// gamma; theta in [0, pi/2] is the dihedral angle between a facet and the xy-plane (0 = flat).</summary>
public readonly record struct MiuraCell(double A, double B, double Gamma, double Theta)
{
    /// <summary>Cell height H = a sin(theta) sin(gamma).</summary>
    public double H => A * Math.Sin(Theta) * Math.Sin(Gamma);

    /// <summary>Half cell width S = b cos(theta) tan(gamma) / sqrt(1 + cos^2(theta) tan^2(gamma)).</summary>
    public double S => B * Math.Cos(Theta) * Math.Tan(Gamma) / Root;

    /// <summary>Half cell length L = a sqrt(1 - sin^2(theta) sin^2(gamma)).</summary>
    public double L => A * Math.Sqrt(1 - Math.Pow(Math.Sin(Theta) * Math.Sin(Gamma), 2));

    /// <summary>Zig-zag offset V = b / sqrt(1 + cos^2(theta) tan^2(gamma)).</summary>
    public double V => B / Root;

    /// <summary>In-plane Poisson ratio nu_SL = -tan^2(gamma) cos^2(theta).</summary>
    public double PoissonRatioSL => -Math.Pow(Math.Tan(Gamma) * Math.Cos(Theta), 2);

    private double Root => Math.Sqrt(1 + Math.Pow(Math.Cos(Theta) * Math.Tan(Gamma), 2));
}
