using System.Numerics;
using System.Runtime.InteropServices;

namespace Tessel.Core.LinearAlgebra;

/// <summary>Cholesky factor L L^T of a normal matrix J^T J + shift I (J sparse, e.g. a bar-and-hinge
/// Jacobian) stored as a variable-band envelope after reverse Cuthill-McKee reordering: factor once,
/// solve many times (shift-invert iterations, Sherman-Morrison corrections).</summary>
/// <remarks>Fixed columns get an identity row and column, so solutions are zero there when the right-hand
/// side is. The envelope is fill-closed for Cholesky, so no pivoting or symbolic phase is needed.</remarks>
internal sealed class EnvelopeCholesky
{
    private readonly int _n;
    private readonly int[] _newOfOld;
    private readonly int[] _first;      // first stored column of each (new) row
    private readonly long[] _start;     // offset of row i's first stored entry
    private readonly double[] _values;

    /// <summary>Number of stored entries of the lower envelope (memory: 8 bytes each).</summary>
    public long EnvelopeSize => _values.Length;

    private EnvelopeCholesky(int n, int[] newOfOld, int[] first, long[] start, double[] values)
    {
        _n = n; _newOfOld = newOfOld; _first = first; _start = start; _values = values;
    }

    /// <summary>Assembles J^T J + shift I (fixed columns replaced by identity) and factors it.
    /// Returns null when a pivot is not positive (matrix not positive definite at this shift).</summary>
    /// <param name="j">m x n Jacobian.</param>
    /// <param name="shift">Added to every free diagonal entry; must make the matrix definite.</param>
    /// <param name="fixedColumns">n flags, or null when every column is free.</param>
    /// <param name="samePattern">An earlier factor of a matrix with the same sparsity pattern and fixed columns,
    /// whose ordering and envelope are reused (skips the reordering).</param>
    public static EnvelopeCholesky? Factor(CsrMatrix j, double shift, bool[]? fixedColumns, EnvelopeCholesky? samePattern = null)
    {
        int n = j.Columns;
        bool IsFixed(int c) => fixedColumns != null && fixedColumns[c];
        if (samePattern != null && samePattern._n != n) throw new ArgumentException("pattern of another size", nameof(samePattern));
        var (newOfOld, first, start) = samePattern != null
            ? (samePattern._newOfOld, samePattern._first, samePattern._start)
            : Envelope(j, fixedColumns);
        var values = new double[start[n]];
        for (int r = 0; r < j.Rows; r++)
            for (int p = j.RowStart[r]; p < j.RowStart[r + 1]; p++)
            {
                int cp = j.ColumnIndices[p];
                if (IsFixed(cp)) continue;
                int ip = newOfOld[cp];
                double vp = j.Values[p];
                for (int q = j.RowStart[r]; q < j.RowStart[r + 1]; q++)
                {
                    int cq = j.ColumnIndices[q];
                    if (IsFixed(cq)) continue;
                    int iq = newOfOld[cq];
                    if (iq <= ip) values[start[ip] + iq - first[ip]] += vp * j.Values[q];
                }
            }
        for (int c = 0; c < n; c++)
        {
            int i = newOfOld[c];
            values[start[i] + i - first[i]] += IsFixed(c) ? 1.0 : shift;
        }
        var factor = new EnvelopeCholesky(n, newOfOld, first, start, values);
        return factor.FactorInPlace() ? factor : null;
    }

    private static (int[] NewOfOld, int[] First, long[] Start) Envelope(CsrMatrix j, bool[]? fixedColumns)
    {
        int n = j.Columns;
        bool IsFixed(int c) => fixedColumns != null && fixedColumns[c];
        var newOfOld = ReverseCuthillMcKee(j, fixedColumns);
        var first = new int[n];
        for (int i = 0; i < n; i++) first[i] = i;
        for (int r = 0; r < j.Rows; r++)
        {
            int lo = int.MaxValue;
            for (int k = j.RowStart[r]; k < j.RowStart[r + 1]; k++)
                if (!IsFixed(j.ColumnIndices[k])) lo = Math.Min(lo, newOfOld[j.ColumnIndices[k]]);
            for (int k = j.RowStart[r]; k < j.RowStart[r + 1]; k++)
            {
                int c = j.ColumnIndices[k];
                if (!IsFixed(c)) first[newOfOld[c]] = Math.Min(first[newOfOld[c]], lo);
            }
        }
        var start = new long[n + 1];
        for (int i = 0; i < n; i++) start[i + 1] = start[i] + (i - first[i] + 1);
        return (newOfOld, first, start);
    }

    private bool FactorInPlace()
    {
        var v = _values;
        for (int i = 0; i < _n; i++)
        {
            int fi = _first[i];
            long si = _start[i];
            for (int jj = fi; jj < i; jj++)
            {
                int fj = _first[jj];
                long sj = _start[jj];
                int k0 = Math.Max(fi, fj);
                double s = v[si + jj - fi] - Dot(v, si + k0 - fi, sj + k0 - fj, jj - k0);
                v[si + jj - fi] = s / v[sj + jj - fj];
            }
            double d = v[si + i - fi] - Dot(v, si, si, i - fi);
            if (!(d > 0)) return false;
            v[si + i - fi] = Math.Sqrt(d);
        }
        return true;
    }

