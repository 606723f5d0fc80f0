namespace Tessel.Core.LinearAlgebra;

/// <summary>Compressed sparse row matrix: row r holds ColumnIndices/Values[RowStart[r] .. RowStart[r+1]),
/// columns sorted ascending within a row. The pattern (RowStart, ColumnIndices) is fixed per topology so
/// Values can be refilled in place each iteration.</summary>
public sealed class CsrMatrix
{
    public int Rows { get; }
    public int Columns { get; }
    /// <summary>Rows+1 offsets into ColumnIndices / Values.</summary>
    public int[] RowStart { get; }
    /// <summary>Column of each stored entry; ascending within a row.</summary>
    public int[] ColumnIndices { get; }
    /// <summary>Value of each stored entry.</summary>
    public double[] Values { get; }

    public CsrMatrix(int rows, int columns, int[] rowStart, int[] columnIndices, double[] values)
    {
        if (rowStart.Length != rows + 1) throw new ArgumentException("RowStart needs Rows+1 entries");
        if (columnIndices.Length != values.Length || rowStart[rows] != values.Length)
            throw new ArgumentException("one column index per value, RowStart[Rows] = number of values");
        Rows = rows; Columns = columns; RowStart = rowStart; ColumnIndices = columnIndices; Values = values;
    }

    public int NonZeroCount => Values.Length;

    /// <summary>y = A x.</summary>
    public void Multiply(ReadOnlySpan<double> x, Span<double> y)
    {
        for (int r = 0; r < Rows; r++)
        {
            double s = 0;
            for (int k = RowStart[r]; k < RowStart[r + 1]; k++) s += Values[k] * x[ColumnIndices[k]];
            y[r] = s;
        }
    }

    /// <summary>Stored value at (r, c), or 0 when (r, c) is not in the pattern.</summary>
    public double At(int r, int c)
    {
        int k = Array.BinarySearch(ColumnIndices, RowStart[r], RowStart[r + 1] - RowStart[r], c);
        return k >= 0 ? Values[k] : 0;
    }

    /// <summary>Builds a matrix from (row, column, value) triplets; duplicates are summed.</summary>
    public static CsrMatrix FromTriplets(int rows, int columns, IReadOnlyList<(int Row, int Column, double Value)> triplets)
    {
        var order = Enumerable.Range(0, triplets.Count)
            .OrderBy(i => triplets[i].Row).ThenBy(i => triplets[i].Column).ToArray();
        var rowStart = new int[rows + 1];
        var cols = new List<int>(triplets.Count);
        var vals = new List<double>(triplets.Count);
        int lastR = -1, lastC = -1;
        foreach (int i in order)
        {
            var (r, c, v) = triplets[i];
            if ((uint)r >= (uint)rows || (uint)c >= (uint)columns) throw new ArgumentOutOfRangeException(nameof(triplets), $"entry ({r}, {c}) outside {rows} x {columns}");
            if (r == lastR && c == lastC) { vals[^1] += v; continue; }
            cols.Add(c); vals.Add(v); rowStart[r + 1]++;
            lastR = r; lastC = c;
        }
        for (int r = 0; r < rows; r++) rowStart[r + 1] += rowStart[r];
        return new CsrMatrix(rows, columns, rowStart, cols.ToArray(), vals.ToArray());
    }
}
