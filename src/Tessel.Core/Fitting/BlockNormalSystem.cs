using Tessel.Core.LinearAlgebra;

namespace Tessel.Core.Fitting;

/// <summary>The Gauss-Newton normal matrix J^T J (+ damping) of the fitting rows over the free
/// vertices, in a CSR pattern fixed per topology, refilled in place through a slot map.</summary>
/// <remarks>Unknowns are 3 per free vertex (x, y, z), ordered by vertex index; anchored vertices are
/// not unknowns, so their gradient entries are dropped.</remarks>
internal sealed class BlockNormalSystem
{
    /// <summary>#V unknown block of each vertex, or -1 when anchored.</summary>
    public int[] FreeIndex { get; }
    public int FreeCount { get; }
    public int Unknowns => 3 * FreeCount;
    /// <summary>The matrix; pattern fixed, values refilled by <see cref="Assemble"/>.</summary>
    public CsrMatrix Matrix { get; }

    private readonly FitRows _rows;
    private readonly int[] _pairStart;   // #R+1 offsets into _pairSlot (nv^2 per row)
    private readonly int[] _pairSlot;    // block slot of each (k, m) vertex pair of a row, or -1
    private readonly int[] _slotBase;    // first scalar value index of each block slot
    private readonly int[] _slotStride;  // distance between the block's scalar rows
    private readonly int[] _diag;        // #unknowns value index of each diagonal entry

    public BlockNormalSystem(FitRows rows, int vertexCount, IReadOnlyCollection<int> anchors)
    {
        _rows = rows;
        FreeIndex = new int[vertexCount];
        int free = 0;
        for (int v = 0; v < vertexCount; v++) FreeIndex[v] = anchors.Contains(v) ? -1 : free++;
        FreeCount = free;

        var nbr = new List<int>[free];
        for (int i = 0; i < free; i++) nbr[i] = [i];
        for (int r = 0; r < rows.RowCount; r++)
            for (int k = rows.Start[r]; k < rows.Start[r + 1]; k++)
            {
                int a = FreeIndex[rows.Vertices[k]];
                if (a < 0) continue;
                for (int m = rows.Start[r]; m < rows.Start[r + 1]; m++)
                {
                    int b = FreeIndex[rows.Vertices[m]];
                    if (b >= 0) nbr[a].Add(b);
                }
            }
        var blockStart = new int[free + 1];
        var blockCols = new List<int>();
        for (int a = 0; a < free; a++)
        {
            var list = nbr[a];
            list.Sort();
            int last = -1;
            foreach (int b in list) if (b != last) { blockCols.Add(b); last = b; }
            blockStart[a + 1] = blockCols.Count;
            nbr[a] = null!;
        }
        var cols = blockCols.ToArray();

        int n = 3 * free;
        var rowStart = new int[n + 1];
        _slotBase = new int[cols.Length];
        _slotStride = new int[cols.Length];
        var colIdx = new int[9 * cols.Length];
        for (int a = 0; a < free; a++)
        {
            int cnt = blockStart[a + 1] - blockStart[a];
            int rowBase = 9 * blockStart[a];
            for (int i = 0; i < 3; i++) rowStart[3 * a + i] = rowBase + 3 * i * cnt;
            for (int s = blockStart[a]; s < blockStart[a + 1]; s++)
            {
                _slotBase[s] = rowBase + 3 * (s - blockStart[a]);
                _slotStride[s] = 3 * cnt;
                for (int i = 0; i < 3; i++)
                    for (int j = 0; j < 3; j++) colIdx[_slotBase[s] + i * 3 * cnt + j] = 3 * cols[s] + j;
            }
        }
        rowStart[n] = 9 * cols.Length;
        Matrix = new CsrMatrix(n, n, rowStart, colIdx, new double[colIdx.Length]);
        _diag = new int[n];
        for (int i = 0; i < n; i++) _diag[i] = Array.BinarySearch(colIdx, rowStart[i], rowStart[i + 1] - rowStart[i], i);

        _pairStart = new int[rows.RowCount + 1];
        for (int r = 0; r < rows.RowCount; r++)
        {
            int nv = rows.Start[r + 1] - rows.Start[r];
            _pairStart[r + 1] = _pairStart[r] + nv * nv;
        }
        _pairSlot = new int[_pairStart[rows.RowCount]];
        for (int r = 0; r < rows.RowCount; r++)
        {
            int s0 = rows.Start[r], nv = rows.Start[r + 1] - s0, p = _pairStart[r];
            for (int k = 0; k < nv; k++)
                for (int m = 0; m < nv; m++, p++)
                {
                    int a = FreeIndex[rows.Vertices[s0 + k]], b = FreeIndex[rows.Vertices[s0 + m]];
                    _pairSlot[p] = a < 0 || b < 0 ? -1 : Array.BinarySearch(cols, blockStart[a], blockStart[a + 1] - blockStart[a], b);
                }
        }
    }

