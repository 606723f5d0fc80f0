using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Core.Tessellation.Yoshimura;

/// <summary>Makes the initial folded state of a Yoshimura pattern on a barrel vault (axis along x) in
/// closed form (<see cref="YoshimuraRing"/>): rings of vertices inscribed in the vault's cross-section
/// circle, all on the target (top layer), so a cylinder target is met exactly before any fitting.</summary>
/// <remarks>
/// Row j (j = 0..rings) sits at x = minX + j t. Even rows hold segments + 1 vertices at arc angles
/// theta_0 + i phi, odd rows hold segments vertices half a step in: the side edges zig-zag, so every
/// triangle keeps its flat shape. Vertex index = rowStart[j] + i. Interior vertices have degree 6.
/// For a target other than <see cref="CylinderSurface"/> the circle is the osculating one across the
/// footprint centre and heights come from the target (the fit then corrects the angles).
/// </remarks>
public static class YoshimuraGenerator
{
    /// <summary>Builds and drapes the pattern; throws <see cref="ArgumentException"/> naming the parameter.</summary>
    public static GeneratedPattern Generate(ITargetSurface target, YoshimuraParameters p)
    {
        var fp = target.Footprint;
        var vault = Vault(target);
        if (vault.Problem is { } problem) throw new ArgumentException(problem, nameof(target));
        var (radius, th0, th1) = (vault.Radius, vault.Theta0, vault.Theta1);
        int segments = CellCounts.Resolve(p.Segments, p.CellSize, radius * (th1 - th0), nameof(p.Segments));
        int rings = CellCounts.Resolve(p.Rings, p.CellSize, vault.Length, nameof(p.Rings));
        var ring = new YoshimuraRing(radius, (th1 - th0) / segments, vault.Length / rings);

        var rowStart = RowStarts(segments, rings);
        int n = rowStart[^1];
        var pos = new double[3 * n];
        var layers = new VertexLayer[n];
        bool trim = !fp.IsRectangle;
        var keep = new bool[n];
        for (int j = 0; j <= rings; j++)
            for (int i = 0; i < RowLength(j, segments); i++)
            {
                double theta = th0 + (i + (j % 2 == 1 ? 0.5 : 0)) * ring.ChordAngle;
                var plan = vault.Plan(vault.U0 + j * ring.AxialPitch, vault.WAxis + radius * Math.Sin(theta));
                int v = rowStart[j] + i;
                layers[v] = VertexLayer.Top;
                keep[v] = !trim || FootprintTrim.Keeps(target, plan);
                if (!keep[v]) { new Vec3(plan.X, plan.Y, 0).Write(pos, v); continue; }
                double z = target.HeightAt(plan.X, plan.Y);
                if (!double.IsFinite(z))
                    throw new ArgumentException($"the pattern reaches ({plan.X:0.###}, {plan.Y:0.###}) m where the target has no surface; use a smaller footprint", nameof(target));
                new Vec3(plan.X, plan.Y, z).Write(pos, v);
            }
        var faces = Faces(segments, rings, rowStart);
        int mid = rings / 2;
        int anchor = rowStart[mid] + RowLength(mid, segments) / 2;
        var stencils = FairnessStencils(segments, rings, rowStart);
        const FamilyConstraints constraints = FamilyConstraints.Developability | FamilyConstraints.Kawasaki | FamilyConstraints.FoldSigns;
        // Roles read from the drape: a crease the cut keeps inside has both its faces, all draped.
        var mesh = RegularMiuraSheet.AssignRolesFromGeometry(new CreaseMesh("yoshimura", pos, faces, layers, (_, _) => CreaseRole.Flat));
        if (!trim) return new GeneratedPattern(mesh, constraints, stencils, anchor, 0);
        var cut = FootprintTrim.Trim(mesh, keep, stencils, anchor);
        return new GeneratedPattern(cut.Mesh, constraints, cut.FairnessStencils, cut.AnchorVertex, 0);
    }

    /// <summary>The closed-form ring a generated pattern uses on this target (radius, arc step, pitch).</summary>
    public static YoshimuraRing RingFor(ITargetSurface target, YoshimuraParameters p)
    {
        var vault = Vault(target);
        if (vault.Problem is { } problem) throw new ArgumentException(problem, nameof(target));
        int segments = CellCounts.Resolve(p.Segments, p.CellSize, vault.Radius * (vault.Theta1 - vault.Theta0), nameof(p.Segments));
        int rings = CellCounts.Resolve(p.Rings, p.CellSize, vault.Length, nameof(p.Rings));
        return new YoshimuraRing(vault.Radius, (vault.Theta1 - vault.Theta0) / segments, vault.Length / rings);
    }

    /// <summary>Triangle bases across the arc and ring steps along the axis that <see cref="Generate"/> uses.</summary>
    public static (int Segments, int Rings) Counts(ITargetSurface target, YoshimuraParameters p)
    {
        var vault = Vault(target);
        if (vault.Problem is { } problem) throw new ArgumentException(problem, nameof(target));
        return (CellCounts.Resolve(p.Segments, p.CellSize, vault.Radius * (vault.Theta1 - vault.Theta0), nameof(p.Segments)),
            CellCounts.Resolve(p.Rings, p.CellSize, vault.Length, nameof(p.Rings)));
    }

    /// <summary>Why this family cannot be built on the target, or null when it can: the advice asks this
    /// so that it never calls the family suited where the generator refuses.</summary>
    public static string? Problem(ITargetSurface target) => Vault(target).Problem;

