namespace Tessel.Core.Checks;

/// <summary>Bounding-volume hierarchy of axis-aligned boxes over triangles, split at the median of the longest
/// centroid extent; enumerates the triangle pairs whose boxes overlap (self-collision broad phase).</summary>
internal sealed class TriangleBoxTree
{
    private const int LeafSize = 4;
    private readonly double[] _boxes;   // #T*6 min xyz, max xyz per triangle
    private readonly int[] _order;      // triangles, grouped by leaf
    private readonly List<Node> _nodes = [];

    private readonly record struct Node(double[] Box, int Left, int Right, int Start, int Count)
    {
        public bool IsLeaf => Left < 0;
    }

    /// <param name="boxes">#T*6 per-triangle boxes: min x, y, z, max x, y, z (already padded by any tolerance).</param>
    public TriangleBoxTree(double[] boxes)
    {
        _boxes = boxes;
        int n = boxes.Length / 6;
        _order = Enumerable.Range(0, n).ToArray();
        if (n > 0) Build(0, n);
    }

    private int Build(int start, int count)
    {
        var box = new double[] { double.PositiveInfinity, double.PositiveInfinity, double.PositiveInfinity,
                                 double.NegativeInfinity, double.NegativeInfinity, double.NegativeInfinity };
        for (int k = start; k < start + count; k++)
            for (int a = 0; a < 3; a++)
            {
                box[a] = Math.Min(box[a], _boxes[6 * _order[k] + a]);
                box[a + 3] = Math.Max(box[a + 3], _boxes[6 * _order[k] + a + 3]);
            }
        int index = _nodes.Count;
        _nodes.Add(new Node(box, -1, -1, start, count));
        if (count <= LeafSize) return index;
        int axis = 0;
        for (int a = 1; a < 3; a++) if (box[a + 3] - box[a] > box[axis + 3] - box[axis]) axis = a;
        double Centre(int t) => _boxes[6 * t + axis] + _boxes[6 * t + axis + 3];
        Array.Sort(_order, start, count, Comparer<int>.Create((p, q) =>
        {
            int c = Centre(p).CompareTo(Centre(q));
            return c != 0 ? c : p.CompareTo(q);
        }));
        int half = count / 2;
        int left = Build(start, half);
        int right = Build(start + half, count - half);
        _nodes[index] = _nodes[index] with { Left = left, Right = right };
        return index;
    }

    /// <summary>Calls <paramref name="visit"/>(i, j), i &lt; j, for every pair of triangles whose boxes overlap.</summary>
    public void OverlappingPairs(Action<int, int> visit)
    {
        if (_nodes.Count == 0) return;
        var stack = new Stack<(int, int)>();
        stack.Push((0, 0));
        while (stack.Count > 0)
        {
            var (a, b) = stack.Pop();
            var na = _nodes[a]; var nb = _nodes[b];
            if (a == b)
            {
                if (na.IsLeaf)
                {
                    for (int p = na.Start; p < na.Start + na.Count; p++)
                        for (int q = p + 1; q < na.Start + na.Count; q++) Emit(_order[p], _order[q], visit);
                }
                else { stack.Push((na.Left, na.Left)); stack.Push((na.Right, na.Right)); stack.Push((na.Left, na.Right)); }
                continue;
            }
            if (!Overlap(na.Box, 0, nb.Box, 0)) continue;
            if (na.IsLeaf && nb.IsLeaf)
            {
                for (int p = na.Start; p < na.Start + na.Count; p++)
                    for (int q = nb.Start; q < nb.Start + nb.Count; q++) Emit(_order[p], _order[q], visit);
            }
            else if (nb.IsLeaf || (!na.IsLeaf && na.Count >= nb.Count)) { stack.Push((na.Left, b)); stack.Push((na.Right, b)); }
            else { stack.Push((a, nb.Left)); stack.Push((a, nb.Right)); }
        }
    }

    private void Emit(int p, int q, Action<int, int> visit)
    {
        if (!Overlap(_boxes, 6 * p, _boxes, 6 * q)) return;
        if (p < q) visit(p, q); else visit(q, p);
    }

    private static bool Overlap(double[] a, int i, double[] b, int j) =>
        a[i] <= b[j + 3] && b[j] <= a[i + 3] && a[i + 1] <= b[j + 4] && b[j + 1] <= a[i + 4] && a[i + 2] <= b[j + 5] && b[j + 2] <= a[i + 5];
}
