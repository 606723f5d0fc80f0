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
/// Why the fit used to miss the dome: phase 1 of the fit projects the drape onto the constraints and
/// lands on a sheet that follows the dome across the zig-zag (the Miura's own bending mode) but stays
/// nearly straight along it (the saddle tendency of Wei et al.); reaching the dome then needs a long
/// walk along the constraint set, which the default penalty (1e6) freezes into a creep. Measured on a
/// 1 m square of an R = 4 m cap: 4 x 4 cells stopped at 9.9 mm RMS with envelope defects of both signs
/// (-0.0009 .. +0.0021 rad), the zig-zag ends 20 mm above the cap; with a starting penalty of 100 the
/// same fit reaches 0.8 mm RMS and positive defects everywhere, and 8 x 8 reaches 0.2 mm. The start's
/// grading matters little (grading 0, 0.3 and 1 end within 3 % of one another): the fit grades the cells.
/// Steep domes remain fragile: on a 14 m square of an R = 20 m cap (30 deg slope at the corners) the
/// plan drape starts with Kawasaki residuals of 0.25-0.3 rad, phase 1 wanders 0.3-1 m off the target,
/// and only about a third of the (cells 8-12, sector angle 60/65 deg, fold depth 0.3-0.5 m) choices
/// converge, which ones depending on the start; shallow folds (depth under about 0.4 of the cell's
/// half-length) failed most. Draping by arc length from the centre cut the start's Kawasaki residual
/// threefold but converged no more often; a flat, exactly feasible start converged but stayed flat.
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