    /// <summary>The vault the pattern is inscribed in: its axis in plan (along x, or along y when the
    /// target curves across x), the frame (u along the axis, w across it) that maps to plan by a quarter
    /// turn when the axis runs along y, the cross-section circle's radius and axis position w, and the
    /// footprint's extent in that frame.</summary>
    private sealed record VaultFrame(bool AxisAlongY, double Radius, double WAxis, double U0, double U1, double W0, double W1, string? Problem)
    {
        public double Length => U1 - U0;
        public double Theta0 => Math.Asin((W0 - WAxis) / Radius);
        public double Theta1 => Math.Asin((W1 - WAxis) / Radius);
        // A quarter turn (x, y) = (-w, u) keeps faces counter-clockwise.
        public Vec2 Plan(double u, double w) => AxisAlongY ? new Vec2(-w, u) : new Vec2(u, w);
    }

    /// <summary>The vault frame: exact for a <see cref="CylinderSurface"/> (axis along x through the
    /// origin); otherwise the axis runs across the direction in which the target bends more at the
    /// footprint centre (second differences of the height, x against y) and the circle is the osculating
    /// one there (1 / largest principal curvature).</summary>
    private static VaultFrame Vault(ITargetSurface target)
    {
        var fp = target.Footprint;
        double cx = 0.5 * (fp.MinX + fp.MaxX), cy = 0.5 * (fp.MinY + fp.MaxY);
        double radius, wAxis;
        bool alongY = false;
        if (target is CylinderSurface c) (radius, wAxis) = (c.Radius, 0);
        else
        {
            var k = target.CurvaturesAt(cx, cy);
            double kMax = Math.Max(Math.Abs(k.K1), Math.Abs(k.K2));
            if (!(kMax > 1e-9))
                return new VaultFrame(false, 0, 0, 0, 0, 0, 0, "the target is flat across its centre; a Yoshimura pattern needs a vault (a cylinder-like surface curved one way at its centre); use miura or free-triangulated");
            double step = 1e-3 * Math.Max(fp.Width, fp.Depth), z0 = target.HeightAt(cx, cy);
            double zxx = Math.Abs(target.HeightAt(cx + step, cy) - 2 * z0 + target.HeightAt(cx - step, cy));
            double zyy = Math.Abs(target.HeightAt(cx, cy + step) - 2 * z0 + target.HeightAt(cx, cy - step));
            alongY = zxx > zyy;
            radius = 1 / kMax;
            wAxis = alongY ? -cx : cy;
        }
        var frame = alongY
            ? new VaultFrame(true, radius, wAxis, fp.MinY, fp.MaxY, -fp.MaxX, -fp.MinX, null)
            : new VaultFrame(false, radius, wAxis, fp.MinX, fp.MaxX, fp.MinY, fp.MaxY, null);
        double reach = Math.Max(Math.Abs(frame.W0 - wAxis), Math.Abs(frame.W1 - wAxis));
        if (reach >= radius)
            return frame with { Problem = $"the footprint reaches {reach:0.###} m from the vault axis but the vault radius is {radius:0.###} m; use a narrower footprint" };
        return frame;
    }

    private static int RowLength(int j, int segments) => j % 2 == 0 ? segments + 1 : segments;

    private static int[] RowStarts(int segments, int rings)
    {
        var s = new int[rings + 2];
        for (int j = 0; j <= rings; j++) s[j + 1] = s[j] + RowLength(j, segments);
        return s;
    }

    /// <summary>Triangles between consecutive rows: the two rows' vertices merged by arc position
    /// alternate rows, so every consecutive triple is a triangle; oriented counter-clockwise in plan
    /// (x along the axis, arc position across).</summary>
    private static int[][] Faces(int segments, int rings, int[] rowStart)
    {
        var faces = new List<int[]>();
        for (int j = 0; j < rings; j++)
        {
            // Merged sequence by arc position s: even rows at integers, odd rows at half-integers.
            var seq = new List<(int V, double X, double S)>();
            for (int s2 = 0; s2 <= 2 * segments; s2++)
            {
                int row = (s2 % 2 == 0) == (j % 2 == 0) ? j : j + 1;
                seq.Add((rowStart[row] + s2 / 2, row, s2 * 0.5));
            }
            for (int k = 0; k + 2 < seq.Count; k++)
            {
                var (a, b, c) = (seq[k], seq[k + 1], seq[k + 2]);
                double area = (b.X - a.X) * (c.S - a.S) - (c.X - a.X) * (b.S - a.S);
                faces.Add(area > 0 ? [a.V, b.V, c.V] : [a.V, c.V, b.V]);
            }
        }
        return faces.ToArray();
    }

    /// <summary>Second differences along a ring (i-1, i, i+1: chords of one circle, whose second
    /// difference points along the normal) and along the axis (rows j-2, j, j+2: a straight line), both
    /// exactly tangentially zero on the closed-form state.</summary>
    private static int[] FairnessStencils(int segments, int rings, int[] rowStart)
    {
        var s = new List<int>();
        for (int j = 0; j <= rings; j++)
            for (int i = 0; i < RowLength(j, segments); i++)
            {
                int c = rowStart[j] + i;
                if (i >= 1 && i + 1 < RowLength(j, segments)) { s.Add(c - 1); s.Add(c); s.Add(c + 1); }
                if (j >= 2 && j + 2 <= rings) { s.Add(rowStart[j - 2] + i); s.Add(c); s.Add(rowStart[j + 2] + i); }
            }
        return s.ToArray();
    }
}
