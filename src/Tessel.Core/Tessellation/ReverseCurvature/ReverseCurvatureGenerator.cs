using Tessel.Core.Geometry;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Core.Tessellation.ReverseCurvature;

/// <summary>Reverse-curvature family (geometry.md section 3): developable, Kawasaki-satisfying degree-4
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
    public static GeneratedPattern Generate(ITargetSurface target, ReverseCurvatureParameters p)
    {
        if (!(p.Grading > -0.9 && p.Grading < 3) || !double.IsFinite(p.Grading))
            throw new ArgumentException($"Grading = {p.Grading} is outside (-0.9, 3); use e.g. 0.3 for a zig-zag 30 % deeper at the corners", nameof(p.Grading));
        var uniform = MiuraGenerator.Generate(target, p.Miura);
        var (cell, cellsX, cellsY) = MiuraGenerator.ResolveCell(target.Footprint, p.Miura);
        int nx = 2 * cellsX + 1, ny = 2 * cellsY + 1;
        var mesh = uniform.Mesh;
        var plans = MiuraGenerator.PlanPoints(target.Footprint, p.Miura);
        var pos = new double[mesh.Positions.Length];
        double phi = p.Miura.OrientationDeg * Math.PI / 180;
        // Zig-zag direction (sheet y axis) in plan.
        var across = new Vec2(0, 1).Rotated(phi);
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                int k = j * nx + i;
                var plan = plans[k];
                if (i % 2 == 1)
                {
                    // Odd columns carry the zig-zag offset V: move them by Grading r^2 V across the zig-zag.
                    double rx = (i - cellsX) / (double)cellsX, ry = (j - cellsY) / (double)cellsY;
                    plan += p.Grading * 0.5 * (rx * rx + ry * ry) * cell.V * across;
                }
                double z = target.HeightAt(plan.X, plan.Y);
                if (!double.IsFinite(z))
                {
                    if (i % 2 == 1 && p.Grading != 0)
                        throw new ArgumentException($"the graded sheet reaches ({plan.X:0.###}, {plan.Y:0.###}) m where the target has no surface; use more cells (tessellation.cellsX and cellsY) or a smaller target.footprint", nameof(p.Grading));
                    // Where the plain drape had to clamp (zig-zag overhang of a footprint-only target), keep it.
                    Vec3.Read(mesh.Positions, k).Write(pos, k);
                    continue;
                }
                var onTarget = new Vec3(plan.X, plan.Y, z);
                (mesh.Layers[k] == VertexLayer.Top ? onTarget : onTarget - uniform.LayerOffset * target.NormalAt(plan.X, plan.Y)).Write(pos, k);
            }
        var graded = new CreaseMesh("reverse-curvature", pos, mesh.Faces, mesh.Layers, RoleLookup(mesh));
        return uniform with { Mesh = graded, InitialPenalty = InitialPenalty, PromisesSynclasticEnvelope = true };
    }

    private static Func<int, int, CreaseRole> RoleLookup(CreaseMesh mesh)
    {
        var roles = new Dictionary<(int, int), CreaseRole>();
        for (int e = 0; e < mesh.EdgeCount; e++) roles[(mesh.EdgeVertices[2 * e], mesh.EdgeVertices[2 * e + 1])] = mesh.EdgeRoles[e];
        return (a, b) => roles[(a, b)];
    }
}
