using Tessel.Core.Geometry;

namespace Tessel.Core.Model;

/// <summary>A folded crease pattern as plain arrays: the single mesh type every stage after the
/// generator reads. Immutable by convention: stages copy <see cref="Positions"/> before changing it.</summary>
/// <remarks>
/// Invariants: faces are simple polygons listed counter-clockwise seen from the top side; every edge
/// appears once with V0 &lt; V1; an edge has one or two faces (FaceRight = -1 on the boundary);
/// edges are sorted by (V0, V1) so that indices are deterministic for a given face list.
/// </remarks>
public sealed class CreaseMesh
{
    /// <summary>#V*3 vertex positions x0 y0 z0 x1 ... in metres (full scale), folded state.</summary>
    public double[] Positions { get; }
    /// <summary>#F faces, each a list of vertex indices, counter-clockwise seen from the top side.</summary>
    public int[][] Faces { get; }
    /// <summary>#E*2 edge end points (V0 &lt; V1).</summary>
    public int[] EdgeVertices { get; }
    /// <summary>#E face on the left of V0 -&gt; V1 seen from the top side (-1 if none).</summary>
    public int[] EdgeFaceLeft { get; }
    /// <summary>#E face on the right of V0 -&gt; V1 (-1 if none).</summary>
    public int[] EdgeFaceRight { get; }
    /// <summary>#E role of each edge.</summary>
    public CreaseRole[] EdgeRoles { get; }
    /// <summary>#V which surface each vertex should lie on.</summary>
    public VertexLayer[] Layers { get; }
    /// <summary>Name of the family that made this pattern ("miura", "yoshimura", ...).</summary>
    public string Family { get; }

    public int VertexCount => Positions.Length / 3;
    public int FaceCount => Faces.Length;
    public int EdgeCount => EdgeRoles.Length;

    /// <summary>Builds the edge table from the faces. <paramref name="roleOf"/> gives the role of each
    /// interior edge (v0 &lt; v1); boundary edges are always <see cref="CreaseRole.Boundary"/>.</summary>
    public CreaseMesh(string family, double[] positions, int[][] faces, VertexLayer[] layers,
        Func<int, int, CreaseRole> roleOf)
    {
        if (positions.Length % 3 != 0) throw new ArgumentException("positions must hold 3 numbers per vertex");
        if (layers.Length != positions.Length / 3) throw new ArgumentException("one layer per vertex");
        Family = family;
        Positions = positions;
        Faces = faces;
        Layers = layers;

        var map = new Dictionary<(int, int), (int Left, int Right)>();
        for (int f = 0; f < faces.Length; f++)
        {
            var face = faces[f];
            for (int k = 0; k < face.Length; k++)
            {
                int a = face[k], b = face[(k + 1) % face.Length];
                var key = a < b ? (a, b) : (b, a);
                map.TryGetValue(key, out var lr);
                if (!map.ContainsKey(key)) lr = (-1, -1);
                // Face traverses a -> b counter-clockwise, so it lies on the left of a -> b.
                if (a < b)
                {
                    if (lr.Left >= 0) throw new ArgumentException($"edge {a}-{b} used twice in the same direction (faces inconsistently oriented)");
                    lr.Left = f;
                }
                else
                {
                    if (lr.Right >= 0) throw new ArgumentException($"edge {b}-{a} used twice in the same direction (faces inconsistently oriented)");
                    lr.Right = f;
                }
                map[key] = lr;
            }
        }
        var keys = map.Keys.OrderBy(k => k.Item1).ThenBy(k => k.Item2).ToArray();
        EdgeVertices = new int[keys.Length * 2];
        EdgeFaceLeft = new int[keys.Length];
        EdgeFaceRight = new int[keys.Length];
        EdgeRoles = new CreaseRole[keys.Length];
        for (int e = 0; e < keys.Length; e++)
        {
            var (v0, v1) = keys[e];
            var lr = map[keys[e]];
            EdgeVertices[2 * e] = v0; EdgeVertices[2 * e + 1] = v1;
            // Keep boundary edges with their face on the left for simpler walking.
            EdgeFaceLeft[e] = lr.Left; EdgeFaceRight[e] = lr.Right;
            EdgeRoles[e] = lr.Left >= 0 && lr.Right >= 0 ? roleOf(v0, v1) : CreaseRole.Boundary;
        }
    }

