using Tessel.Core.Fitting;
using Tessel.Core.LinearAlgebra;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Unfolding;

/// <summary>Develops a folded crease mesh to the plane: facets are laid flat across a breadth-first
/// spanning tree of the faces from the most central face (deterministic: neighbours in face-edge
/// order); where the folded mesh is not exactly developable (epsilon &gt; 0 or residuals left) the
/// mismatch is spread by a least-squares flattening of edge and quad-diagonal lengths (sparse
/// Gauss-Newton from the tree layout, one vertex and one direction fixed).</summary>
public static class MeshUnfolder
{
    /// <summary>An edge shorter than this share of the mean edge (or a facet smaller than its square) has no
    /// direction to lay flat: far below any crease a sheet could show, far above rounding.</summary>
    private const double DegenerateShare = 1e-6;

    /// <summary>Gauss-Newton iterations of the flattening; it converges in a handful, this only bounds a stall.</summary>
    private const int FlattenIterations = 30;

    /// <summary>The flattening stops at this sum of squared relative strains (exact to rounding) ...</summary>
    private const double ExactCost = 1e-30;

    /// <summary>... or when an iteration removes less than this share of it (rounding-level progress).</summary>
    private const double StalledCostShare = 1e-14;

    /// <summary>Diagonal added to the Gauss-Newton matrix so that it stays positive definite where a vertex
    /// has too few length rows; small against the unit-scaled rows.</summary>
    private const double FlattenDamping = 1e-12;

