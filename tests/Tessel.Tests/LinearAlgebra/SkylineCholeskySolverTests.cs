using Tessel.Core.LinearAlgebra;

namespace Tessel.Tests.LinearAlgebra;

public class SkylineCholeskySolverTests
{
    [Fact]
    public void ReportsTheRowOfTheFailingPivot()
    {
        // Tridiagonal 4 on the diagonal, -1 beside it, but A(5,5) = -4: every leading block without
        // row 5 is diagonally dominant (so SPD), and row 5's pivot is at most -4 in any order.
        var t = new List<(int, int, double)>();
        for (int i = 0; i < 12; i++)
        {
            t.Add((i, i, i == 5 ? -4.0 : 4.0));
            if (i > 0) { t.Add((i, i - 1, -1.0)); t.Add((i - 1, i, -1.0)); }
        }
        var a = CsrMatrix.FromTriplets(12, 12, t);
        var x = new double[12];
        var error = Assert.Throws<NotPositiveDefiniteException>(() => new SkylineCholeskySolver().Solve(a, new double[12], x));
        Assert.Equal(5, error.Row);
        Assert.True(error.Pivot <= -4);

        var analysis = SkylineCholesky.Analyze(a);
        Assert.False(analysis.TryFactorize(a, out int row, out double pivot));
        Assert.Equal(5, row);
        Assert.Equal(error.Pivot, pivot);
    }

    [Fact]
    public void SingularPositiveSemidefiniteInputIsReported()
    {
        // Undamped J^T J of edge lengths is singular (rigid motions at least): a zero pivot, not a
        // wrong solution.
        var (a, b) = SparseTestSystems.GaussNewtonSystem(5, 5, 0);
        var x = new double[b.Length];
        Assert.Throws<NotPositiveDefiniteException>(() => new SkylineCholeskySolver().Solve(a, b, x));
    }

    [Fact]
    public void RefactorisesARefilledMatrixWithTheCachedAnalysis()
    {
        var (jacobian, residuals) = SparseTestSystems.EdgeLengthJacobian(6, 5);
        var normal = NormalEquations.Analyze(jacobian);
        var solver = new SkylineCholeskySolver();
        var b = new double[normal.Unknowns];
        SkylineCholesky? firstAnalysis = null;
        foreach (double w in new[] { 1e-1, 1e-4 })
        {
            var diagonal = Enumerable.Repeat(w, normal.Unknowns).ToArray();
            var a = normal.Fill(jacobian, [], diagonal);
            normal.Gradient(jacobian, [], residuals, b);
            var x = new double[b.Length];
            solver.Solve(a, b, x);
            Assert.True(SparseTestSystems.RelativeDifference(x, SparseTestSystems.OracleSolve(a, b)) <= 1e-8, $"w = {w}");
            firstAnalysis ??= solver.Analysis;
            Assert.Same(firstAnalysis, solver.Analysis);
        }
    }

    [Fact]
    public void EnvelopeFollowsTheOrdering()
    {
        // With the identity ordering the factor stores exactly the envelope plus the diagonal.
        var a = SparseTestSystems.GridLaplacian(12, 30, 1);
        var identity = Enumerable.Range(0, a.Rows).ToArray();
        var natural = SkylineCholesky.Analyze(a, identity);
        Assert.Equal(SparsityMeasures.EnvelopeSize(a) + a.Rows, natural.FactorEntries);
        Assert.Equal(12, natural.Bandwidth);
        // Hand count: row j*12 + i with j >= 1 reaches back to column (j-1)*12 + i (12 entries; 29 x 12
        // such rows); rows 1..11 of the first grid line reach back one column; plus 360 diagonals.
        Assert.Equal(29 * 12 * 12 + 11 + 360, natural.FactorEntries);
    }
}
