using Tessel.Core.Targets;

namespace Tessel.Core.Pipeline;

/// <summary>Numbers that describe a target for the summary and previews, in metres and 1/m.</summary>
public sealed record TargetFigures(
    string Kind,
    string Description,
    double MinX, double MaxX, double MinY, double MaxY,
    double FootprintArea,
    double MinHeight, double MaxHeight,
    double MinGaussianCurvature, double MaxGaussianCurvature,
    double MinMeanCurvature, double MaxMeanCurvature,
    int Samples)
{
    /// <summary>Samples the target on a grid of <paramref name="samples"/> x <paramref name="samples"/> plan
    /// points inside its footprint (plus the footprint's corners) and takes the extremes.</summary>
    public static TargetFigures Measure(string kind, ITargetSurface target, int samples = 101)
    {
        var f = target.Footprint;
        double zLo = double.MaxValue, zHi = double.MinValue, kLo = double.MaxValue, kHi = double.MinValue;
        double hLo = double.MaxValue, hHi = double.MinValue;
        int count = 0;
        void Take(double x, double y)
        {
            double z = target.HeightAt(x, y);
            var c = target.CurvaturesAt(x, y);
            if (!double.IsFinite(z)) return;
            count++;
            zLo = Math.Min(zLo, z); zHi = Math.Max(zHi, z);
            if (double.IsFinite(c.Gaussian)) { kLo = Math.Min(kLo, c.Gaussian); kHi = Math.Max(kHi, c.Gaussian); }
            if (double.IsFinite(c.Mean)) { hLo = Math.Min(hLo, c.Mean); hHi = Math.Max(hHi, c.Mean); }
        }
        for (int j = 0; j < samples; j++)
            for (int i = 0; i < samples; i++)
            {
                double x = f.MinX + f.Width * i / (samples - 1), y = f.MinY + f.Depth * j / (samples - 1);
                if (f.Contains(x, y)) Take(x, y);
            }
        foreach (var c in f.Corners) Take(c.X, c.Y);
        return new TargetFigures(kind, target.Description, f.MinX, f.MaxX, f.MinY, f.MaxY, f.Area,
            zLo, zHi, kLo, kHi, hLo, hHi, count);
    }
}
