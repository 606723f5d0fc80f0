using Tessel.Core.Geometry;

namespace Tessel.Core.Targets.Meshes;

/// <summary>A bounding-volume hierarchy of axis-aligned boxes over a triangle mesh, for nearest-point
/// queries and vertical ray casts in logarithmic time on typical meshes.</summary>
/// <remarks>Built top-down by splitting triangle centroids at the median of the longest axis; leaves
/// hold at most <see cref="LeafSize"/> triangles. Node i stores its box in <c>_box[6i..6i+5]</c>
/// (min x, y, z, max x, y, z); an inner node's children are <c>_left[i]</c> and <c>_left[i] + 1</c>;
/// a leaf has <c>_left[i] = -1</c> and owns <c>_order[_start[i] .. _start[i] + _count[i]]</c>.</remarks>
public sealed class TriangleBvh
{
    private const int LeafSize = 4;
    private readonly TriangleMesh _mesh;
    private readonly int[] _order;
    // Filled as lists while building, then frozen into arrays for fast queries.
    private List<double>? _boxList = new();
    private List<int>? _leftList = new(), _startList = new(), _countList = new();
    private readonly double[] _box;
    private readonly int[] _left, _start, _count;

    /// <summary>Builds the hierarchy over <paramref name="mesh"/> (kept by reference; do not change it afterwards).</summary>
    public TriangleBvh(TriangleMesh mesh)
    {
        _mesh = mesh;
        int n = mesh.TriangleCount;
        _order = Enumerable.Range(0, n).ToArray();
        var centroid = new double[3 * n];
        for (int t = 0; t < n; t++)
            for (int k = 0; k < 3; k++)
                centroid[3 * t + k] = (Coord(t, 0, k) + Coord(t, 1, k) + Coord(t, 2, k)) / 3;
        NewNode();
        Build(0, 0, n, centroid);
        _box = _boxList!.ToArray(); _left = _leftList!.ToArray(); _start = _startList!.ToArray(); _count = _countList!.ToArray();
        _boxList = null; _leftList = _startList = _countList = null;
    }

    /// <summary>Deepest possible tree for int-sized meshes is far below this; sized for the query stacks.</summary>
    private const int MaxStack = 128;

    private double Coord(int tri, int corner, int axis) => _mesh.Positions[3 * _mesh.Triangles[3 * tri + corner] + axis];

    private int NewNode()
    {
        for (int k = 0; k < 6; k++) _boxList!.Add(0);
        _leftList!.Add(-1); _startList!.Add(0); _countList!.Add(0);
        return _leftList.Count - 1;
    }

    private void Build(int node, int start, int count, double[] centroid)
    {
        var lo = new[] { double.MaxValue, double.MaxValue, double.MaxValue };
        var hi = new[] { double.MinValue, double.MinValue, double.MinValue };
        var clo = (double[])lo.Clone();
        var chi = (double[])hi.Clone();
        for (int i = start; i < start + count; i++)
        {
            int t = _order[i];
            for (int k = 0; k < 3; k++)
            {
                for (int c = 0; c < 3; c++)
                {
                    double v = Coord(t, c, k);
                    lo[k] = Math.Min(lo[k], v); hi[k] = Math.Max(hi[k], v);
                }
                clo[k] = Math.Min(clo[k], centroid[3 * t + k]); chi[k] = Math.Max(chi[k], centroid[3 * t + k]);
            }
        }
        for (int k = 0; k < 3; k++) { _boxList![6 * node + k] = lo[k]; _boxList![6 * node + 3 + k] = hi[k]; }
        if (count <= LeafSize)
        {
            _startList![node] = start; _countList![node] = count;
            return;
        }
        int axis = 0;
        for (int k = 1; k < 3; k++) if (chi[k] - clo[k] > chi[axis] - clo[axis]) axis = k;
        int half = count / 2;
        // Sorting by centroid then by index keeps the tree, and so every query, deterministic.
        Array.Sort(_order, start, count, Comparer<int>.Create((a, b) =>
        {
            int c = centroid[3 * a + axis].CompareTo(centroid[3 * b + axis]);
            return c != 0 ? c : a.CompareTo(b);
        }));
        int left = NewNode();
        NewNode();
        _leftList![node] = left;
        Build(left, start, half, centroid);
        Build(left + 1, start + half, count - half, centroid);
    }

