using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Core.Tessellation.FreeTriangulated;

/// <summary>A free triangulated developable net: the footprint meshed by a regular triangulation (grid
/// cells split along one diagonal direction, so interior vertices have degree 6), every vertex on the
/// target. The fit then moves the vertices so that every interior vertex is developable within epsilon
/// while the distance to the target is minimised; optionally a share of the cells stay whole as planar
/// quad panels (flat diagonal, planarity constraint).</summary>
/// <remarks>
/// On a footprint that is not a rectangle, only cells whose corners all lie inside it (within its border
/// tolerance) over the target are kept (<see cref="FootprintTrim"/>), so the border is stepped at the cell
/// size (exact for convex footprints: kept cells lie inside). The net folds
/// both ways wherever the target's curvature demands, so no mountain/valley sign is imposed during the
/// fit; call <see cref="RelabelFolds"/> on the fitted mesh to label its creases.
/// The start is crumpled: interior vertices sit off the target along its normal by normal deviates of standard deviation
/// <see cref="FreeTriangulatedParameters.Crumple"/> cell sizes, because on a smooth star the angle sum is at a
/// maximum over normal motions of the centre and the developability residual has no useful gradient
/// there (the same trap as the facet-angle planarity test in docs/reference/geometry.md section 1).
/// With planar quad panels (share &gt; 0) a random crumple is a trap of its own: a degree-4 vertex
/// between planar panels whose creases all fold the same way is a convex cone (angle sum &lt; 2 pi) that
/// can only become developable by flipping a crease through the flat state. Such a net starts
/// instead as a Miura-like corrugation (Schenk &amp; Guest 2013 layout): interior grid rows alternately
/// above and below the target by <see cref="CorrugationFactor"/> x <see cref="FreeTriangulatedParameters.Crumple"/>
/// cells and odd columns shifted across the rows by <see cref="ZigZagShift"/> cells, so every degree-4 vertex
/// starts with the three-one crease signs of a folded developable vertex. Measurements: docs/decisions.md.
/// </remarks>
public static class FreeTriangulatedGenerator
{
    /// <summary>Shift of odd grid columns across the rows in the corrugated start, in cell depths.</summary>
    public const double ZigZagShift = 0.2;

    /// <summary>Row offset of the corrugated start over <see cref="FreeTriangulatedParameters.Crumple"/>.</summary>
    public const double CorrugationFactor = 2;

