namespace Tessel.Core.LinearAlgebra;

/// <summary>Sparse Cholesky L L^T by the multifrontal method over supernodes (Duff &amp; Reid 1983; Liu,
/// "The multifrontal method for sparse matrix solution", SIAM Review 34(1) 1992) after a nested
/// dissection ordering. For grid-like Gauss-Newton systems it does far less work than the envelope
/// method because nested dissection keeps the fill at O(n log n).</summary>
/// <remarks>
/// Symbolic part (<see cref="Analyze(CsrMatrix)"/>, once per pattern): ordering, elimination tree (Liu
/// 1986), its postorder, column counts by row subtrees, fundamental supernodes merged by relaxed
/// amalgamation, their row structures, and the peak size of the update-matrix stack. Numeric part (<see cref="TryFactorize"/>): for every
/// supernode in postorder, assemble its frontal matrix from A and the children's update matrices
/// (extend-add), factorise its columns densely, and push the Schur complement for its parent. All dense
/// work is dot products of contiguous rows (row-major blocks), done in a fixed order: same input, same bits.
/// An instance keeps its factor and scratch: use one per thread.
/// </remarks>
public sealed class SupernodalCholesky : ICholeskyFactor
{
    private readonly int n;
    private readonly int[] patternRowStart;
    private readonly int[] patternColumns;
    private readonly int patternNonZeros;

    /// <summary>n+1 offsets: lower-triangle entries of the permuted A by column (row &gt;= column).</summary>
    private readonly int[] columnStart;
    /// <summary>Permuted row of each lower-triangle entry.</summary>
    private readonly int[] columnRow;
    /// <summary>Index in A.Values of each lower-triangle entry.</summary>
    private readonly int[] columnSource;
    /// <summary>n: index in A.Values of each permuted diagonal entry (-1 when not stored).</summary>
    private readonly int[] diagonalSource;

    private readonly int supernodes;
    /// <summary>Supernodes+1: first (permuted) column of each supernode; columns are contiguous.</summary>
    private readonly int[] superFirst;
    /// <summary>Supernodes+1 offsets into <see cref="superRows"/>.</summary>
    private readonly int[] superRowStart;
    /// <summary>Rows of each supernode's factor block, ascending: its own columns, then the rows below.</summary>
    private readonly int[] superRows;
    /// <summary>Supernodes+1 offsets of each factor block (row-major, diagonal block packed: see <see cref="Row"/>).</summary>
    private readonly long[] factorStart;
    /// <summary>Number of child supernodes (their update matrices are on top of the stack in order).</summary>
    private readonly int[] childCount;
    private readonly long stackPeak;
    private readonly long updatePeak;
    /// <summary>Two-way split of the elimination tree for the numeric step: supernodes [0, splitLast] and
    /// (splitLast, tailFirst) are disjoint unions of subtrees, factored on two threads; [tailFirst, end) is
    /// their common ancestors, factored after both. -1 when the tree does not split usefully.</summary>
    private readonly int splitLast, tailFirst;
    private FrontStack? secondStack;

    private double[] factor = [];
    private FrontStack? mainStack;
    private double[] work = [];
    private double[] columnWork = [];

    /// <summary>n entries: NewToOld[k] is the original index of the k-th pivot.</summary>
    public int[] NewToOld { get; }
    /// <summary>Doubles held by the factor (dense supernode blocks, including their upper-triangle zeros).</summary>
    public long FactorEntries => factorStart[supernodes];
    /// <summary>Structural nonzeros of L (the fill the ordering leaves, diagonal included), before the
    /// explicit zeros that relaxed supernodes add.</summary>
    public long FactorNonZeros { get; }
    /// <summary>Number of supernodes.</summary>
    public int SupernodeCount => supernodes;
    /// <summary>Multiply-adds of one numeric factorisation (exact count for this structure).</summary>
    public double FactorFlops { get; }
    /// <summary>Whether the numeric step may factor the two halves of the elimination tree on two threads
    /// (same bits either way).</summary>
    public bool TwoThreads { get; set; } = true;
    /// <summary>True when the elimination tree splits into two subtrees worth a thread each.</summary>
    public bool Splits => splitLast >= 0;
    /// <summary>A pivot d counts as failed when d &lt;= RelativePivotTolerance * A(i,i).</summary>
    public double RelativePivotTolerance { get; set; } = 1e-14;

