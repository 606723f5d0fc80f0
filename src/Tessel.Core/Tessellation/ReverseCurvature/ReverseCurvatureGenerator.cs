using Tessel.Core.Geometry;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Core.Tessellation.ReverseCurvature;

/// <summary>Reverse-curvature family (docs/reference/geometry.md section 3): developable, Kawasaki-satisfying degree-4
/// quad tessellations whose folded envelope is synclastic (K &gt; 0), the opposite sign to a bent uniform
/// Miura sheet (Wei et al., PRL 110, 2013). Made here as a Miura sheet (Schenk &amp; Guest 2013 cell)
/// whose zig-zag offset grows from the centre outward, draped on the dome with the two-layer offset of
/// Dudte et al. (Nature Materials 15, 2016); the Miura constraints (planar quads, Kawasaki,
/// developability, fold signs) are then enforced by the common fitter, which finishes the grading.</summary>
/// <remarks>
/// The fit starts with a small penalty (<see cref="InitialPenalty"/>): the constraints' projection of the drape
/// follows the dome only across the zig-zag, and reaching it along the zig-zag is a long walk on the constraint
/// set that a stiff penalty freezes. Steep domes (about 30 deg slope) remain fragile. Measurements: docs/decisions.md.
/// </remarks>
public static class ReverseCurvatureGenerator
{
    /// <summary>Starting augmented-Lagrangian penalty for this family (see the remarks).</summary>
    public const double InitialPenalty = 100;

    /// <summary>Builds and drapes the graded sheet; parameter errors as in <see cref="MiuraGenerator"/>.</summary>
    /// <remarks>The grading never takes a vertex off the surface: a graded point where the target has no
    /// height (or, on a polygon footprint, outside the polygon) is moved back along its shift, halving
    /// it down to no shift at all, so a footprint-only target (a mesh, a height map) is met wherever the
    /// uniform sheet met it.</remarks>
    public static GeneratedPattern Generate(ITargetSurface target, ReverseCurvatureParameters p)
    {
        if (!(p.Grading > -0.9 && p.Grading < 3) || !double.IsFinite(p.Grading))
            throw new ArgumentException($"Grading = {p.Grading} is outside (-0.9, 3); use e.g. 0.3 for a zig-zag 30 % deeper at the corners", nameof(p.Grading));
        var fp = target.Footprint;
        var (cell, cellsX, cellsY) = MiuraGenerator.ResolveCell(fp, p.Miura);
        int nx = 2 * cellsX + 1, ny = 2 * cellsY + 1;
        var plans = MiuraGenerator.PlanPoints(fp, p.Miura);
        double phi = p.Miura.OrientationDeg * Math.PI / 180;
        // Zig-zag direction (sheet y axis) in plan.
        var across = new Vec2(0, 1).Rotated(phi);
        for (int j = 0; j < ny; j++)
            for (int i = 1; i < nx; i += 2)
            {
                // Odd columns carry the zig-zag offset V: move them by Grading r^2 V across the zig-zag.
                int k = j * nx + i;
                double rx = (i - cellsX) / (double)cellsX, ry = (j - cellsY) / (double)cellsY;
                var shift = p.Grading * 0.5 * (rx * rx + ry * ry) * cell.V * across;
                if (!OnSurface(target, plans[k])) continue;
                for (int halving = 0; halving < 12 && !OnSurface(target, plans[k] + shift); halving++) shift *= 0.5;
                if (OnSurface(target, plans[k] + shift)) plans[k] += shift;
            }
        var graded = MiuraGenerator.Drape(target, p.Miura, plans, "reverse-curvature");
        return graded with { InitialPenalty = InitialPenalty, PromisesSynclasticEnvelope = true };
    }

    /// <summary>Where the graded sheet may put a vertex: over the surface, and on a polygon footprint
    /// (which is cut to its cells) also inside the polygon.</summary>
    private static bool OnSurface(ITargetSurface target, Vec2 plan) =>
        target.Footprint.IsRectangle ? double.IsFinite(target.HeightAt(plan.X, plan.Y)) : FootprintTrim.Keeps(target, plan);
}