    /// <summary>The flat pattern; strain per edge is (flat - folded) / folded.</summary>
    /// <param name="solver">SPD solver for the flattening; default the fitter's default solver.</param>
    /// <param name="strainTolerance">Largest |strain| accepted from the tree layout before flattening.</param>
    /// <exception cref="ArithmeticException">The folded mesh has a non-finite position, an edge or quad diagonal of
    /// zero length or a facet of zero area (nothing to lay flat), or the flattening produced non-finite positions.</exception>
    public static FlatPattern Unfold(CreaseMesh mesh, ISpdSolver? solver = null, double strainTolerance = 1e-12)
    {
        CheckDevelopable(mesh);
        var flat = TreeLayout(mesh, out int anchor, out int direction);
        var (pairs, lengths) = LengthPairs(mesh);
        if (MaxStrain(flat, pairs, lengths) > strainTolerance)
            Flatten(flat, pairs, lengths, anchor, direction, solver ?? EpsilonConstraintFitter.DefaultSolver());
        int bad = Array.FindIndex(flat, c => !double.IsFinite(c));
        if (bad >= 0) throw new ArithmeticException($"the flattening gave vertex {bad / 2} a non-finite position");
        var strain = new double[mesh.EdgeCount];
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            int a = mesh.EdgeVertices[2 * e], b = mesh.EdgeVertices[2 * e + 1];
            double folded = (mesh.Vertex(b) - mesh.Vertex(a)).Length;
            strain[e] = (Dist(flat, a, b) - folded) / folded;
        }
        return new FlatPattern(mesh, flat, strain);
    }

    /// <summary>Number of pieces of the pattern: groups of facets connected across shared edges (not corners).</summary>
    public static int Pieces(CreaseMesh mesh)
    {
        var parent = Enumerable.Range(0, mesh.FaceCount).ToArray();
        int Find(int f) { while (parent[f] != f) f = parent[f] = parent[parent[f]]; return f; }
        for (int e = 0; e < mesh.EdgeCount; e++)
            if (mesh.IsInterior(e)) parent[Find(mesh.EdgeFaceLeft[e])] = Find(mesh.EdgeFaceRight[e]);
        int pieces = 0;
        for (int f = 0; f < mesh.FaceCount; f++) if (Find(f) == f) pieces++;
        return pieces;
    }

    /// <summary>Throws when the folded mesh has nothing well defined to lay flat: non-finite positions, edges or
    /// quad diagonals shorter than a millionth of the mean edge, or facets whose area is under a millionth of the
    /// mean edge squared (their plane, and so their flat shape, is undefined).</summary>
    private static void CheckDevelopable(CreaseMesh mesh)
    {
        int pieces = Pieces(mesh);
        if (pieces > 1) throw new ArithmeticException($"the pattern falls into {pieces} pieces that share no crease, so no one flat layout holds them");
        int nonFinite = Array.FindIndex(mesh.Positions, c => !double.IsFinite(c));
        if (nonFinite >= 0) throw new ArithmeticException($"vertex {nonFinite / 3} of the folded model has a non-finite position");
        double mean = 0;
        for (int e = 0; e < mesh.EdgeCount; e++) mean += (mesh.Vertex(mesh.EdgeVertices[2 * e + 1]) - mesh.Vertex(mesh.EdgeVertices[2 * e])).Length;
        mean /= Math.Max(1, mesh.EdgeCount);
        var (pairs, lengths) = LengthPairs(mesh);
        for (int k = 0; k < lengths.Length; k++)
            if (!(lengths[k] > DegenerateShare * mean))
                throw new ArithmeticException($"vertices {pairs[2 * k]} and {pairs[2 * k + 1]} of the folded model coincide (distance {lengths[k]:0.###E+0} m)");
        for (int f = 0; f < mesh.FaceCount; f++)
        {
            var face = mesh.Faces[f];
            var sum = Vec3.Zero;
            var o = mesh.Vertex(face[0]);
            for (int k = 1; k + 1 < face.Length; k++) sum += Vec3.Cross(mesh.Vertex(face[k]) - o, mesh.Vertex(face[k + 1]) - o);
            if (!(sum.Length / 2 > DegenerateShare * mean * mean))
                throw new ArithmeticException($"facet {f} of the folded model has no area (its corners are in a line)");
        }
    }

    /// <summary>#V*2 positions from laying every face flat across the spanning tree; vertices keep
    /// the position of the first face that placed them.</summary>
    public static double[] TreeLayout(CreaseMesh mesh, out int anchor, out int direction)
    {
        int nf = mesh.FaceCount;
        var centroid = Vec3.Zero;
        for (int v = 0; v < mesh.VertexCount; v++) centroid += mesh.Vertex(v);
        centroid /= mesh.VertexCount;
        int root = 0; double best = double.MaxValue;
        for (int f = 0; f < nf; f++)
        {
            var c = Vec3.Zero;
            foreach (int v in mesh.Faces[f]) c += mesh.Vertex(v);
            double d = (c / mesh.Faces[f].Length - centroid).LengthSquared;
            if (d < best) { best = d; root = f; }
        }
        var edgeOf = new Dictionary<(int, int), int>();
        for (int e = 0; e < mesh.EdgeCount; e++) edgeOf[(mesh.EdgeVertices[2 * e], mesh.EdgeVertices[2 * e + 1])] = e;

        var flat = new double[2 * mesh.VertexCount];
        var placed = new bool[mesh.VertexCount];
        var rootFace = mesh.Faces[root];
        anchor = rootFace[0]; direction = rootFace[1];
        var a3 = mesh.Vertex(anchor); var b3 = mesh.Vertex(direction);
        placed[anchor] = true;
        flat[2 * direction] = (b3 - a3).Length; placed[direction] = true;
        PlaceFace(mesh, root, anchor, direction, flat, placed);

        var visited = new bool[nf];
        visited[root] = true;
        var queue = new Queue<int>();
        queue.Enqueue(root);
        while (queue.Count > 0)
        {
            int f = queue.Dequeue();
            var face = mesh.Faces[f];
            for (int k = 0; k < face.Length; k++)
            {
                int a = face[k], b = face[(k + 1) % face.Length];
                int e = edgeOf[a < b ? (a, b) : (b, a)];
                int g = mesh.EdgeFaceLeft[e] == f ? mesh.EdgeFaceRight[e] : mesh.EdgeFaceLeft[e];
                if (g < 0 || visited[g]) continue;
                visited[g] = true;
                PlaceFace(mesh, g, a, b, flat, placed);
                queue.Enqueue(g);
            }
        }
        return flat;
    }

    /// <summary>Places the unplaced corners of face f from the placed hinge a-b, keeping their
    /// distances along and across the hinge in the face's own plane (counter-clockwise stays so).</summary>
    private static void PlaceFace(CreaseMesh mesh, int f, int a, int b, double[] flat, bool[] placed)
    {
        var n = mesh.FaceNormal(f);
        var a3 = mesh.Vertex(a);
        var e3 = (mesh.Vertex(b) - a3).Normalized();
        var across = Vec3.Cross(n, e3);
        var a2 = new Vec2(flat[2 * a], flat[2 * a + 1]);
        var e2 = (new Vec2(flat[2 * b], flat[2 * b + 1]) - a2).Normalized();
        foreach (int p in mesh.Faces[f])
        {
            if (placed[p]) continue;
            var d = mesh.Vertex(p) - a3;
            var q = a2 + Vec3.Dot(d, e3) * e2 + Vec3.Dot(d, across) * e2.Perp;
            flat[2 * p] = q.X; flat[2 * p + 1] = q.Y;
            placed[p] = true;
        }
    }

    /// <summary>Edges plus both diagonals of every quad (which fix the quad's shape), with folded lengths.</summary>
    private static (int[] Pairs, double[] Lengths) LengthPairs(CreaseMesh mesh)
    {
        var pairs = new List<int>(); var lengths = new List<double>();
        void Add(int a, int b) { pairs.Add(a); pairs.Add(b); lengths.Add((mesh.Vertex(b) - mesh.Vertex(a)).Length); }
        for (int e = 0; e < mesh.EdgeCount; e++) Add(mesh.EdgeVertices[2 * e], mesh.EdgeVertices[2 * e + 1]);
        foreach (var f in mesh.Faces)
            if (f.Length == 4) { Add(f[0], f[2]); Add(f[1], f[3]); }
        return (pairs.ToArray(), lengths.ToArray());
    }

    private static double Dist(double[] p, int a, int b) =>
        Math.Sqrt((p[2 * b] - p[2 * a]) * (p[2 * b] - p[2 * a]) + (p[2 * b + 1] - p[2 * a + 1]) * (p[2 * b + 1] - p[2 * a + 1]));

    private static double MaxStrain(double[] p, int[] pairs, double[] lengths)
    {
        double m = 0;
        for (int k = 0; k < lengths.Length; k++) m = Math.Max(m, Math.Abs(Dist(p, pairs[2 * k], pairs[2 * k + 1]) / lengths[k] - 1));
        return m;
    }

    /// <summary>Gauss-Newton on sum ((|p_i - p_j| - L) / L)^2 with the anchor fixed and the direction
    /// vertex free only along the anchor-direction line (removes the rigid motions).</summary>
    private static void Flatten(double[] p, int[] pairs, double[] lengths, int anchor, int direction, ISpdSolver solver)
    {
        int nv = p.Length / 2;
        // Unknown index of each coordinate (-1 = fixed). Rotate so the direction vertex lies on +x.
        var a0 = new Vec2(p[2 * anchor], p[2 * anchor + 1]);
        double angle = Math.Atan2(p[2 * direction + 1] - a0.Y, p[2 * direction] - a0.X);
        for (int v = 0; v < nv; v++)
        {
            var q = (new Vec2(p[2 * v], p[2 * v + 1]) - a0).Rotated(-angle);
            p[2 * v] = q.X; p[2 * v + 1] = q.Y;
        }
        var index = new int[2 * nv];
        int n = 0;
        for (int c = 0; c < 2 * nv; c++) index[c] = c / 2 == anchor || c == 2 * direction + 1 ? -1 : n++;
        var rhs = new double[n]; var step = new double[n];
        double previous = double.MaxValue;
        Span<int> ids = stackalloc int[4];
        Span<double> g = stackalloc double[4];
        for (int it = 0; it < FlattenIterations; it++)
        {
            var triplets = new List<(int, int, double)>(lengths.Length * 16);
            Array.Clear(rhs);
            double cost = 0;
            for (int k = 0; k < lengths.Length; k++)
            {
                int a = pairs[2 * k], b = pairs[2 * k + 1];
                double dx = p[2 * b] - p[2 * a], dy = p[2 * b + 1] - p[2 * a + 1], d = Math.Sqrt(dx * dx + dy * dy);
                double r = (d - lengths[k]) / lengths[k];
                cost += r * r;
                double ux = dx / (d * lengths[k]), uy = dy / (d * lengths[k]);
                ids[0] = index[2 * a]; ids[1] = index[2 * a + 1]; ids[2] = index[2 * b]; ids[3] = index[2 * b + 1];
                g[0] = -ux; g[1] = -uy; g[2] = ux; g[3] = uy;
                for (int i = 0; i < 4; i++)
                {
                    if (ids[i] < 0) continue;
                    rhs[ids[i]] -= g[i] * r;
                    for (int j = 0; j < 4; j++) if (ids[j] >= 0) triplets.Add((ids[i], ids[j], g[i] * g[j]));
                }
            }
            if (cost < ExactCost || previous - cost <= StalledCostShare * previous) break;
            previous = cost;
            for (int i = 0; i < n; i++) triplets.Add((i, i, FlattenDamping));
            var m = CsrMatrix.FromTriplets(n, n, triplets);
            Array.Clear(step);
            solver.Solve(m, rhs, step);
            for (int c = 0; c < 2 * nv; c++) if (index[c] >= 0) p[c] += step[index[c]];
        }
    }
}