    /// <summary>Symbolic step with a nested dissection ordering.</summary>
    public static SupernodalCholesky Analyze(CsrMatrix a) => Analyze(a, NestedDissection.Order(a));

    /// <summary>Symbolic step with a given fill-reducing ordering (newToOld, n entries). The ordering is
    /// refined by a postorder of its elimination tree, which changes no fill.</summary>
    public static SupernodalCholesky Analyze(CsrMatrix a, int[] newToOld)
    {
        if (a.Rows != a.Columns) throw new ArgumentException("matrix must be square", nameof(a));
        if (newToOld.Length != a.Rows) throw new ArgumentException("ordering needs one entry per row", nameof(newToOld));
        return new SupernodalCholesky(a, newToOld);
    }

    private SupernodalCholesky(CsrMatrix a, int[] ordering)
    {
        n = a.Rows;
        patternRowStart = a.RowStart;
        patternColumns = a.ColumnIndices;
        patternNonZeros = a.NonZeroCount;

        // Elimination tree of the given ordering, then its postorder: subtrees become contiguous, which
        // the multifrontal stack and the supernode detection both need.
        int[] firstOldToNew = SparsityMeasures.Invert(ordering);
        var (rowStart0, rowCols0) = LowerRows(a, firstOldToNew);
        int[] parent0 = EliminationTree(rowStart0, rowCols0);
        int[] post = Postorder(parent0);
        NewToOld = new int[n];
        for (int t = 0; t < n; t++) NewToOld[t] = ordering[post[t]];
        int[] oldToNew = SparsityMeasures.Invert(NewToOld);
        int[] postInverse = SparsityMeasures.Invert(post);
        var parent = new int[n];
        for (int t = 0; t < n; t++) parent[t] = parent0[post[t]] < 0 ? -1 : postInverse[parent0[post[t]]];

        var (rowStart, rowCols) = LowerRows(a, oldToNew);
        (columnStart, columnRow, columnSource, diagonalSource) = LowerColumns(a, oldToNew);
        int[] counts = ColumnCounts(rowStart, rowCols, parent);

        // Fundamental supernodes: j+1 extends j's supernode when it is j's parent, its only child, and
        // L(:, j) is L(:, j+1) plus the diagonal.
        var children = new int[n];
        for (int j = 0; j < n; j++) if (parent[j] >= 0) children[parent[j]]++;
        var firsts = new List<int> { 0 };
        for (int j = 0; j + 1 < n; j++)
            if (!(parent[j] == j + 1 && counts[j] == counts[j + 1] + 1 && children[j + 1] == 1)) firsts.Add(j + 1);
        if (n == 0) firsts.Clear();
        long nonZeros = 0;
        foreach (int c in counts) nonZeros += c;
        FactorNonZeros = nonZeros;
        int[] expectedRows = Amalgamate(firsts, counts, parent);
        supernodes = firsts.Count;
        superFirst = new int[supernodes + 1];
        for (int s = 0; s < supernodes; s++) superFirst[s] = firsts[s];
        superFirst[supernodes] = n;
        var superOf = new int[n];
        for (int s = 0; s < supernodes; s++)
            for (int j = superFirst[s]; j < superFirst[s + 1]; j++) superOf[j] = s;

        // Row structure of each supernode: its columns, the rows of A below them, and the children's
        // rows below (Liu 1992, the structure of a column is its A column plus its children's).
        childCount = new int[supernodes];
        var childList = new List<int>[supernodes];
        for (int s = 0; s < supernodes; s++) childList[s] = [];
        for (int s = 0; s < supernodes; s++)
        {
            int p = parent[superFirst[s + 1] - 1];
            if (p >= 0) { childList[superOf[p]].Add(s); childCount[superOf[p]]++; }
        }
        superRowStart = new int[supernodes + 1];
        factorStart = new long[supernodes + 1];
        var allRows = new List<int>();
        var marker = new int[n];
        Array.Fill(marker, -1);
        var below = new List<int>();
        double flops = 0;
        var superFlops = new double[supernodes];
        long stackNow = 0, stackMax = 0, updateMax = 0;
        var stackSizes = new Stack<long>();
        for (int s = 0; s < supernodes; s++)
        {
            int f = superFirst[s], l = superFirst[s + 1] - 1, k = l - f + 1;
            below.Clear();
            for (int j = f; j <= l; j++)
                for (int p = columnStart[j]; p < columnStart[j + 1]; p++)
                {
                    int i = columnRow[p];
                    if (i > l && marker[i] != s) { marker[i] = s; below.Add(i); }
                }
            foreach (int c in childList[s])
                for (int t = superRowStart[c] + (superFirst[c + 1] - superFirst[c]); t < superRowStart[c + 1]; t++)
                {
                    int i = allRows[t];
                    if (i > l && marker[i] != s) { marker[i] = s; below.Add(i); }
                }
            below.Sort();
            for (int j = f; j <= l; j++) allRows.Add(j);
            allRows.AddRange(below);
            superRowStart[s + 1] = allRows.Count;
            int m = k + below.Count;
            if (m != expectedRows[s]) throw new InvalidOperationException($"supernode {s}: {m} rows, expected {expectedRows[s]}");
            factorStart[s + 1] = factorStart[s] + Packed(k) + (long)(m - k) * k;

            long mu = m - k;
            for (int c = 0; c < childCount[s]; c++) stackNow -= stackSizes.Pop();
            stackNow += Packed(mu);
            stackSizes.Push(Packed(mu));
            stackMax = Math.Max(stackMax, stackNow);
            updateMax = Math.Max(updateMax, Packed(mu));
            // Bordering: row i < k takes dots of lengths 0..i; rows below take 0..k-1; the Schur
            // complement takes one dot of length k per lower entry.
            superFlops[s] = (k - 1.0) * k * (k + 1.0) / 6 + mu * k * (k - 1.0) / 2 + mu * (mu + 1.0) / 2 * k;
            flops += superFlops[s];
        }
        superRows = allRows.ToArray();
        stackPeak = stackMax;
        updatePeak = updateMax;
        FactorFlops = flops;
        (splitLast, tailFirst) = ParallelSplit(childList, superFlops, flops);
        if (factorStart[supernodes] > Array.MaxLength || stackPeak > Array.MaxLength)
            throw new InvalidOperationException($"factor of {factorStart[supernodes]} entries is too large");
    }

