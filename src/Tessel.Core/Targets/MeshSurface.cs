using NetTopologySuite.Geometries;
using NetTopologySuite.Operation.Buffer;
using NetTopologySuite.Operation.Union;
using NetTopologySuite.Simplify;
using Tessel.Core.Geometry;
using Tessel.Core.Targets.Meshes;

namespace Tessel.Core.Targets;

/// <summary>A target given as a triangle mesh in metres, seen from above: heights by a vertical ray
/// cast (highest hit), normals and curvatures interpolated from per-vertex values, closest points
/// through a bounding-volume hierarchy.</summary>
/// <remarks>
/// Triangles are treated as oriented upward (any whose normal points down is flipped), so normals
/// have z &gt;= 0 like every other target. Vertex normals weight each incident triangle's normal by
/// its corner angle (Thürmer and Wüthrich, "Computing vertex normals from polygonal facets", 1998).
/// <para>Curvatures are an ESTIMATE: at each vertex a quadric h = a u^2 + b u v + c v^2 + d u + e v is
/// fitted by least squares to its two-ring neighbours in a frame whose h axis is the vertex normal,
/// and the principal curvatures of that fitted graph are taken (the osculating-jet idea of Cazals and
/// Pouget, "Estimating differential quantities using polynomial fitting of osculating jets", SGP 2003,
/// at degree 2). Accuracy depends on the mesh's sampling and noise; on a sphere of radius R meshed
/// with spacing h the error is of order (h/R)^2.</para></remarks>
public sealed class MeshSurface : ITargetSurface
{
    private readonly TriangleMesh _mesh;
    private readonly TriangleBvh _bvh;
    private readonly Vec3[] _normals;
    private readonly Curvatures[] _curvatures;

    /// <param name="mesh">Mesh in metres.</param>
    /// <param name="footprint">Plan region; null = the mesh's plan outline (<see cref="PlanOutline"/>).</param>
    /// <param name="name">File name, for the description.</param>
    public MeshSurface(TriangleMesh mesh, Footprint? footprint, string name)
    {
        _mesh = OrientUp(mesh);
        _bvh = new TriangleBvh(_mesh);
        _normals = VertexNormals(_mesh);
        _curvatures = VertexCurvatures(_mesh, _normals);
        Footprint = footprint ?? PlanOutline(_mesh);
        Name = name;
        for (int i = 2; i < _mesh.Positions.Length; i += 3)
        {
            _midZ += _mesh.Positions[i];
        }
        _midZ /= Math.Max(1, _mesh.Positions.Length / 3);
    }

    /// <summary>Mean vertex height: the query height for normals off the mesh in plan.</summary>
    private readonly double _midZ;

    /// <summary>File name the mesh came from.</summary>
    public string Name { get; }
    public string Description => $"mesh {Name}: {_mesh.VertexCount} vertices, {_mesh.TriangleCount} triangles";
    public Footprint Footprint { get; }

    /// <summary>The mesh as used (triangles oriented upward).</summary>
    public TriangleMesh Mesh => _mesh;

    public double HeightAt(double x, double y)
    {
        var (t, u, v, w) = _bvh.HighestAbove(x, y);
        if (t < 0) return double.NaN;
        return u * Z(t, 0) + v * Z(t, 1) + w * Z(t, 2);
    }

    public Vec3 NormalAt(double x, double y)
    {
        var (t, u, v, w) = _bvh.HighestAbove(x, y);
        // Off the mesh in plan (a pattern's zig-zag overhangs its footprint) the nearest point's
        // normal is the useful answer for fitting; heights stay undefined there.
        if (t < 0) return ClosestPoint(new Vec3(x, y, _midZ)).Normal;
        return Blend(t, u, v, w);
    }

