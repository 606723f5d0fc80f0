using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace Tessel.Core.Fitting.Sparse;

/// <summary>Envelope (skyline, profile) Cholesky L L^T of a symmetric positive definite matrix after a
/// bandwidth-reducing ordering (George &amp; Liu 1981, ch. 4; row-by-row "bordering" form, Jennings 1966).</summary>
/// <remarks>
/// Symbolic part (<see cref="Analyze(CsrMatrix)"/>, once per pattern): the ordering, the first column of
/// every row in the envelope, and where each entry of A lands in it. Numeric part
/// (<see cref="TryFactorize"/>, once per matrix): fill, factorise in place, with no allocation after the
/// first call. Fill-in stays inside the envelope, so row i of L is the contiguous run of columns
/// first[i]..i and every inner product is a dense dot product of two contiguous runs.
/// </remarks>
public sealed class SkylineCholesky
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
        if (rowOffset[n] > Array.MaxLength) throw new InvalidOperationException($"envelope of {rowOffset[n]} entries is too large for skyline Cholesky");
        slotOfEntry = new int[a.NonZeroCount];
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

    /// <summary>Dot product of two contiguous runs with eight fixed partial sums (lane k takes elements
    /// k, k+8, ...), combined in a fixed order: the SIMD and the scalar path give the same bits.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static double Dot(double[] a, long aStart, double[] b, long bStart, int length)
    {
        if (length <= 0) return 0;
        int i = 0;
        double s0 = 0, s1 = 0, s2 = 0, s3 = 0;
        if (length >= 8)
        {
            if (Vector256.IsHardwareAccelerated)
            {
                ref double ra = ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(a), (nint)aStart);
                ref double rb = ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(b), (nint)bStart);
                var lo = Vector256<double>.Zero;
                var hi = Vector256<double>.Zero;
                for (; i <= length - 8; i += 8)
                {
                    lo += Vector256.LoadUnsafe(ref ra, (nuint)i) * Vector256.LoadUnsafe(ref rb, (nuint)i);
                    hi += Vector256.LoadUnsafe(ref ra, (nuint)(i + 4)) * Vector256.LoadUnsafe(ref rb, (nuint)(i + 4));
                }
                var sum = lo + hi;
                s0 = sum.GetElement(0); s1 = sum.GetElement(1); s2 = sum.GetElement(2); s3 = sum.GetElement(3);
            }
            else
            {
                double t0 = 0, t1 = 0, t2 = 0, t3 = 0, t4 = 0, t5 = 0, t6 = 0, t7 = 0;
                for (; i <= length - 8; i += 8)
                {
                    long pa = aStart + i, pb = bStart + i;
                    t0 += a[pa] * b[pb]; t1 += a[pa + 1] * b[pb + 1]; t2 += a[pa + 2] * b[pb + 2]; t3 += a[pa + 3] * b[pb + 3];
                    t4 += a[pa + 4] * b[pb + 4]; t5 += a[pa + 5] * b[pb + 5]; t6 += a[pa + 6] * b[pb + 6]; t7 += a[pa + 7] * b[pb + 7];
                }
                s0 = t0 + t4; s1 = t1 + t5; s2 = t2 + t6; s3 = t3 + t7;
            }
        }
        double s = (s0 + s1) + (s2 + s3);
        for (; i < length; i++) s += a[aStart + i] * b[bStart + i];
        return s;
    }
}
