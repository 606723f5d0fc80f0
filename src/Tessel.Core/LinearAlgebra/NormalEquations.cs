namespace Tessel.Core.LinearAlgebra;

/// <summary>Gauss-Newton normal equations for one Jacobian sparsity pattern:
/// N = J^T W J + diag(d) and g = J^T W r, with W = diag(w) a residual weight per row of J.</summary>
/// <remarks>
/// Precompute-then-fill: <see cref="Analyze"/> works out the pattern of N once per topology (both
/// triangles, diagonal always present, columns sorted) and, for every pair of entries (a, b), a &lt;= b,
/// that share a row of J, the two slots of N they add into. <see cref="Fill"/> is then one pass over
/// those pairs with no searching or sorting (shared numerics notes: 2.1 ms vs 249 ms for sorting
/// triplets at n = 30k). The upper and the mirrored lower slot receive the same products in the same
/// order, so N is symmetric bit for bit.
/// </remarks>
public sealed class NormalEquations
{
    private readonly int jacobianRows;
    private readonly int jacobianNonZeros;
    /// <summary>#J rows + 1 offsets into <see cref="upperSlot"/> / <see cref="lowerSlot"/>.</summary>
    private readonly int[] pairStart;
    /// <summary>Per within-row entry pair (a, b), a &lt;= b in row order: slot of N(col a, col b).</summary>
    private readonly int[] upperSlot;
    /// <summary>Per pair: slot of N(col b, col a); equal to upperSlot for a = b (added once).</summary>
    private readonly int[] lowerSlot;
    /// <summary>#unknowns slot of each diagonal entry of N.</summary>
    private readonly int[] diagonalSlot;

    /// <summary>The normal matrix (#unknowns x #unknowns, both triangles); <see cref="Fill"/> overwrites
    /// its Values, the pattern never changes.</summary>
    public CsrMatrix Matrix { get; }

    /// <summary>Number of unknowns (columns of J, size of N).</summary>
    public int Unknowns => Matrix.Rows;

    private NormalEquations(int jacobianRows, int jacobianNonZeros, int[] pairStart, int[] upperSlot,
        int[] lowerSlot, int[] diagonalSlot, CsrMatrix matrix)
    {
        this.jacobianRows = jacobianRows;
        this.jacobianNonZeros = jacobianNonZeros;
        this.pairStart = pairStart;
        this.upperSlot = upperSlot;
        this.lowerSlot = lowerSlot;
        this.diagonalSlot = diagonalSlot;
        Matrix = matrix;
    }

    /// <summary>Symbolic step: the pattern of J^T J + I and the slot map, from the pattern of
    /// <paramref name="jacobian"/> (#residuals x #unknowns, columns unique within a row; values unused).</summary>
    public static NormalEquations Analyze(CsrMatrix jacobian)
    {
        int m = jacobian.Rows, n = jacobian.Columns;
        int[] jStart = jacobian.RowStart, jCol = jacobian.ColumnIndices;

        // Column view of J's pattern: which residual rows touch each unknown.
        var colStart = new int[n + 1];
        for (int k = 0; k < jacobian.NonZeroCount; k++) colStart[jCol[k] + 1]++;
        for (int c = 0; c < n; c++) colStart[c + 1] += colStart[c];
        var rowsOfColumn = new int[jacobian.NonZeroCount];
        var fillPos = (int[])colStart.Clone();
        for (int r = 0; r < m; r++)
            for (int k = jStart[r]; k < jStart[r + 1]; k++) rowsOfColumn[fillPos[jCol[k]]++] = r;

        // Row a of N: every unknown sharing a residual with a, plus a itself.
        var rowStart = new int[n + 1];
        var columns = new List<int>(n * 8);
        var marker = new int[n];
        Array.Fill(marker, -1);
        var rowBuffer = new List<int>(64);
        for (int a = 0; a < n; a++)
        {
            rowBuffer.Clear();
            marker[a] = a;
            rowBuffer.Add(a);
            for (int t = colStart[a]; t < colStart[a + 1]; t++)
            {
                int r = rowsOfColumn[t];
                for (int k = jStart[r]; k < jStart[r + 1]; k++)
                {
                    int b = jCol[k];
                    if (marker[b] == a) continue;
                    marker[b] = a;
                    rowBuffer.Add(b);
                }
            }
            rowBuffer.Sort();
            columns.AddRange(rowBuffer);
            rowStart[a + 1] = columns.Count;
        }
        var colIdx = columns.ToArray();
        var matrix = new CsrMatrix(n, n, rowStart, colIdx, new double[colIdx.Length]);

        int SlotOf(int row, int col)
        {
            int s = Array.BinarySearch(colIdx, rowStart[row], rowStart[row + 1] - rowStart[row], col);
            if (s < 0) throw new InvalidOperationException("normal pattern misses a Jacobian pair");
            return s;
        }

        var pairStart = new int[m + 1];
        for (int r = 0; r < m; r++)
        {
            long len = jStart[r + 1] - jStart[r];
            long total = pairStart[r] + len * (len + 1) / 2;
            if (total > int.MaxValue) throw new ArgumentException("Jacobian rows too dense for the pair map");
            pairStart[r + 1] = (int)total;
        }
        var upper = new int[pairStart[m]];
        var lower = new int[pairStart[m]];
        for (int r = 0; r < m; r++)
        {
            int p = pairStart[r];
            for (int ka = jStart[r]; ka < jStart[r + 1]; ka++)
                for (int kb = ka; kb < jStart[r + 1]; kb++)
                {
                    int ca = jCol[ka], cb = jCol[kb];
                    if (ka != kb && ca == cb) throw new ArgumentException($"Jacobian row {r} repeats column {ca}");
                    upper[p] = SlotOf(ca, cb);
                    lower[p] = SlotOf(cb, ca);
                    p++;
                }
        }
        var diagonal = new int[n];
        for (int a = 0; a < n; a++) diagonal[a] = SlotOf(a, a);
        return new NormalEquations(m, jacobian.NonZeroCount, pairStart, upper, lower, diagonal, matrix);
    }

