namespace Tessel.Core.LinearAlgebra;

/// <summary>A Cholesky factorisation met a pivot that is not clearly positive: the matrix is not
/// (numerically) positive definite. Gauss-Newton callers usually respond by raising the damping.</summary>
public sealed class NotPositiveDefiniteException : ArithmeticException
{
    /// <summary>Original (unpermuted) index of the row whose pivot failed.</summary>
    public int Row { get; }
    /// <summary>The failed pivot value d = A(i,i) - sum L(i,k)^2 (&lt;= tolerance * A(i,i)).</summary>
    public double Pivot { get; }

    /// <summary>Failure at original row <paramref name="row"/> with pivot value <paramref name="pivot"/>.</summary>
    public NotPositiveDefiniteException(int row, double pivot)
        : base($"matrix is not positive definite: pivot {pivot:G6} at row {row}")
    {
        Row = row;
        Pivot = pivot;
    }
}