    /// <summary>Builds the net on the target; throws <see cref="ArgumentException"/> naming the parameter.</summary>
    public static GeneratedPattern Generate(ITargetSurface target, FreeTriangulatedParameters p)
    {
        if (!(p.FlatDiagonalShare >= 0 && p.FlatDiagonalShare <= 1))
            throw new ArgumentException($"FlatDiagonalShare = {p.FlatDiagonalShare} is outside [0, 1]; use e.g. 0.3 for 30 % planar quad panels", nameof(p.FlatDiagonalShare));
        var fp = target.Footprint;
        int cx = CellCounts.Resolve(p.CellsX, p.CellSize, fp.Width, nameof(p.CellsX));
        int cy = CellCounts.Resolve(p.CellsY, p.CellSize, fp.Depth, nameof(p.CellsY));
        int nx = cx + 1;
        double dx = fp.Width / cx, dy = fp.Depth / cy;
        int Grid(int i, int j) => j * nx + i;

        // The grid over the bounding box, cut to the cells whose corners all lie inside the footprint
        // (within its border tolerance) where the target has a surface.
        var keep = new bool[nx * (cy + 1)];
        var full = new double[3 * keep.Length];
        for (int g = 0; g < keep.Length; g++)
        {
            double x = g % nx == cx ? fp.MaxX : fp.MinX + (g % nx) * dx, y = g / nx == cy ? fp.MaxY : fp.MinY + (g / nx) * dy;
            keep[g] = FootprintTrim.Keeps(target, new Vec2(x, y));
            new Vec3(x, y, keep[g] ? target.HeightAt(x, y) : 0).Write(full, g);
        }
        var faces = new List<int[]>();
        for (int j = 0; j < cy; j++)
            for (int i = 0; i < cx; i++)
            {
                int a = Grid(i, j), b = Grid(i + 1, j), c = Grid(i + 1, j + 1), d = Grid(i, j + 1);
                if (IsPanel(i, j, p.FlatDiagonalShare)) faces.Add([a, b, c, d]);
                else { faces.Add([a, b, c]); faces.Add([a, c, d]); }
            }
        var gridStencils = new List<int>();
        for (int j = 0; j <= cy; j++)
            for (int i = 0; i <= cx; i++)
            {
                int c = Grid(i, j);
                if (i >= 1 && i < cx) gridStencils.AddRange([Grid(i - 1, j), c, Grid(i + 1, j)]);
                if (j >= 1 && j < cy) gridStencils.AddRange([Grid(i, j - 1), c, Grid(i, j + 1)]);
            }
        var sheet = new CreaseMesh("free-triangulated", full, faces.ToArray(), new VertexLayer[keep.Length], (_, _) => CreaseRole.Flat);
        var cut = FootprintTrim.Trim(sheet, keep, gridStencils.ToArray(), Grid(cx / 2, cy / 2));

        int n = cut.Mesh.VertexCount;
        var oldOfNew = new int[n];
        for (int g = 0; g < keep.Length; g++) if (cut.NewOfOld[g] >= 0) oldOfNew[cut.NewOfOld[g]] = g;
        var pos = (double[])cut.Mesh.Positions.Clone();
        var layers = Enumerable.Repeat(VertexLayer.Top, n).ToArray();
        var boundary = cut.Mesh.BoundaryVertices();
        bool corrugate = p.FlatDiagonalShare > 0 || p.CorrugatedStart;
        for (int v = 0; v < n; v++)
        {
            if (boundary[v] && !p.CorrugatedStart) continue;
            int gi = oldOfNew[v] % nx, gj = oldOfNew[v] / nx;
            double offset = p.Crumple * Math.Min(dx, dy) * (corrugate ? CorrugationFactor * (gj % 2 == 1 ? 1 : -1) : CrumpleProfile(gi, gj));
            double shift = corrugate && !p.CorrugatedStart && gi % 2 == 1 ? ZigZagShift * dy : 0;
            var q = Vec3.Read(pos, v);
            if (shift != 0)
            {
                double z = target.HeightAt(q.X, q.Y + shift);
                // A target defined only over its footprint keeps the unshifted point (it only moves the start).
                if (double.IsFinite(z)) q = new Vec3(q.X, q.Y + shift, z);
            }
            (q + offset * target.NormalAt(q.X, q.Y)).Write(pos, v);
        }
        var compact = cut.Mesh.Faces;
        var mesh = RelabelFolds(new CreaseMesh("free-triangulated", pos, compact, layers, (_, _) => CreaseRole.Flat));
        var constraints = FamilyConstraints.Developability;
        if (compact.Any(f => f.Length == 4)) constraints |= FamilyConstraints.QuadPlanarity;
        return new GeneratedPattern(mesh, constraints, cut.FairnessStencils, CentralVertex(pos), 0);
    }

    /// <summary>Labels every interior edge by the sign of its fold angle in the given state (flat within
    /// 1e-9 rad stays <see cref="CreaseRole.Flat"/>); for the fitted net, whose creases fold both ways.</summary>
    public static CreaseMesh RelabelFolds(CreaseMesh mesh) => RegularMiuraSheet.AssignRolesFromGeometry(mesh);

    /// <summary>Whether cell (i, j) stays a planar quad panel: cells are chosen by the additive recurrence
    /// frac(i g1 + j g2) &lt; share with the plastic-number constants of the R2 sequence (Roberts 2018),
    /// which spreads the panels evenly for any share without a random generator.</summary>
    public static bool IsPanel(int i, int j, double share)
    {
        if (share <= 0) return false;
        if (share >= 1) return true;
        const double g1 = 0.7548776662466927, g2 = 0.5698402909980532;
        double u = i * g1 + j * g2;
        return u - Math.Floor(u) < share;
    }

    /// <summary>Deterministic offset profile for grid vertex (i, j): a standard normal deviate (Box-Muller)
    /// from a generator seeded by the grid position alone, so the start never depends on the job seed
    /// (multi-start perturbs on top of it) and neighbours fold independently.</summary>
    public static double CrumpleProfile(int i, int j)
    {
        var random = new Random(unchecked(i * 73856093 ^ j * 19349663 ^ 0x5bd1e995));
        double u1 = 1 - random.NextDouble(), u2 = random.NextDouble();
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }

    private static int CentralVertex(double[] pos)
    {
        int n = pos.Length / 3;
        double mx = 0, my = 0;
        for (int v = 0; v < n; v++) { mx += pos[3 * v]; my += pos[3 * v + 1]; }
        mx /= n; my /= n;
        int best = 0; double bd = double.MaxValue;
        for (int v = 0; v < n; v++)
        {
            double d = Math.Pow(pos[3 * v] - mx, 2) + Math.Pow(pos[3 * v + 1] - my, 2);
            if (d < bd) { bd = d; best = v; }
        }
        return best;
    }
}