    /// <summary>True when <paramref name="a"/> shares this analysis' pattern arrays.</summary>
    public bool Matches(CsrMatrix a) =>
        ReferenceEquals(a.RowStart, patternRowStart) && ReferenceEquals(a.ColumnIndices, patternColumns);

    /// <summary>Numeric step. Returns false when a pivot fails, with the original index of its row and
    /// its value; the factor is then unusable until the next successful call.</summary>
    public bool TryFactorize(CsrMatrix a, out int failedRow, out double failedPivot)
    {
        if (a.Rows != n || a.NonZeroCount != patternNonZeros) throw new ArgumentException("matrix pattern differs from the analysed one", nameof(a));
        if (factor.Length != factorStart[supernodes])
        {
            factor = new double[factorStart[supernodes]];
            mainStack = new FrontStack(stackPeak, updatePeak, n, supernodes);
            work = new double[n];
            int widest = 0;
            for (int s = 0; s < supernodes; s++) widest = Math.Max(widest, superFirst[s + 1] - superFirst[s]);
            columnWork = new double[widest];
        }
        var main = mainStack!;
        main.Depth = 0; main.Top = 0;
        double[] values = a.Values;
        if (!TwoThreads || splitLast < 0 || Environment.ProcessorCount < 2)
            return FactorRange(0, supernodes, values, main, out failedRow, out failedPivot);

        // Two subtrees on two threads, each with its own stack; every supernode does the same arithmetic
        // in the same order as in the serial loop, so the factor is bit-identical.
        // Sized for its own subtree: a copy of the whole tree's stack (136 MB at 100 x 100 cells) was far more than it needs.
        var second = secondStack ??= NewRangeStack(splitLast + 1, tailFirst);
        second.Depth = 0; second.Top = 0;
        int rowB = -1; double pivotB = 0; bool okB = true;
        var other = Task.Run(() => okB = FactorRange(splitLast + 1, tailFirst, values, second, out rowB, out pivotB));
        bool okA = FactorRange(0, splitLast + 1, values, main, out int rowA, out double pivotA);
        other.Wait();
        if (!okA) { failedRow = rowA; failedPivot = pivotA; return false; }
        if (!okB) { failedRow = rowB; failedPivot = pivotB; return false; }
        // The second subtree's updates go on top of the first's, as the serial loop leaves them.
        Array.Copy(second.Stack, 0, main.Stack, main.Top, second.Top);
        for (int e = 0; e < second.Depth; e++)
        {
            main.Offset[main.Depth + e] = main.Top + second.Offset[e];
            main.Owner[main.Depth + e] = second.Owner[e];
        }
        main.Depth += second.Depth;
        main.Top += second.Top;
        return FactorRange(tailFirst, supernodes, values, main, out failedRow, out failedPivot);
    }