    public Curvatures CurvaturesAt(double x, double y)
    {
        var (t, u, v, w) = _bvh.HighestAbove(x, y);
        if (t < 0) return new Curvatures(double.NaN, double.NaN);
        var (a, b, c) = Corners(t);
        return new Curvatures(
            u * _curvatures[a].K1 + v * _curvatures[b].K1 + w * _curvatures[c].K1,
            u * _curvatures[a].K2 + v * _curvatures[b].K2 + w * _curvatures[c].K2);
    }

    public SurfacePoint ClosestPoint(Vec3 p)
    {
        var (t, u, v, w) = _bvh.Closest(p);
        var (a, b, c) = Corners(t);
        var q = u * Vec3.Read(_mesh.Positions, a) + v * Vec3.Read(_mesh.Positions, b) + w * Vec3.Read(_mesh.Positions, c);
        var n = Blend(t, u, v, w);
        // Off the mesh in plan the nearest point lies on its border, and the distance to it grows with
        // the point's reach past the border, which moving along the normal cannot undo: the fit's
        // distance rows would pull a pattern's edge vertex inward forever. There the surface is taken
        // to continue along its tangent plane at the border point, so the distance is the normal part.
        if (_bvh.HighestAbove(p.X, p.Y).Triangle < 0)
        {
            double along = Vec3.Dot(p - q, n);
            return new SurfacePoint(p - along * n, n, along);
        }
        double dist = (p - q).Length;
        return new SurfacePoint(q, n, Vec3.Dot(p - q, n) >= 0 ? dist : -dist);
    }

    private (int, int, int) Corners(int t) => (_mesh.Triangles[3 * t], _mesh.Triangles[3 * t + 1], _mesh.Triangles[3 * t + 2]);

    private double Z(int t, int corner) => _mesh.Positions[3 * _mesh.Triangles[3 * t + corner] + 2];

    private Vec3 Blend(int t, double u, double v, double w)
    {
        var (a, b, c) = Corners(t);
        return (u * _normals[a] + v * _normals[b] + w * _normals[c]).Normalized();
    }

    private static Vec3 FaceNormal(TriangleMesh m, int t)
    {
        var a = Vec3.Read(m.Positions, m.Triangles[3 * t]);
        var b = Vec3.Read(m.Positions, m.Triangles[3 * t + 1]);
        var c = Vec3.Read(m.Positions, m.Triangles[3 * t + 2]);
        return Vec3.Cross(b - a, c - a);
    }

    private static TriangleMesh OrientUp(TriangleMesh m)
    {
        var tris = (int[])m.Triangles.Clone();
        for (int t = 0; t < m.TriangleCount; t++)
            if (FaceNormal(m, t).Z < 0) (tris[3 * t + 1], tris[3 * t + 2]) = (tris[3 * t + 2], tris[3 * t + 1]);
        return new TriangleMesh(m.Positions, tris);
    }

    /// <summary>Simplification tolerance of the plan outline over the plan's larger side: 0.1 mm on a
    /// 10 m mesh, far below any cell; the outline is then moved inward by twice this, so every point on
    /// it lies over a triangle and has a height.</summary>
    public const double OutlineTolerance = 1e-5;

