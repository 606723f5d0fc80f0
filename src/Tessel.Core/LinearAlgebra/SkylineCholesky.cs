namespace Tessel.Core.LinearAlgebra;

/// <summary>Envelope (skyline, profile) Cholesky L L^T of a symmetric positive definite matrix after a
/// bandwidth-reducing ordering (George &amp; Liu 1981, ch. 4; row-by-row "bordering" form, Jennings 1966).</summary>
/// <remarks>
/// Symbolic part (<see cref="Analyze(CsrMatrix)"/>, once per pattern): the ordering, the first column of
/// every row in the envelope, and where each entry of A lands in it. Numeric part
/// (<see cref="TryFactorize"/>, once per matrix): fill, factorise in place, with no allocation after the
/// first call. Fill-in stays inside the envelope, so row i of L is the contiguous run of columns
/// first[i]..i and every inner product is a dense dot product of two contiguous runs.
/// An instance keeps its factor and scratch: use one per thread.
/// </remarks>
public sealed class SkylineCholesky : ICholeskyFactor
{
    private readonly int n;
    private readonly int[] oldToNew;
    /// <summary>n first envelope column of each (permuted) row.</summary>
    private readonly int[] first;
    /// <summary>n+1 offsets of each row's run in the factor; the diagonal is the run's last entry.</summary>
    private readonly long[] rowOffset;
    /// <summary>Per entry of A: its slot in the factor, or -1 for entries above the permuted diagonal.</summary>
    private readonly int[] slotOfEntry;
    private double[] factor = [];
    private double[] work = [];

    /// <summary>n entries: NewToOld[k] is the original index of the k-th pivot.</summary>
    public int[] NewToOld { get; }
    /// <summary>Stored entries of L (envelope plus diagonal), i.e. doubles held by the factor.</summary>
    public long FactorEntries => rowOffset[n];
    /// <summary>Multiply-adds of one numeric factorisation (exact count for this envelope).</summary>
    public double FactorFlops { get; }
    /// <summary>Bandwidth of the permuted matrix.</summary>
    public int Bandwidth { get; }
    /// <summary>A pivot d counts as failed when d &lt;= RelativePivotTolerance * A(i,i).</summary>
    public double RelativePivotTolerance { get; set; } = 1e-14;

    private readonly int[] patternRowStart;
    private readonly int[] patternColumns;

    private SkylineCholesky(CsrMatrix a, int[] newToOld)
    {
        n = a.Rows;
        NewToOld = newToOld;
        oldToNew = SparsityMeasures.Invert(newToOld);
        patternRowStart = a.RowStart;
        patternColumns = a.ColumnIndices;
        first = new int[n];
        for (int i = 0; i < n; i++) first[i] = i;
        int band = 0;
        for (int r = 0; r < n; r++)
            for (int k = a.RowStart[r]; k < a.RowStart[r + 1]; k++)
            {
                int i = oldToNew[r], j = oldToNew[a.ColumnIndices[k]];
                // Take both triangles so a pattern stored one-sidedly still gets its full envelope.
                if (j < i) first[i] = Math.Min(first[i], j);
                else first[j] = Math.Min(first[j], i);
                band = Math.Max(band, Math.Abs(i - j));
            }
        Bandwidth = band;
        rowOffset = new long[n + 1];
        for (int i = 0; i < n; i++) rowOffset[i + 1] = rowOffset[i] + (i - first[i] + 1);
        double flops = 0;
        for (int i = 0; i < n; i++)
        {
            flops += i - first[i];
            for (int j = first[i]; j < i; j++) flops += j - Math.Max(first[i], first[j]);
        }
        FactorFlops = flops;
        // An envelope too large for one array can still be analysed (its cost compared); only
        // factorising it fails.
        slotOfEntry = new int[a.NonZeroCount];
        if (rowOffset[n] > Array.MaxLength) return;
        for (int r = 0; r < n; r++)
            for (int k = a.RowStart[r]; k < a.RowStart[r + 1]; k++)
            {
                int i = oldToNew[r], j = oldToNew[a.ColumnIndices[k]];
                slotOfEntry[k] = j <= i ? (int)(rowOffset[i] + (j - first[i])) : -1;
            }
    }

