using MathNet.Numerics.LinearAlgebra.Double;

namespace Tessel.Core.LinearAlgebra;

/// <summary>Converts to a dense matrix and uses MathNet's Cholesky: a test oracle for small n
/// (n &lt;= a few thousand), never the production path (see shared numerics notes).</summary>
public sealed class DenseOracleSolver : ISpdSolver
{
    public SolveStats Solve(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x)
    {
        var dense = DenseMatrix.Create(a.Rows, a.Columns, 0);
        for (int r = 0; r < a.Rows; r++)
            for (int k = a.RowStart[r]; k < a.RowStart[r + 1]; k++) dense[r, a.ColumnIndices[k]] = a.Values[k];
        var rhs = DenseVector.OfArray(b.ToArray());
        MathNet.Numerics.LinearAlgebra.Factorization.Cholesky<double> cholesky;
        try { cholesky = dense.Cholesky(); }
        catch (ArgumentException) { return new SolveStats("dense-cholesky", 0, double.PositiveInfinity, false); }
        var sol = cholesky.Solve(rhs);
        sol.AsArray().CopyTo(x);
        double res = (dense * sol - rhs).L2Norm() / Math.Max(rhs.L2Norm(), double.Epsilon);
        return new SolveStats("dense-cholesky", 1, res, true);
    }
}