    /// <summary>Fills the matrix with sum_r w_r^2 grad_r grad_r^T and <paramref name="rhs"/> with
    /// -sum_r w_r res_r grad_r, then adds Levenberg-Marquardt damping lambda * (diag + floor).
    /// Rows with w_r = 0 are skipped. Returns the largest diagonal entry before damping.</summary>
    /// <param name="weight">#R factor multiplying each row's gradient in J.</param>
    /// <param name="residual">#R residual of each row (in J's units).</param>
    /// <param name="grad">Row gradients as filled by <see cref="FitRows.Evaluate"/>.</param>
    public double Assemble(double[] weight, double[] residual, double[] grad, double[] rhs)
    {
        var values = Matrix.Values;
        Array.Clear(values);
        Array.Clear(rhs);
        for (int r = 0; r < _rows.RowCount; r++)
        {
            double w = weight[r];
            if (w == 0) continue;
            double w2 = w * w, wr = w * residual[r];
            int s0 = _rows.Start[r], nv = _rows.Start[r + 1] - s0, p = _pairStart[r];
            for (int k = 0; k < nv; k++)
            {
                int gk = 3 * (s0 + k);
                int a = FreeIndex[_rows.Vertices[s0 + k]];
                if (a >= 0)
                    for (int i = 0; i < 3; i++) rhs[3 * a + i] -= wr * grad[gk + i];
                for (int m = 0; m < nv; m++, p++)
                {
                    int slot = _pairSlot[p];
                    if (slot < 0) continue;
                    int gm = 3 * (s0 + m), b0 = _slotBase[slot], stride = _slotStride[slot];
                    for (int i = 0; i < 3; i++)
                    {
                        double gi = w2 * grad[gk + i];
                        int row = b0 + i * stride;
                        values[row] += gi * grad[gm];
                        values[row + 1] += gi * grad[gm + 1];
                        values[row + 2] += gi * grad[gm + 2];
                    }
                }
            }
        }
        double max = 0;
        foreach (int d in _diag) max = Math.Max(max, values[d]);
        return max;
    }

    /// <summary>grad_r . step over the row's free vertices (the row's linearised change);
    /// <paramref name="rowGradient"/> holds the row's own 3 x (vertices of the row) entries.</summary>
    public double RowDirectional(int r, ReadOnlySpan<double> rowGradient, double[] step)
    {
        double sum = 0;
        int first = _rows.Start[r];
        for (int k = first; k < _rows.Start[r + 1]; k++)
        {
            int a = FreeIndex[_rows.Vertices[k]];
            if (a < 0) continue;
            int g = 3 * (k - first);
            sum += rowGradient[g] * step[3 * a] + rowGradient[g + 1] * step[3 * a + 1] + rowGradient[g + 2] * step[3 * a + 2];
        }
        return sum;
    }

    /// <summary>rhs -= coefficient * grad_r over the row's free vertices (row gradient as in
    /// <see cref="RowDirectional"/>).</summary>
    public void SubtractRowGradient(int r, double coefficient, ReadOnlySpan<double> rowGradient, double[] rhs)
    {
        int first = _rows.Start[r];
        for (int k = first; k < _rows.Start[r + 1]; k++)
        {
            int a = FreeIndex[_rows.Vertices[k]];
            if (a < 0) continue;
            for (int i = 0; i < 3; i++) rhs[3 * a + i] -= coefficient * rowGradient[3 * (k - first) + i];
        }
    }

    /// <summary>Adds <paramref name="scale"/> times a row's Hessian (3nv x 3nv, row-major, in the row's
    /// vertex order) to the matrix: the constraint-curvature term lambda_r grad^2 g_r of the Lagrangian.</summary>
    public void AddRowHessian(int r, double scale, double[] hess)
    {
        var values = Matrix.Values;
        int s0 = _rows.Start[r], nv = _rows.Start[r + 1] - s0, p = _pairStart[r], m = 3 * nv;
        for (int k = 0; k < nv; k++)
            for (int q = 0; q < nv; q++, p++)
            {
                int slot = _pairSlot[p];
                if (slot < 0) continue;
                int b0 = _slotBase[slot], stride = _slotStride[slot];
                for (int i = 0; i < 3; i++)
                {
                    int row = b0 + i * stride, h = (3 * k + i) * m + 3 * q;
                    values[row] += scale * hess[h];
                    values[row + 1] += scale * hess[h + 1];
                    values[row + 2] += scale * hess[h + 2];
                }
            }
    }

    /// <summary>Copies the diagonal out (to undo <see cref="Damp"/> without keeping the whole matrix).</summary>
    public void CopyDiagonal(double[] into)
    {
        var values = Matrix.Values;
        for (int i = 0; i < _diag.Length; i++) into[i] = values[_diag[i]];
    }

    /// <summary>Puts a diagonal saved by <see cref="CopyDiagonal"/> back.</summary>
    public void SetDiagonal(double[] from)
    {
        var values = Matrix.Values;
        for (int i = 0; i < _diag.Length; i++) values[_diag[i]] = from[i];
    }

    /// <summary>Largest |entry| of the matrix (the scale of the damping floor).</summary>
    public double MaxAbsEntry()
    {
        double max = 0;
        foreach (var v in Matrix.Values) max = Math.Max(max, Math.Abs(v));
        return max;
    }

    /// <summary>Adds lambda * (diag_i + floor) to every diagonal entry (Marquardt scaling with a floor
    /// so that directions no row touches stay positive definite).</summary>
    public void Damp(double lambda, double floor)
    {
        var values = Matrix.Values;
        foreach (int d in _diag) values[d] += lambda * (Math.Abs(values[d]) + floor);
    }

    /// <summary>Copies a step over the free unknowns into a full #V*3 position update.</summary>
    public void Apply(ReadOnlySpan<double> xyz, ReadOnlySpan<double> step, double[] result)
    {
        xyz.CopyTo(result);
        for (int v = 0; v < FreeIndex.Length; v++)
        {
            int a = FreeIndex[v];
            if (a < 0) continue;
            result[3 * v] += step[3 * a]; result[3 * v + 1] += step[3 * a + 1]; result[3 * v + 2] += step[3 * a + 2];
        }
    }
}