    /// <summary>The mesh's plan outline: the union of its triangles projected on the xy-plane
    /// (NetTopologySuite's cascaded union), simplified and moved slightly inward. A plan that fills its
    /// bounding box gives that box (a rectangle footprint); a plan in several pieces gives the largest
    /// piece, and holes stay undefined (the domain check names a point in one).</summary>
    public static Footprint PlanOutline(TriangleMesh m)
    {
        double x0 = double.MaxValue, x1 = double.MinValue, y0 = double.MaxValue, y1 = double.MinValue;
        for (int i = 0; i < m.VertexCount; i++)
        {
            x0 = Math.Min(x0, m.Positions[3 * i]); x1 = Math.Max(x1, m.Positions[3 * i]);
            y0 = Math.Min(y0, m.Positions[3 * i + 1]); y1 = Math.Max(y1, m.Positions[3 * i + 1]);
        }
        if (!(x1 > x0) || !(y1 > y0)) throw new Jobs.JobError("target.mesh", "the mesh has no extent in plan (seen from above it is a line or a point)");
        var factory = new GeometryFactory(new PrecisionModel(PrecisionModels.Floating));
        var pieces = new List<NetTopologySuite.Geometries.Geometry>(m.TriangleCount);
        for (int t = 0; t < m.TriangleCount; t++)
        {
            var c = new Coordinate[4];
            for (int k = 0; k < 3; k++)
            {
                int v = m.Triangles[3 * t + k];
                c[k] = new Coordinate(m.Positions[3 * v], m.Positions[3 * v + 1]);
            }
            c[3] = c[0].Copy();
            // Triangles seen edge-on from above cover no plan area.
            double area = (c[1].X - c[0].X) * (c[2].Y - c[0].Y) - (c[2].X - c[0].X) * (c[1].Y - c[0].Y);
            if (Math.Abs(area) <= 1e-12 * (x1 - x0) * (y1 - y0)) continue;
            pieces.Add(factory.CreatePolygon(c));
        }
        // A mesh seen edge-on from above (a wall) covers no plan area: its box is kept, and the domain
        // check then names the point where it has no height.
        if (pieces.Count == 0) return Footprint.Box(x0, y0, x1, y1);
        var union = CascadedPolygonUnion.Union(pieces);
        var outer = LargestPolygon(union);
        if (outer is null || factory.CreatePolygon(outer.Shell.Coordinates).Area >= (1 - 1e-9) * (x1 - x0) * (y1 - y0))
            return Footprint.Box(x0, y0, x1, y1);
        double tol = OutlineTolerance * Math.Max(x1 - x0, y1 - y0);
        var simple = TopologyPreservingSimplifier.Simplify(factory.CreatePolygon(outer.Shell.Coordinates), tol);
        var inner = simple.Buffer(-2 * tol, new BufferParameters { JoinStyle = JoinStyle.Mitre, MitreLimit = 2, QuadrantSegments = 2 });
        var ring = LargestPolygon(inner) ?? outer;
        var corners = ring.Shell.Coordinates;
        int n = corners.Length > 1 && corners[0].Equals2D(corners[^1]) ? corners.Length - 1 : corners.Length;
        return Footprint.Polygon(corners.Take(n).Select(c => new Vec2(c.X, c.Y)).ToArray());
    }

    private static Polygon? LargestPolygon(NetTopologySuite.Geometries.Geometry g)
    {
        Polygon? best = null;
        for (int i = 0; i < g.NumGeometries; i++)
            if (g.GetGeometryN(i) is Polygon p && (best is null || p.Area > best.Area)) best = p;
        return best;
    }

    private static Vec3[] VertexNormals(TriangleMesh m)
    {
        var n = new Vec3[m.VertexCount];
        for (int t = 0; t < m.TriangleCount; t++)
        {
            var fn = FaceNormal(m, t).Normalized();
            for (int k = 0; k < 3; k++)
            {
                int i = m.Triangles[3 * t + k];
                var p = Vec3.Read(m.Positions, i);
                var e1 = Vec3.Read(m.Positions, m.Triangles[3 * t + (k + 1) % 3]) - p;
                var e2 = Vec3.Read(m.Positions, m.Triangles[3 * t + (k + 2) % 3]) - p;
                n[i] += Vec3.Angle(e1, e2) * fn;
            }
        }
        for (int i = 0; i < n.Length; i++) n[i] = n[i].Normalized();
        return n;
    }