    /// <summary>Factors supernodes [from, to) in postorder on <paramref name="st"/>'s stack.</summary>
    private bool FactorRange(int from, int to, double[] values, FrontStack st, out int failedRow, out double failedPivot)
    {
        double[] l = factor;
        for (int s = from; s < to; s++)
        {
            int f = superFirst[s], k = superFirst[s + 1] - f;
            int r0 = superRowStart[s], m = superRowStart[s + 1] - r0, mu = m - k;
            long block = factorStart[s];
            for (int t = 0; t < m; t++) st.LocalOf[superRows[r0 + t]] = t;
            Array.Clear(l, (int)block, (int)(factorStart[s + 1] - block));
            Array.Clear(st.Update, 0, (int)Packed(mu));

            // Assemble A's columns of this supernode.
            for (int j = f; j < f + k; j++)
                for (int p = columnStart[j]; p < columnStart[j + 1]; p++)
                    l[Row(block, k, st.LocalOf[columnRow[p]]) + (j - f)] += values[columnSource[p]];

            // Extend-add the children's update matrices (the top childCount entries of the stack).
            int firstChild = st.Depth - childCount[s];
            for (int e = firstChild; e < st.Depth; e++)
            {
                int c = st.Owner[e];
                int kc = superFirst[c + 1] - superFirst[c];
                int rc = superRowStart[c] + kc, mc = superRowStart[c + 1] - rc;
                long u = st.Offset[e];
                for (int x = 0; x < mc; x++)
                {
                    int lx = st.LocalOf[superRows[rc + x]];
                    long ux = u + (long)x * (x + 1) / 2;
                    if (lx < k)
                    {
                        for (int y = 0; y <= x; y++) l[Row(block, k, lx) + st.LocalOf[superRows[rc + y]]] += st.Stack[ux + y];
                    }
                    else
                    {
                        long rowL = Row(block, k, lx);
                        int rowU = (int)Packed(lx - k);
                        for (int y = 0; y <= x; y++)
                        {
                            int ly = st.LocalOf[superRows[rc + y]];
                            if (ly < k) l[rowL + ly] += st.Stack[ux + y];
                            else st.Update[rowU + ly - k] += st.Stack[ux + y];
                        }
                    }
                }
            }
            if (firstChild < st.Depth) st.Top = st.Offset[firstChild];
            st.Depth = firstChild;

            // Dense partial Cholesky of the front: the k pivot columns (bordering, row by row), first
            // the diagonal block L11, then L21 = F21 L11^-T two rows at a time.
            for (int i = 0; i < k; i++)
            {
                long rowI = Row(block, k, i);
                for (int j = 0; j < i; j++)
                {
                    long rowJ = Row(block, k, j);
                    l[rowI + j] = (l[rowI + j] - DenseKernels.Dot(l, rowI, l, rowJ, j)) / l[rowJ + j];
                }
                double original = diagonalSource[f + i] >= 0 ? Math.Abs(values[diagonalSource[f + i]]) : 0;
                double d = l[rowI + i] - DenseKernels.Dot(l, rowI, l, rowI, i);
                if (!(d > RelativePivotTolerance * original) || double.IsInfinity(d))
                {
                    failedRow = NewToOld[f + i];
                    failedPivot = d;
                    return false;
                }
                l[rowI + i] = Math.Sqrt(d);
            }
            int lastPair = k + ((m - k) & ~1);
            for (int i = k; i < lastPair; i += 2)
            {
                long rowI0 = Row(block, k, i), rowI1 = rowI0 + k;
                for (int j = 0; j < k; j++)
                {
                    long rowJ = Row(block, k, j);
                    DenseKernels.Dot2x1(l, rowI0, rowI1, rowJ, j, out double s0, out double s1);
                    l[rowI0 + j] = (l[rowI0 + j] - s0) / l[rowJ + j];
                    l[rowI1 + j] = (l[rowI1 + j] - s1) / l[rowJ + j];
                }
            }
            for (int i = lastPair; i < m; i++)
            {
                long rowI = Row(block, k, i);
                for (int j = 0; j < k; j++)
                {
                    long rowJ = Row(block, k, j);
                    l[rowI + j] = (l[rowI + j] - DenseKernels.Dot(l, rowI, l, rowJ, j)) / l[rowJ + j];
                }
            }
            // Schur complement for the parent: U -= L21 L21^T (lower triangle).
            // Two rows against two rows at a time; the odd last row one by one.
            int pairs = mu & ~1;
            for (int i = 0; i < pairs; i += 2)
            {
                long rowI0 = Row(block, k, k + i), rowI1 = rowI0 + k;
                int u0 = (int)Packed(i), u1 = u0 + i + 1;
                for (int j = 0; j <= i; j += 2)
                {
                    long rowJ0 = Row(block, k, k + j);
                    DenseKernels.Dot2x2(l, rowI0, rowI1, rowJ0, rowJ0 + k, k, out double s00, out double s01, out double s10, out double s11);
                    st.Update[u0 + j] -= s00;
                    if (j + 1 <= i) st.Update[u0 + j + 1] -= s01;
                    st.Update[u1 + j] -= s10;
                    st.Update[u1 + j + 1] -= s11;
                }
            }
            for (int i = pairs; i < mu; i++)
            {
                long rowI = Row(block, k, k + i);
                int rowU = (int)Packed(i);
                for (int j = 0; j <= i; j++)
                    st.Update[rowU + j] -= DenseKernels.Dot(l, rowI, l, Row(block, k, k + j), k);
            }
            if (mu > 0)
            {
                Array.Copy(st.Update, 0, st.Stack, st.Top, Packed(mu));
                st.Offset[st.Depth] = st.Top;
                st.Owner[st.Depth] = s;
                st.Depth++;
                st.Top += Packed(mu);
            }
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
        double[] y = work, l = factor, t = columnWork;
        for (int i = 0; i < n; i++) y[i] = b[NewToOld[i]];
        // L y = P b, supernode by supernode; a supernode's columns are the contiguous run y[f..f+k).
        for (int s = 0; s < supernodes; s++)
        {
            int f = superFirst[s], k = superFirst[s + 1] - f;
            int r0 = superRowStart[s], m = superRowStart[s + 1] - r0;
            long block = factorStart[s];
            for (int i = 0; i < k; i++)
            {
                long rowI = Row(block, k, i);
                y[f + i] = (y[f + i] - DenseKernels.Dot(l, rowI, y, f, i)) / l[rowI + i];
            }
            for (int i = k; i < m; i++)
                y[superRows[r0 + i]] -= DenseKernels.Dot(l, Row(block, k, i), y, f, k);
        }
        // L^T z = y, supernodes in reverse.
        for (int s = supernodes - 1; s >= 0; s--)
        {
            int f = superFirst[s], k = superFirst[s + 1] - f;
            int r0 = superRowStart[s], m = superRowStart[s + 1] - r0;
            long block = factorStart[s];
            for (int j = 0; j < k; j++) t[j] = y[f + j];
            for (int i = k; i < m; i++)
            {
                double zi = y[superRows[r0 + i]];
                long rowI = Row(block, k, i);
                for (int j = 0; j < k; j++) t[j] -= l[rowI + j] * zi;
            }
            for (int j = k - 1; j >= 0; j--)
            {
                long rowJ = Row(block, k, j);
                double zj = t[j] / l[rowJ + j];
                y[f + j] = zj;
                for (int p = 0; p < j; p++) t[p] -= l[rowJ + p] * zj;
            }
        }
        for (int i = 0; i < n; i++) x[NewToOld[i]] = y[i];
    }

    /// <summary>Relaxed supernode amalgamation (Ashcraft &amp; Grimes 1989): a supernode absorbs the child
    /// just before it in postorder when the merged block would hold few explicit zeros; fewer, wider
    /// fronts mean longer dot products and fewer extend-adds. Thresholds as commonly used in
    /// supernodal codes: any merge up to 4 columns, up to 80 % zeros up to 16, 10 % up to 48, else 5 %.
    /// Rewrites <paramref name="firsts"/> (first column of each supernode) and returns each
    /// supernode's row count.</summary>
    private static int[] Amalgamate(List<int> firsts, int[] counts, int[] parent)
    {
        int n = counts.Length;
        var mergedFirst = new List<int>();
        var mergedRows = new List<int>();
        var mergedNonZeros = new List<long>();
        for (int s = 0; s < firsts.Count; s++)
        {
            int f = firsts[s], last = s + 1 < firsts.Count ? firsts[s + 1] - 1 : n - 1;
            int rows = counts[f];
            long nonZeros = 0;
            for (int j = f; j <= last; j++) nonZeros += counts[j];
            // The previous supernode ends at f - 1; it is a child when its last column's parent is here.
            while (mergedFirst.Count > 0)
            {
                int c = mergedFirst.Count - 1;
                int childLast = f - 1, p = parent[childLast];
                if (p < f || p > last) break;
                int childColumns = f - mergedFirst[c];
                int columns = childColumns + (last - f + 1);
                int newRows = childColumns + rows;
                long stored = (long)newRows * columns - (long)columns * (columns - 1) / 2;
                long zeros = stored - (nonZeros + mergedNonZeros[c]);
                double zeroFraction = (double)zeros / stored;
                bool merge = columns <= 4 || (columns <= 16 && zeroFraction < 0.8) ||
                             (columns <= 48 && zeroFraction < 0.1) || zeroFraction < 0.05;
                if (!merge) break;
                f = mergedFirst[c];
                rows = newRows;
                nonZeros += mergedNonZeros[c];
                mergedFirst.RemoveAt(c);
                mergedRows.RemoveAt(c);
                mergedNonZeros.RemoveAt(c);
            }
            mergedFirst.Add(f);
            mergedRows.Add(rows);
            mergedNonZeros.Add(nonZeros);
        }
        firsts.Clear();
        firsts.AddRange(mergedFirst);
        return mergedRows.ToArray();
    }

    /// <summary>Strictly lower part of the permuted pattern by rows: row i lists columns k &lt; i.</summary>
    private static (int[] Start, int[] Columns) LowerRows(CsrMatrix a, int[] oldToNew)
    {
        int n = a.Rows;
        var start = new int[n + 1];
        for (int r = 0; r < n; r++)
            for (int k = a.RowStart[r]; k < a.RowStart[r + 1]; k++)
            {
                int i = oldToNew[r], j = oldToNew[a.ColumnIndices[k]];
                if (j < i) start[i + 1]++;
            }
        for (int i = 0; i < n; i++) start[i + 1] += start[i];
        var cols = new int[start[n]];
        var fill = (int[])start.Clone();
        for (int r = 0; r < n; r++)
            for (int k = a.RowStart[r]; k < a.RowStart[r + 1]; k++)
            {
                int i = oldToNew[r], j = oldToNew[a.ColumnIndices[k]];
                if (j < i) cols[fill[i]++] = j;
            }
        return (start, cols);
    }

    /// <summary>Lower triangle (diagonal included) of the permuted matrix by columns, with the index of
    /// each entry in A.Values, and the diagonal's index.</summary>
    private static (int[] Start, int[] Rows, int[] Source, int[] Diagonal) LowerColumns(CsrMatrix a, int[] oldToNew)
    {
        int n = a.Rows;
        var start = new int[n + 1];
        var diagonal = new int[n];
        Array.Fill(diagonal, -1);
        for (int r = 0; r < n; r++)
            for (int k = a.RowStart[r]; k < a.RowStart[r + 1]; k++)
            {
                int i = oldToNew[r], j = oldToNew[a.ColumnIndices[k]];
                if (i >= j) start[j + 1]++;
            }
        for (int j = 0; j < n; j++) start[j + 1] += start[j];
        var rows = new int[start[n]];
        var source = new int[start[n]];
        var fill = (int[])start.Clone();
        for (int r = 0; r < n; r++)
            for (int k = a.RowStart[r]; k < a.RowStart[r + 1]; k++)
            {
                int i = oldToNew[r], j = oldToNew[a.ColumnIndices[k]];
                if (i < j) continue;
                rows[fill[j]] = i;
                source[fill[j]++] = k;
                if (i == j) diagonal[j] = k;
            }
        return (start, rows, source, diagonal);
    }

    /// <summary>Elimination tree (Liu 1986, with path compression): parent[j] = first row i &gt; j with
    /// L(i, j) != 0, or -1 at a root.</summary>
    private static int[] EliminationTree(int[] rowStart, int[] rowCols)
    {
        int n = rowStart.Length - 1;
        var parent = new int[n];
        var ancestor = new int[n];
        Array.Fill(parent, -1);
        Array.Fill(ancestor, -1);
        for (int i = 0; i < n; i++)
            for (int p = rowStart[i]; p < rowStart[i + 1]; p++)
            {
                int r = rowCols[p];
                while (ancestor[r] != -1 && ancestor[r] != i)
                {
                    int next = ancestor[r];
                    ancestor[r] = i;
                    r = next;
                }
                if (ancestor[r] == -1) { ancestor[r] = i; parent[r] = i; }
            }
        return parent;
    }

    /// <summary>Depth-first postorder of a forest (children in ascending order, roots ascending):
    /// post[t] is the node visited t-th.</summary>
    private static int[] Postorder(int[] parent)
    {
        int n = parent.Length;
        var head = new int[n];
        var next = new int[n];
        Array.Fill(head, -1);
        // Insert in descending order so each child list ends up ascending.
        for (int j = n - 1; j >= 0; j--)
            if (parent[j] >= 0) { next[j] = head[parent[j]]; head[parent[j]] = j; }
        var post = new int[n];
        var stack = new int[n];
        int placed = 0;
        for (int root = 0; root < n; root++)
        {
            if (parent[root] >= 0) continue;
            int depth = 0;
            stack[depth++] = root;
            while (depth > 0)
            {
                int v = stack[depth - 1];
                int child = head[v];
                if (child < 0) { post[placed++] = v; depth--; }
                else { head[v] = next[child]; stack[depth++] = child; }
            }
        }
        return post;
    }

    /// <summary>Nonzeros in each column of L, diagonal included, from the row subtrees: row i of L covers
    /// the tree paths from each k in row i of A up to i (Liu 1990).</summary>
    private static int[] ColumnCounts(int[] rowStart, int[] rowCols, int[] parent)
    {
        int n = parent.Length;
        var count = new int[n];
        var mark = new int[n];
        Array.Fill(count, 1);
        Array.Fill(mark, -1);
        for (int i = 0; i < n; i++)
        {
            mark[i] = i;
            for (int p = rowStart[i]; p < rowStart[i + 1]; p++)
                for (int j = rowCols[p]; mark[j] != i; j = parent[j])
                {
                    count[j]++;
                    mark[j] = i;
                }
        }
        return count;
    }

    /// <summary>Split for the two-thread numeric step (see <see cref="splitLast"/>): below the chain of
    /// single-child supernodes at the top (the top separators), the children's subtrees are cut into two
    /// contiguous groups of about equal work. Only when each group holds at least a fifth of the work and
    /// the whole is worth a thread (2e7 multiply-adds).</summary>
    private (int SplitLast, int TailFirst) ParallelSplit(List<int>[] children, double[] superFlops, double total)
    {
        if (supernodes < 3 || total < 2e7) return (-1, -1);
        // One tree: every supernode but the last is somebody's child.
        int childEntries = 0;
        foreach (var list in children) childEntries += list.Count;
        if (childEntries != supernodes - 1) return (-1, -1);
        int r = supernodes - 1;
        while (children[r].Count == 1) r = children[r][0];
        if (children[r].Count < 2) return (-1, -1);
        var kids = children[r];
        kids.Sort();
        // In postorder the children's subtrees tile [0, r - 1]; cut after the child whose prefix is nearest half.
        double below = 0;
        for (int s = 0; s < r; s++) below += superFlops[s];
        double prefix = 0, best = double.PositiveInfinity;
        int cut = -1, start = 0;
        for (int c = 0; c + 1 < kids.Count; c++)
        {
            for (int s = start; s <= kids[c]; s++) prefix += superFlops[s];
            start = kids[c] + 1;
            double gap = Math.Abs(prefix - 0.5 * below);
            if (gap < best) { best = gap; cut = kids[c]; }
        }
        double first = 0;
        for (int s = 0; s <= cut; s++) first += superFlops[s];
        if (first < 0.2 * total || below - first < 0.2 * total) return (-1, -1);
        return (cut, r);
    }

    /// <summary>A stack for supernodes [first, end), a whole subtree in postorder, factored from empty:
    /// its peak of pending update matrices and its largest update matrix, replayed as the analysis did
    /// for the whole tree.</summary>
    private FrontStack NewRangeStack(int first, int end)
    {
        long now = 0, peak = 0, update = 0;
        var sizes = new Stack<long>();
        for (int s = first; s < end; s++)
        {
            long mu = superRowStart[s + 1] - superRowStart[s] - (superFirst[s + 1] - superFirst[s]);
            for (int c = 0; c < childCount[s]; c++) now -= sizes.Pop();
            now += Packed(mu);
            sizes.Push(Packed(mu));
            peak = Math.Max(peak, now);
            update = Math.Max(update, Packed(mu));
        }
        return new FrontStack(peak, update, n, supernodes);
    }

    /// <summary>Start of row i of a supernode's factor block: the k x k diagonal block is stored as a packed
    /// lower triangle (row i holds i + 1 entries; the upper triangle was 70 MB of zeros at 100 x 100
    /// cells), the rows below it hold k entries each.</summary>
    private static long Row(long block, int k, int i) => i < k ? block + (long)i * (i + 1) / 2 : block + Packed(k) + (long)(i - k) * k;

    /// <summary>Entries of a lower triangle of this order: update matrices are stored packed, row by row
    /// (only the lower triangle is ever formed or read; it halved the stack).</summary>
    private static long Packed(long order) => order * (order + 1) / 2;

    /// <summary>Scratch of one thread of the numeric step: the stack of children's update matrices, the
    /// update matrix being formed and the row-to-front map.</summary>
    private sealed class FrontStack(long stackSize, long updateSize, int n, int supernodes)
    {
        public readonly double[] Stack = new double[stackSize];
        public readonly double[] Update = new double[updateSize];
        public readonly int[] LocalOf = new int[n];
        public readonly long[] Offset = new long[supernodes];
        public readonly int[] Owner = new int[supernodes];
        public int Depth;
        public long Top;
    }
}
