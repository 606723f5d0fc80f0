namespace Tessel.Core.LinearAlgebra;

/// <summary>Band and envelope measures of a symmetric pattern under an ordering (George &amp; Liu 1981, ch. 4).</summary>
public static class SparsityMeasures
{
    /// <summary>Inverse of a permutation: oldToNew[newToOld[k]] = k.</summary>
    public static int[] Invert(int[] newToOld)
    {
        var oldToNew = new int[newToOld.Length];
        Array.Fill(oldToNew, -1);
        for (int k = 0; k < newToOld.Length; k++)
        {
            int old = newToOld[k];
            if ((uint)old >= (uint)newToOld.Length || oldToNew[old] >= 0) throw new ArgumentException("not a permutation", nameof(newToOld));
            oldToNew[old] = k;
        }
        return oldToNew;
    }

    /// <summary>Bandwidth max |i - j| over stored entries (i, j) after renumbering by
    /// <paramref name="newToOld"/> (null = the given order).</summary>
    public static int Bandwidth(CsrMatrix a, int[]? newToOld = null)
    {
        int[]? oldToNew = newToOld is null ? null : Invert(newToOld);
        int band = 0;
        for (int r = 0; r < a.Rows; r++)
            for (int k = a.RowStart[r]; k < a.RowStart[r + 1]; k++)
            {
                int c = a.ColumnIndices[k];
                int d = oldToNew is null ? Math.Abs(r - c) : Math.Abs(oldToNew[r] - oldToNew[c]);
                band = Math.Max(band, d);
            }
        return band;
    }

    /// <summary>Envelope (profile) size: sum over rows i of (i - first column in row i), after
    /// renumbering (null = the given order). The skyline factor stores this many off-diagonal entries.</summary>
    public static long EnvelopeSize(CsrMatrix a, int[]? newToOld = null)
    {
        int n = a.Rows;
        int[]? oldToNew = newToOld is null ? null : Invert(newToOld);
        var first = new int[n];
        for (int i = 0; i < n; i++) first[i] = i;
        for (int r = 0; r < n; r++)
            for (int k = a.RowStart[r]; k < a.RowStart[r + 1]; k++)
            {
                int i = oldToNew is null ? r : oldToNew[r];
                int j = oldToNew is null ? a.ColumnIndices[k] : oldToNew[a.ColumnIndices[k]];
                if (j < i) first[i] = Math.Min(first[i], j);
                else if (i < j) first[j] = Math.Min(first[j], i);
            }
        long size = 0;
        for (int i = 0; i < n; i++) size += i - first[i];
        return size;
    }
}