    private static Curvatures[] VertexCurvatures(TriangleMesh m, Vec3[] normals)
    {
        var ring = new HashSet<int>[m.VertexCount];
        for (int i = 0; i < ring.Length; i++) ring[i] = new HashSet<int>();
        for (int t = 0; t < m.TriangleCount; t++)
            for (int k = 0; k < 3; k++)
                for (int j = 0; j < 3; j++)
                    if (j != k) ring[m.Triangles[3 * t + k]].Add(m.Triangles[3 * t + j]);
        var result = new Curvatures[m.VertexCount];
        var near = new SortedSet<int>();
        for (int i = 0; i < m.VertexCount; i++)
        {
            near.Clear();
            foreach (int j in ring[i]) { near.Add(j); foreach (int k in ring[j]) near.Add(k); }
            near.Remove(i);
            result[i] = FitQuadric(m, i, normals[i], near);
        }
        return result;
    }

    private static Curvatures FitQuadric(TriangleMesh m, int i, Vec3 n, SortedSet<int> near)
    {
        if (near.Count < 5 || !n.IsFinite || n.Length == 0) return new Curvatures(0, 0);
        var p = Vec3.Read(m.Positions, i);
        // Any unit vector not parallel to n starts the tangent frame.
        var helper = Math.Abs(n.X) < 0.9 ? new Vec3(1, 0, 0) : new Vec3(0, 1, 0);
        var t1 = Vec3.Cross(helper, n).Normalized();
        var t2 = Vec3.Cross(n, t1);
        // Lengths are divided by the mean neighbour distance so the normal equations stay well scaled.
        double scale = 0;
        foreach (int j in near) scale += (Vec3.Read(m.Positions, j) - p).Length;
        scale /= near.Count;
        if (!(scale > 0)) return new Curvatures(0, 0);
        var ata = new double[5, 5];
        var atb = new double[5];
        Span<double> row = stackalloc double[5];
        foreach (int j in near)
        {
            var d = (Vec3.Read(m.Positions, j) - p) / scale;
            double u = Vec3.Dot(d, t1), v = Vec3.Dot(d, t2), h = Vec3.Dot(d, n);
            row[0] = u * u; row[1] = u * v; row[2] = v * v; row[3] = u; row[4] = v;
            for (int r = 0; r < 5; r++)
            {
                atb[r] += row[r] * h;
                for (int c = 0; c < 5; c++) ata[r, c] += row[r] * row[c];
            }
        }
        var q = SolveSmall(ata, atb);
        if (q is null) return new Curvatures(0, 0);
        // Undo the scaling: quadratic coefficients carry 1/scale, linear ones none.
        return GraphSurface.CurvaturesOf(new HeightJet(0, q[3], q[4], 2 * q[0] / scale, q[1] / scale, 2 * q[2] / scale));
    }

    /// <summary>Solves the small dense system a x = b by Gaussian elimination with partial pivoting;
    /// null when it is singular (neighbours on a line).</summary>
    private static double[]? SolveSmall(double[,] a, double[] b)
    {
        int n = b.Length;
        double norm = 0;
        for (int r = 0; r < n; r++) for (int c = 0; c < n; c++) norm = Math.Max(norm, Math.Abs(a[r, c]));
        for (int k = 0; k < n; k++)
        {
            int piv = k;
            for (int r = k + 1; r < n; r++) if (Math.Abs(a[r, k]) > Math.Abs(a[piv, k])) piv = r;
            if (Math.Abs(a[piv, k]) <= 1e-12 * norm) return null;
            if (piv != k)
            {
                for (int c = 0; c < n; c++) (a[k, c], a[piv, c]) = (a[piv, c], a[k, c]);
                (b[k], b[piv]) = (b[piv], b[k]);
            }
            for (int r = k + 1; r < n; r++)
            {
                double f = a[r, k] / a[k, k];
                for (int c = k; c < n; c++) a[r, c] -= f * a[k, c];
                b[r] -= f * b[k];
            }
        }
        var x = new double[n];
        for (int r = n - 1; r >= 0; r--)
        {
            double sum = b[r];
            for (int c = r + 1; c < n; c++) sum -= a[r, c] * x[c];
            x[r] = sum / a[r, r];
        }
        return x.All(double.IsFinite) ? x : null;
    }
}