    private static double Dot(double[] v, long a, long b, int length)
    {
        if (length <= 0) return 0;
        var x = new ReadOnlySpan<double>(v, (int)a, length);
        var y = new ReadOnlySpan<double>(v, (int)b, length);
        double s = 0;
        int k = 0;
        if (Vector.IsHardwareAccelerated && length >= 2 * Vector<double>.Count)
        {
            var vx = MemoryMarshal.Cast<double, Vector<double>>(x);
            var vy = MemoryMarshal.Cast<double, Vector<double>>(y);
            var acc = Vector<double>.Zero;
            for (int t = 0; t < vx.Length; t++) acc += vx[t] * vy[t];
            s = Vector.Dot(acc, Vector<double>.One);
            k = vx.Length * Vector<double>.Count;
        }
        for (; k < length; k++) s += x[k] * y[k];
        return s;
    }

    /// <summary>Solves (J^T J + shift I) x = b; <paramref name="b"/> and <paramref name="x"/> have n entries
    /// in the original column order and may be the same array.</summary>
    public void Solve(ReadOnlySpan<double> b, Span<double> x)
    {
        var y = new double[_n];
        for (int c = 0; c < _n; c++) y[_newOfOld[c]] = b[c];
        var v = _values;
        for (int i = 0; i < _n; i++)
        {
            int fi = _first[i];
            long si = _start[i];
            double s = y[i];
            for (int k = fi; k < i; k++) s -= v[si + k - fi] * y[k];
            y[i] = s / v[si + i - fi];
        }
        for (int i = _n - 1; i >= 0; i--)
        {
            int fi = _first[i];
            long si = _start[i];
            double xi = y[i] / v[si + i - fi];
            y[i] = xi;
            for (int k = fi; k < i; k++) y[k] -= v[si + k - fi] * xi;
        }
        for (int c = 0; c < _n; c++) x[c] = y[_newOfOld[c]];
    }

    /// <summary>Reverse Cuthill-McKee order of the graph of J^T J (columns sharing a row are neighbours),
    /// each component started from a pseudo-peripheral column (George &amp; Liu). Returns new index of each column.</summary>
    private static int[] ReverseCuthillMcKee(CsrMatrix j, bool[]? fixedColumns)
    {
        int n = j.Columns;
        var sets = new HashSet<int>[n];
        for (int c = 0; c < n; c++) sets[c] = [];
        for (int r = 0; r < j.Rows; r++)
            for (int p = j.RowStart[r]; p < j.RowStart[r + 1]; p++)
                for (int q = j.RowStart[r]; q < j.RowStart[r + 1]; q++)
                    if (p != q) sets[j.ColumnIndices[p]].Add(j.ColumnIndices[q]);
        var adj = new int[n][];
        for (int c = 0; c < n; c++)
        {
            adj[c] = fixedColumns == null ? sets[c].ToArray() : sets[c].Where(x => !fixedColumns[x]).ToArray();
            if (fixedColumns != null && fixedColumns[c]) adj[c] = [];
            Array.Sort(adj[c]);
        }
        var order = new List<int>(n);
        var visited = new bool[n];
        var level = new int[n];
        for (int seed = 0; seed < n; seed++)
        {
            if (visited[seed]) continue;
            int start = PseudoPeripheral(adj, seed, level);
            var queue = new Queue<int>();
            queue.Enqueue(start); visited[start] = true;
            while (queue.Count > 0)
            {
                int u = queue.Dequeue();
                order.Add(u);
                foreach (int w in adj[u].Where(w => !visited[w]).OrderBy(w => adj[w].Length).ThenBy(w => w))
                {
                    visited[w] = true; queue.Enqueue(w);
                }
            }
        }
        var newOfOld = new int[n];
        for (int k = 0; k < n; k++) newOfOld[order[k]] = n - 1 - k;
        return newOfOld;
    }

    private static int PseudoPeripheral(int[][] adj, int seed, int[] level)
    {
        int current = seed, eccentricity = -1;
        for (int pass = 0; pass < 8; pass++)
        {
            var (far, depth) = Farthest(adj, current, level);
            if (depth <= eccentricity) break;
            eccentricity = depth; current = far;
        }
        return current;
    }

    // Breadth-first search; returns the lowest-degree vertex of the last level and the depth.
    private static (int Vertex, int Depth) Farthest(int[][] adj, int start, int[] level)
    {
        var seen = new List<int> { start };
        level[start] = 0;
        var mark = new HashSet<int> { start };
        int head = 0, depth = 0;
        while (head < seen.Count)
        {
            int u = seen[head++];
            depth = Math.Max(depth, level[u]);
            foreach (int w in adj[u])
                if (mark.Add(w)) { level[w] = level[u] + 1; seen.Add(w); }
        }
        int best = start;
        foreach (int u in seen)
            if (level[u] == depth && (best == start || adj[u].Length < adj[best].Length || (adj[u].Length == adj[best].Length && u < best)))
                best = u;
        return (best, depth);
    }
}