    private CreaseMesh(CreaseMesh source, double[] positions, CreaseRole[] roles)
    {
        Family = source.Family; Faces = source.Faces; Layers = source.Layers;
        EdgeVertices = source.EdgeVertices; EdgeFaceLeft = source.EdgeFaceLeft;
        EdgeFaceRight = source.EdgeFaceRight; EdgeRoles = roles;
        Positions = positions;
    }

    /// <summary>The same pattern with other edge roles (one per edge; boundary edges must stay boundary).</summary>
    public CreaseMesh WithRoles(CreaseRole[] roles)
    {
        if (roles.Length != EdgeCount) throw new ArgumentException("one role per edge");
        for (int e = 0; e < EdgeCount; e++)
            if ((roles[e] == CreaseRole.Boundary) != !IsInterior(e)) throw new ArgumentException($"edge {e}: only outline edges are boundary");
        return new CreaseMesh(this, Positions, roles);
    }

    /// <summary>The same pattern with other vertex positions (topology and roles shared).</summary>
    public CreaseMesh WithPositions(double[] positions)
    {
        if (positions.Length != Positions.Length) throw new ArgumentException("vertex count must not change");
        return new CreaseMesh(this, positions, EdgeRoles);
    }

    public Vec3 Vertex(int i) => Vec3.Read(Positions, i);

    /// <summary>True when an edge is shared by two faces.</summary>
    public bool IsInterior(int edge) => EdgeFaceLeft[edge] >= 0 && EdgeFaceRight[edge] >= 0;

    /// <summary>Vertices that lie on a boundary edge.</summary>
    public bool[] BoundaryVertices()
    {
        var b = new bool[VertexCount];
        for (int e = 0; e < EdgeCount; e++)
            if (!IsInterior(e)) { b[EdgeVertices[2 * e]] = true; b[EdgeVertices[2 * e + 1]] = true; }
        return b;
    }

    /// <summary>Signed fold angle of an interior edge in radians, in (-pi, pi): 0 when the two faces are
    /// coplanar, positive for a mountain (ridge toward the top side), negative for a valley.
    /// Faces are treated as planar through their first three corners around the edge.</summary>
    public double FoldAngle(int edge)
    {
        int fl = EdgeFaceLeft[edge], fr = EdgeFaceRight[edge];
        if (fl < 0 || fr < 0) return 0;
        var a = Vertex(EdgeVertices[2 * edge]);
        var b = Vertex(EdgeVertices[2 * edge + 1]);
        var axis = (b - a).Normalized();
        var nl = FaceNormal(fl);
        var nr = FaceNormal(fr);
        // Rotation from the left normal to the right normal about the edge axis a->b.
        double angle = Math.Atan2(Vec3.Dot(Vec3.Cross(nl, nr), axis), Vec3.Dot(nl, nr));
        // Left face lies left of a->b seen from the top: rotating its normal toward the right face's
        // by a positive angle about a->b means the right face tilts down, i.e. a mountain.
        return angle;
    }

    /// <summary>Unit normal of a face by Newell's method (top side): exact for planar faces, a
    /// best-fit plane's normal otherwise.</summary>
    public Vec3 FaceNormal(int face)
    {
        var f = Faces[face];
        double nx = 0, ny = 0, nz = 0;
        for (int k = 0; k < f.Length; k++)
        {
            var p = Vertex(f[k]); var q = Vertex(f[(k + 1) % f.Length]);
            nx += (p.Y - q.Y) * (p.Z + q.Z);
            ny += (p.Z - q.Z) * (p.X + q.X);
            nz += (p.X - q.X) * (p.Y + q.Y);
        }
        return new Vec3(nx, ny, nz).Normalized();
    }
}