    private double BoxDistanceSquared(int node, Vec3 p)
    {
        double d = 0;
        double v = Math.Max(Math.Max(_box[6 * node] - p.X, 0), p.X - _box[6 * node + 3]); d += v * v;
        v = Math.Max(Math.Max(_box[6 * node + 1] - p.Y, 0), p.Y - _box[6 * node + 4]); d += v * v;
        v = Math.Max(Math.Max(_box[6 * node + 2] - p.Z, 0), p.Z - _box[6 * node + 5]); d += v * v;
        return d;
    }

    private Vec3 Vertex(int tri, int corner) => Vec3.Read(_mesh.Positions, _mesh.Triangles[3 * tri + corner]);

    /// <summary>The triangle nearest to <paramref name="p"/> and the barycentric weights of the nearest
    /// point on it. Ties go to the lower triangle index.</summary>
    public (int Triangle, double U, double V, double W) Closest(Vec3 p)
    {
        double best = double.MaxValue;
        (int, double, double, double) result = (-1, 0, 0, 0);
        Span<int> stack = stackalloc int[MaxStack];
        int top = 0;
        stack[top++] = 0;
        while (top > 0)
        {
            int node = stack[--top];
            if (BoxDistanceSquared(node, p) > best) continue;
            if (_left[node] < 0)
            {
                for (int i = _start[node]; i < _start[node] + _count[node]; i++)
                {
                    int t = _order[i];
                    Vec3 a = Vertex(t, 0), b = Vertex(t, 1), c = Vertex(t, 2);
                    var (u, v, w) = TriangleClosestPoint.Find(p, a, b, c);
                    double d = (p - (u * a + v * b + w * c)).LengthSquared;
                    if (d < best || (d == best && t < result.Item1)) { best = d; result = (t, u, v, w); }
                }
                continue;
            }
            int l = _left[node], r = l + 1;
            double dl = BoxDistanceSquared(l, p), dr = BoxDistanceSquared(r, p);
            // Visit the nearer child first (pushed last).
            if (dl <= dr) { stack[top++] = r; stack[top++] = l; } else { stack[top++] = l; stack[top++] = r; }
        }
        return result;
    }

    /// <summary>The highest point where the vertical line through (x, y) meets the mesh: triangle and
    /// barycentric weights, or triangle -1 when it misses.</summary>
    public (int Triangle, double U, double V, double W) HighestAbove(double x, double y)
    {
        double bestZ = double.NegativeInfinity;
        (int, double, double, double) result = (-1, 0, 0, 0);
        Span<int> stack = stackalloc int[MaxStack];
        int top = 0;
        stack[top++] = 0;
        while (top > 0)
        {
            int node = stack[--top];
            if (x < _box[6 * node] || x > _box[6 * node + 3] || y < _box[6 * node + 1] || y > _box[6 * node + 4]) continue;
            if (_box[6 * node + 5] <= bestZ) continue;
            if (_left[node] >= 0) { stack[top++] = _left[node]; stack[top++] = _left[node] + 1; continue; }
            for (int i = _start[node]; i < _start[node] + _count[node]; i++)
            {
                int t = _order[i];
                Vec3 a = Vertex(t, 0), b = Vertex(t, 1), c = Vertex(t, 2);
                double det = (b.X - a.X) * (c.Y - a.Y) - (c.X - a.X) * (b.Y - a.Y);
                if (det == 0) continue; // vertical triangle: no single height
                double v = ((x - a.X) * (c.Y - a.Y) - (c.X - a.X) * (y - a.Y)) / det;
                double w = ((b.X - a.X) * (y - a.Y) - (x - a.X) * (b.Y - a.Y)) / det;
                double u = 1 - v - w;
                const double tol = -1e-12;
                if (u < tol || v < tol || w < tol) continue;
                double z = u * a.Z + v * b.Z + w * c.Z;
                if (z > bestZ) { bestZ = z; result = (t, u, v, w); }
            }
        }
        return result;
    }
}