    /// <summary>Numeric step: overwrites <see cref="Matrix"/> with J^T W J + diag(d) and returns it.</summary>
    /// <param name="jacobian">#residuals x #unknowns, the pattern given to <see cref="Analyze"/>.</param>
    /// <param name="weights">#residuals weights w (W = diag(w)); empty means all ones.</param>
    /// <param name="diagonal">#unknowns values d added to the diagonal (damping); empty means none.</param>
    public CsrMatrix Fill(CsrMatrix jacobian, ReadOnlySpan<double> weights, ReadOnlySpan<double> diagonal)
    {
        CheckPattern(jacobian);
        if (!weights.IsEmpty && weights.Length != jacobianRows) throw new ArgumentException("one weight per residual", nameof(weights));
        if (!diagonal.IsEmpty && diagonal.Length != Unknowns) throw new ArgumentException("one diagonal value per unknown", nameof(diagonal));
        double[] values = Matrix.Values;
        Array.Clear(values);
        int[] jStart = jacobian.RowStart;
        double[] jVal = jacobian.Values;
        for (int r = 0; r < jacobianRows; r++)
        {
            double w = weights.IsEmpty ? 1.0 : weights[r];
            int p = pairStart[r], end = jStart[r + 1];
            for (int ka = jStart[r]; ka < end; ka++)
            {
                double wa = w * jVal[ka];
                values[upperSlot[p]] += wa * jVal[ka];
                p++;
                for (int kb = ka + 1; kb < end; kb++)
                {
                    double v = wa * jVal[kb];
                    values[upperSlot[p]] += v;
                    values[lowerSlot[p]] += v;
                    p++;
                }
            }
        }
        if (!diagonal.IsEmpty)
            for (int a = 0; a < diagonal.Length; a++) values[diagonalSlot[a]] += diagonal[a];
        return Matrix;
    }

    /// <summary>g = J^T W r (the gradient of 1/2 r^T W r; the Gauss-Newton right-hand side is -g).</summary>
    /// <param name="jacobian">#residuals x #unknowns, the analysed pattern.</param>
    /// <param name="weights">#residuals weights; empty means all ones.</param>
    /// <param name="residuals">#residuals values r.</param>
    /// <param name="gradient">#unknowns output.</param>
    public void Gradient(CsrMatrix jacobian, ReadOnlySpan<double> weights, ReadOnlySpan<double> residuals, Span<double> gradient)
    {
        CheckPattern(jacobian);
        if (!weights.IsEmpty && weights.Length != jacobianRows) throw new ArgumentException("one weight per residual", nameof(weights));
        if (residuals.Length != jacobianRows) throw new ArgumentException("one value per residual", nameof(residuals));
        if (gradient.Length != Unknowns) throw new ArgumentException("one value per unknown", nameof(gradient));
        gradient.Clear();
        int[] jStart = jacobian.RowStart, jCol = jacobian.ColumnIndices;
        double[] jVal = jacobian.Values;
        for (int r = 0; r < jacobianRows; r++)
        {
            double wr = (weights.IsEmpty ? 1.0 : weights[r]) * residuals[r];
            for (int k = jStart[r]; k < jStart[r + 1]; k++) gradient[jCol[k]] += jVal[k] * wr;
        }
    }

    private void CheckPattern(CsrMatrix jacobian)
    {
        if (jacobian.Rows != jacobianRows || jacobian.Columns != Unknowns || jacobian.NonZeroCount != jacobianNonZeros)
            throw new ArgumentException("Jacobian pattern differs from the analysed one", nameof(jacobian));
    }
}
