namespace Tessel.Core.LinearAlgebra;

/// <summary>Zero-fill incomplete Cholesky IC(0): L L^T ~ A + shift * diag(A) with L restricted to the
/// lower-triangle pattern of A. Used as the conjugate gradient preconditioner.</summary>
/// <remarks>
/// Symbolic part (per pattern of A): the lower-triangle pattern and where each of its entries sits in A.
/// Numeric part (per matrix): the row-by-row factorisation. IC(0) may meet a non-positive pivot even for
/// SPD A; the caller then retries with a larger diagonal shift (Manteuffel 1980; Lin &amp; More 1999,
/// "Incomplete Cholesky factorizations with limited memory").
/// </remarks>
public sealed class IncompleteCholesky
{
    private readonly int n;
    /// <summary>n+1 offsets into the rows of L; each row ends with its diagonal entry.</summary>
    private readonly int[] rowStart;
    /// <summary>Column of each entry of L, ascending within a row.</summary>
    private readonly int[] columns;
    /// <summary>Index in A.Values of each entry of L.</summary>
    private readonly int[] sourceEntry;
    /// <summary>Values of L (overwritten by each <see cref="TryFactorize"/>).</summary>
    private readonly double[] values;
    /// <summary>n scratch: position of column c in the row being factorised, or -1.</summary>
    private readonly int[] positionInRow;

    /// <summary>A.RowStart this analysis was made for (reference identity marks the pattern).</summary>
    internal int[] PatternRowStart { get; }
    /// <summary>A.ColumnIndices this analysis was made for.</summary>
    internal int[] PatternColumns { get; }

    private IncompleteCholesky(int n, int[] rowStart, int[] columns, int[] sourceEntry, int[] patternRowStart, int[] patternColumns)
    {
        this.n = n;
        this.rowStart = rowStart;
        this.columns = columns;
        this.sourceEntry = sourceEntry;
        values = new double[columns.Length];
        positionInRow = new int[n];
        Array.Fill(positionInRow, -1);
        PatternRowStart = patternRowStart;
        PatternColumns = patternColumns;
    }

    /// <summary>Symbolic step for a square matrix whose pattern holds every diagonal entry.</summary>
    public static IncompleteCholesky Analyze(CsrMatrix a)
    {
        if (a.Rows != a.Columns) throw new ArgumentException("matrix must be square", nameof(a));
        int n = a.Rows;
        var rowStart = new int[n + 1];
        for (int i = 0; i < n; i++)
        {
            int count = 0;
            bool hasDiagonal = false;
            for (int k = a.RowStart[i]; k < a.RowStart[i + 1]; k++)
            {
                int c = a.ColumnIndices[k];
                if (c <= i) count++;
                if (c == i) hasDiagonal = true;
            }
            if (!hasDiagonal) throw new ArgumentException($"row {i} has no diagonal entry in the pattern", nameof(a));
            rowStart[i + 1] = rowStart[i] + count;
        }
        var columns = new int[rowStart[n]];
        var source = new int[rowStart[n]];
        for (int i = 0; i < n; i++)
        {
            int p = rowStart[i];
            for (int k = a.RowStart[i]; k < a.RowStart[i + 1]; k++)
            {
                if (a.ColumnIndices[k] > i) break;
                columns[p] = a.ColumnIndices[k];
                source[p] = k;
                p++;
            }
        }
        return new IncompleteCholesky(n, rowStart, columns, source, a.RowStart, a.ColumnIndices);
    }

    /// <summary>True when <paramref name="a"/> has the pattern this analysis was made for.</summary>
    public bool Matches(CsrMatrix a) =>
        ReferenceEquals(a.RowStart, PatternRowStart) && ReferenceEquals(a.ColumnIndices, PatternColumns);

    /// <summary>Numeric step: factorises A + shift * diag(A). Returns false on a pivot that is not
    /// clearly positive (below 1e-12 of its shifted diagonal), in which case the factor is unusable
    /// and <paramref name="failedRow"/> names the row.</summary>
    public bool TryFactorize(CsrMatrix a, double shift, out int failedRow)
    {
        double[] av = a.Values;
        for (int p = 0; p < values.Length; p++) values[p] = av[sourceEntry[p]];
        for (int i = 0; i < n; i++)
        {
            int start = rowStart[i], diag = rowStart[i + 1] - 1;
            for (int p = start; p < diag; p++) positionInRow[columns[p]] = p;
            // L(i,j) = (A(i,j) - sum_{k<j} L(i,k) L(j,k)) / L(j,j), over the kept pattern only.
            for (int p = start; p < diag; p++)
            {
                int j = columns[p];
                double s = values[p];
                int jDiag = rowStart[j + 1] - 1;
                for (int q = rowStart[j]; q < jDiag; q++)
                {
                    int at = positionInRow[columns[q]];
                    if (at >= 0) s -= values[at] * values[q];
                }
                values[p] = s / values[jDiag];
            }
            double shifted = values[diag] * (1 + shift);
            double d = shifted;
            for (int p = start; p < diag; p++) d -= values[p] * values[p];
            for (int p = start; p < diag; p++) positionInRow[columns[p]] = -1;
            if (!(d > 1e-12 * Math.Abs(shifted)))
            {
                failedRow = i;
                return false;
            }
            values[diag] = Math.Sqrt(d);
        }
        failedRow = -1;
        return true;
    }

    /// <summary>z = (L L^T)^-1 r: forward then backward substitution. Both spans have n entries;
    /// they may not overlap.</summary>
    public void Apply(ReadOnlySpan<double> r, Span<double> z)
    {
        for (int i = 0; i < n; i++)
        {
            double s = r[i];
            int diag = rowStart[i + 1] - 1;
            for (int p = rowStart[i]; p < diag; p++) s -= values[p] * z[columns[p]];
            z[i] = s / values[diag];
        }
        // L^T x = y using the rows of L as columns of L^T.
        for (int i = n - 1; i >= 0; i--)
        {
            int diag = rowStart[i + 1] - 1;
            double xi = z[i] / values[diag];
            z[i] = xi;
            for (int p = rowStart[i]; p < diag; p++) z[columns[p]] -= values[p] * xi;
        }
    }
}
