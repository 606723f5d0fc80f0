using Tessel.Core.Targets;

namespace Tessel.Core.Tessellation;

/// <summary>Curvature summary of a target over its footprint, from a regular sample of points inside it.</summary>
/// <param name="MinGaussian">Smallest Gaussian curvature K found, 1/m^2 (negative: saddle-like).</param>
/// <param name="MaxGaussian">Largest K found, 1/m^2 (positive: dome-like).</param>
/// <param name="MaxAbsPrincipal">Largest |principal curvature| found, 1/m (0: flat).</param>
/// <param name="Area">Footprint area, m^2: K times area is the dimensionless total curvature scale.</param>
/// <param name="MinMean">Smallest mean curvature H found, 1/m (sign convention of <see cref="Curvatures"/>).</param>
/// <param name="MaxMean">Largest mean curvature H found, 1/m.</param>
public sealed record CurvatureFigures(double MinGaussian, double MaxGaussian, double MaxAbsPrincipal, double Area,
    double MinMean = 0, double MaxMean = 0)
{
    /// <summary>True when the target bends both ways somewhere (mean curvature of both signs, each at
    /// least a fifth of the larger magnitude): a wave, or a vault that turns into a trough.</summary>
    public bool BendsBothWays
    {
        get
        {
            double big = Math.Max(Math.Abs(MinMean), Math.Abs(MaxMean));
            return big > 0 && MinMean < -0.2 * big && MaxMean > 0.2 * big;
        }
    }

    /// <summary>Samples an n x n grid over the footprint's bounding box (points inside the footprint
    /// where the target is defined).</summary>
    public static CurvatureFigures Sample(ITargetSurface target, int n = 21)
    {
        var fp = target.Footprint;
        double kMin = double.PositiveInfinity, kMax = double.NegativeInfinity, pMax = 0;
        double hMin = double.PositiveInfinity, hMax = double.NegativeInfinity;
        for (int j = 0; j < n; j++)
            for (int i = 0; i < n; i++)
            {
                double x = fp.MinX + fp.Width * i / (n - 1), y = fp.MinY + fp.Depth * j / (n - 1);
                if (!fp.Contains(x, y)) continue;
                var c = target.CurvaturesAt(x, y);
                if (!double.IsFinite(c.Gaussian)) continue;
                kMin = Math.Min(kMin, c.Gaussian); kMax = Math.Max(kMax, c.Gaussian);
                pMax = Math.Max(pMax, Math.Max(Math.Abs(c.K1), Math.Abs(c.K2)));
                hMin = Math.Min(hMin, c.Mean); hMax = Math.Max(hMax, c.Mean);
            }
        if (double.IsPositiveInfinity(kMin)) throw new ArgumentException("the target has no defined point over its footprint", nameof(target));
        return new CurvatureFigures(kMin, kMax, pMax, fp.Area, hMin, hMax);
    }
}
