using Tessel.Core.Geometry;
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
        var (radius, yAxis) = VaultCircle(target);
        if (Math.Max(Math.Abs(fp.MinY - yAxis), Math.Abs(fp.MaxY - yAxis)) >= radius)
            throw new ArgumentException($"the footprint reaches {Math.Max(Math.Abs(fp.MinY - yAxis), Math.Abs(fp.MaxY - yAxis)):0.###} m from the vault axis but the vault radius is {radius:0.###} m; use a narrower footprint", nameof(target));
        double th0 = Math.Asin((fp.MinY - yAxis) / radius), th1 = Math.Asin((fp.MaxY - yAxis) / radius);
        int segments = CellCounts.Resolve(p.Segments, p.CellSize, radius * (th1 - th0), nameof(p.Segments));
        int rings = CellCounts.Resolve(p.Rings, p.CellSize, fp.Width, nameof(p.Rings));
        var ring = new YoshimuraRing(radius, (th1 - th0) / segments, fp.Width / rings);

        var rowStart = RowStarts(segments, rings);
        int n = rowStart[^1];
        var pos = new double[3 * n];
        var layers = new VertexLayer[n];
        for (int j = 0; j <= rings; j++)
            for (int i = 0; i < RowLength(j, segments); i++)
            {
                double theta = th0 + (i + (j % 2 == 1 ? 0.5 : 0)) * ring.ChordAngle;
                double x = fp.MinX + j * ring.AxialPitch, y = yAxis + radius * Math.Sin(theta);
                double z = target.HeightAt(x, y);
                if (!double.IsFinite(z))
                    throw new ArgumentException($"the pattern reaches ({x:0.###}, {y:0.###}) m where the target has no surface; use a smaller footprint", nameof(target));
                new Vec3(x, y, z).Write(pos, rowStart[j] + i);
                layers[rowStart[j] + i] = VertexLayer.Top;
            }
        var faces = Faces(segments, rings, rowStart);
        var mesh = RegularMiuraSheet.AssignRolesFromGeometry(
            new CreaseMesh("yoshimura", pos, faces, layers, (_, _) => CreaseRole.Flat));
        int mid = rings / 2;
        int anchor = rowStart[mid] + RowLength(mid, segments) / 2;
        return new GeneratedPattern(mesh,
            FamilyConstraints.Developability | FamilyConstraints.Kawasaki | FamilyConstraints.FoldSigns,
            FairnessStencils(segments, rings, rowStart), anchor, 0);
    }

    /// <summary>The closed-form ring a generated pattern uses on this target (radius, arc step, pitch).</summary>
    public static YoshimuraRing RingFor(ITargetSurface target, YoshimuraParameters p)
    {
        var fp = target.Footprint;
        var (radius, yAxis) = VaultCircle(target);
        double th0 = Math.Asin((fp.MinY - yAxis) / radius), th1 = Math.Asin((fp.MaxY - yAxis) / radius);
        int segments = CellCounts.Resolve(p.Segments, p.CellSize, radius * (th1 - th0), nameof(p.Segments));
        int rings = CellCounts.Resolve(p.Rings, p.CellSize, fp.Width, nameof(p.Rings));
        return new YoshimuraRing(radius, (th1 - th0) / segments, fp.Width / rings);
    }

    /// <summary>Radius of the vault's cross-section circle and the y of its axis: exact for a
    /// <see cref="CylinderSurface"/>, otherwise the osculating circle across the footprint centre.</summary>
    private static (double Radius, double YAxis) VaultCircle(ITargetSurface target)
    {
        if (target is CylinderSurface c) return (c.Radius, 0);
        var fp = target.Footprint;
        double cx = 0.5 * (fp.MinX + fp.MaxX), cy = 0.5 * (fp.MinY + fp.MaxY);
        var k = target.CurvaturesAt(cx, cy);
        double kMax = Math.Max(Math.Abs(k.K1), Math.Abs(k.K2));
        if (!(kMax > 1e-9))
            throw new ArgumentException("the target is flat across its centre; a Yoshimura pattern needs a vault (a cylinder-like surface curved across y)", nameof(target));
        return (1 / kMax, cy);
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
