using Tessel.Core.Geometry;

namespace Tessel.Core.Targets;

/// <summary>Finds where a target is undefined over its footprint, so that a bad formula, a footprint
/// wider than a dome or a mesh with holes is reported before any work is done.</summary>
public static class TargetDomainCheck
{
    /// <summary>The first point, scanning a <paramref name="samples"/> x <paramref name="samples"/> grid over
    /// the footprint's bounding box row by row (then its corners), that lies inside the footprint and
    /// where the height, normal or curvatures are not finite; null when there is none.</summary>
    public static (double X, double Y, string What)? FirstUndefined(ITargetSurface target, int samples = 41)
    {
        var f = target.Footprint;
        for (int j = 0; j < samples; j++)
        {
            double y = f.MinY + f.Depth * j / (samples - 1);
            for (int i = 0; i < samples; i++)
            {
                double x = f.MinX + f.Width * i / (samples - 1);
                if (!f.Contains(x, y)) continue;
                string? what = Problem(target, x, y);
                if (what is not null) return (x, y, what);
            }
        }
        foreach (Vec2 c in f.Corners)
        {
            string? what = Problem(target, c.X, c.Y);
            if (what is not null) return (c.X, c.Y, what);
        }
        return null;
    }

    private static string? Problem(ITargetSurface target, double x, double y)
    {
        double z = target.HeightAt(x, y);
        if (!double.IsFinite(z)) return double.IsNaN(z) ? "the height is undefined (NaN)" : "the height is infinite";
        if (!target.NormalAt(x, y).IsFinite) return "the slope is infinite (vertical surface)";
        var k = target.CurvaturesAt(x, y);
        if (!double.IsFinite(k.K1) || !double.IsFinite(k.K2)) return "the curvature is undefined";
        return null;
    }
}