    /// <summary>Symbolic step with a reverse Cuthill-McKee ordering. <paramref name="a"/> is square and
    /// structurally symmetric; only its pattern is read.</summary>
    public static SkylineCholesky Analyze(CsrMatrix a) => Analyze(a, ReverseCuthillMcKee.Order(a));

    /// <summary>Symbolic step with a given ordering (n entries, newToOld).</summary>
    public static SkylineCholesky Analyze(CsrMatrix a, int[] newToOld)
    {
        if (a.Rows != a.Columns) throw new ArgumentException("matrix must be square", nameof(a));
        if (newToOld.Length != a.Rows) throw new ArgumentException("ordering needs one entry per row", nameof(newToOld));
        return new SkylineCholesky(a, newToOld);
    }

    /// <summary>True when <paramref name="a"/> shares this analysis' pattern arrays.</summary>
    public bool Matches(CsrMatrix a) =>
        ReferenceEquals(a.RowStart, patternRowStart) && ReferenceEquals(a.ColumnIndices, patternColumns);

    /// <summary>Numeric step. Returns false when a pivot fails, with the original index of its row and
    /// its value; the factor is then unusable until the next successful call.</summary>
    public bool TryFactorize(CsrMatrix a, out int failedRow, out double failedPivot)
    {
        if (a.NonZeroCount != slotOfEntry.Length || a.Rows != n) throw new ArgumentException("matrix pattern differs from the analysed one", nameof(a));
        if (rowOffset[n] > Array.MaxLength) throw new InvalidOperationException($"envelope of {rowOffset[n]} entries is too large for skyline Cholesky");
        if (factor.Length != rowOffset[n]) { factor = new double[rowOffset[n]]; work = new double[n]; }
        else Array.Clear(factor);
        double[] av = a.Values;
        for (int k = 0; k < av.Length; k++)
            if (slotOfEntry[k] >= 0) factor[slotOfEntry[k]] = av[k];

        double[] l = factor;
        for (int i = 0; i < n; i++)
        {
            int fi = first[i];
            long ri = rowOffset[i] - fi; // L(i, c) is at ri + c
            for (int j = fi; j < i; j++)
            {
                int fj = first[j];
                long rj = rowOffset[j] - fj;
                int k0 = Math.Max(fi, fj);
                double s = l[ri + j] - Dot(l, ri + k0, l, rj + k0, j - k0);
                l[ri + j] = s / l[rj + j];
            }
            double aii = l[ri + i];
            double d = aii - Dot(l, ri + fi, l, ri + fi, i - fi);
            if (!(d > RelativePivotTolerance * Math.Abs(aii)) || double.IsInfinity(d))
            {
                failedRow = NewToOld[i];
                failedPivot = d;
                return false;
            }
            l[ri + i] = Math.Sqrt(d);
        }
        failedRow = -1;
        failedPivot = 0;
        return true;
    }

    /// <summary>Numeric step; throws <see cref="NotPositiveDefiniteException"/> on a failed pivot.</summary>
    public void Factorize(CsrMatrix a)
    {
        if (!TryFactorize(a, out int row, out double pivot)) throw new NotPositiveDefiniteException(row, pivot);
    }

    /// <summary>x = A^-1 b with the current factor (b, x: n entries, original numbering; may alias).</summary>
    public void Solve(ReadOnlySpan<double> b, Span<double> x)
    {
        if (b.Length != n || x.Length != n) throw new ArgumentException("b and x need n entries");
        double[] y = work, l = factor;
        for (int i = 0; i < n; i++) y[i] = b[NewToOld[i]];
        // L y = P b.
        for (int i = 0; i < n; i++)
        {
            int fi = first[i];
            long ri = rowOffset[i] - fi;
            y[i] = (y[i] - Dot(l, ri + fi, y, fi, i - fi)) / l[ri + i];
        }
        // L^T z = y, rows of L read as columns of L^T.
        for (int i = n - 1; i >= 0; i--)
        {
            int fi = first[i];
            long ri = rowOffset[i] - fi;
            double zi = y[i] / l[ri + i];
            y[i] = zi;
            for (int c = fi; c < i; c++) y[c] -= l[ri + c] * zi;
        }
        for (int i = 0; i < n; i++) x[NewToOld[i]] = y[i];
    }

    private static double Dot(double[] a, long aStart, double[] b, long bStart, int length) =>
        DenseKernels.Dot(a, aStart, b, bStart, length);
}
