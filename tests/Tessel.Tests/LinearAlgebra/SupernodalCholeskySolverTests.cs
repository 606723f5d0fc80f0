using Tessel.Core.LinearAlgebra;

namespace Tessel.Tests.LinearAlgebra;

public class SupernodalCholeskySolverTests
{
    [Fact]
    public void ReportsTheRowOfTheFailingPivot()
    {
        // As for the skyline solver: only row 5's pivot can fail, whatever the ordering.
        var t = new List<(int, int, double)>();
        for (int i = 0; i < 12; i++)
        {
            t.Add((i, i, i == 5 ? -4.0 : 4.0));
            if (i > 0) { t.Add((i, i - 1, -1.0)); t.Add((i - 1, i, -1.0)); }
        }
        var a = CsrMatrix.FromTriplets(12, 12, t);
        var error = Assert.Throws<NotPositiveDefiniteException>(() => new SupernodalCholeskySolver().Solve(a, new double[12], new double[12]));
        Assert.Equal(5, error.Row);
        Assert.True(error.Pivot <= -4);
    }

    [Fact]
    public void SingularPositiveSemidefiniteInputIsReported()
    {
        var (a, b) = SparseTestSystems.GaussNewtonSystem(5, 5, 0);
        Assert.Throws<NotPositiveDefiniteException>(() => new SupernodalCholeskySolver().Solve(a, b, new double[b.Length]));
    }

    [Fact]
    public void AgreesWithTheOracleUnderAnyOrdering()
    {
        // The multifrontal factor must be right for orderings it was not tuned for: identity, RCM and a
        // random shuffle (dense Cholesky oracle, MathNet).
        var (a, b) = SparseTestSystems.GaussNewtonSystem(7, 6, 1e-3);
        var expected = SparseTestSystems.OracleSolve(a, b);
        foreach (var ordering in new[] { Enumerable.Range(0, a.Rows).ToArray(), ReverseCuthillMcKee.Order(a), SparseTestSystems.RandomPermutation(a.Rows, 3) })
        {
            var factor = SupernodalCholesky.Analyze(a, ordering);
            factor.Factorize(a);
            var x = new double[b.Length];
            factor.Solve(b, x);
            Assert.True(SparseTestSystems.RelativeDifference(x, expected) <= 1e-8);
        }
    }

    [Fact]
    public void FactorOfADenseMatrixIsOneSupernode()
    {
        // A full 5 x 5 SPD matrix: the elimination tree is a chain with equal-shrinking columns, so the
        // fundamental supernode partition has one supernode; its diagonal block is stored as a packed lower
        // triangle, 5 * 6 / 2 = 15 entries (a square block would be 25).
        var t = new List<(int, int, double)>();
        for (int i = 0; i < 5; i++)
            for (int j = 0; j < 5; j++) t.Add((i, j, i == j ? 6.0 : 1.0 / (1 + i + j)));
        var a = CsrMatrix.FromTriplets(5, 5, t);
        var factor = SupernodalCholesky.Analyze(a);
        Assert.Equal(1, factor.SupernodeCount);
        Assert.Equal(15, factor.FactorEntries);
    }

    [Fact]
    public void RefactorisesARefilledMatrixWithTheCachedAnalysis()
    {
        var (jacobian, residuals) = SparseTestSystems.EdgeLengthJacobian(6, 5);
        var normal = NormalEquations.Analyze(jacobian);
        var solver = new SupernodalCholeskySolver();
        var b = new double[normal.Unknowns];
        SupernodalCholesky? firstAnalysis = null;
        foreach (double w in new[] { 1e-1, 1e-4 })
        {
            var a = normal.Fill(jacobian, [], Enumerable.Repeat(w, normal.Unknowns).ToArray());
            normal.Gradient(jacobian, [], residuals, b);
            var x = new double[b.Length];
            solver.Solve(a, b, x);
            Assert.True(SparseTestSystems.RelativeDifference(x, SparseTestSystems.OracleSolve(a, b)) <= 1e-8, $"w = {w}");
            firstAnalysis ??= solver.Analysis;
            Assert.Same(firstAnalysis, solver.Analysis);
        }
    }

    [Fact]
    public void TwoThreadsGiveTheSameBitsAsOne()
    {
        // Determinism (same job, same bytes) must not depend on the machine's core count.
        var (a, b) = SparseTestSystems.GaussNewtonSystem(60, 60, 1e-3);
        var factor = SupernodalCholesky.Analyze(a);
        Assert.True(factor.Splits, "a 60 x 60 grid should split into two subtrees worth a thread each");
        var serial = new double[b.Length];
        factor.TwoThreads = false;
        factor.Factorize(a);
        factor.Solve(b, serial);
        var parallel = new double[b.Length];
        factor.TwoThreads = true;
        factor.Factorize(a);
        factor.Solve(b, parallel);
        Assert.Equal(serial, parallel);
        // And the answer is right: residual of the parallel solve.
        var ax = new double[b.Length];
        a.Multiply(parallel, ax);
        double r = 0, nb = 0;
        for (int i = 0; i < b.Length; i++) { r += (ax[i] - b[i]) * (ax[i] - b[i]); nb += b[i] * b[i]; }
        Assert.True(Math.Sqrt(r / nb) < 1e-10, $"relative residual {Math.Sqrt(r / nb)}");
    }

    [Fact]
    public void AFailedPivotInEitherHalfIsReportedAsInOneThread()
    {
        var (a, b) = SparseTestSystems.GaussNewtonSystem(60, 60, 1e-3);
        var factor = SupernodalCholesky.Analyze(a);
        // Break one diagonal entry in each half of the split in turn: the serial and two-thread runs must
        // name the same row.
        foreach (int original in new[] { factor.NewToOld[0], factor.NewToOld[b.Length / 2] })
        {
            var broken = new CsrMatrix(a.Rows, a.Columns, a.RowStart, a.ColumnIndices, (double[])a.Values.Clone());
            for (int k = broken.RowStart[original]; k < broken.RowStart[original + 1]; k++)
                if (broken.ColumnIndices[k] == original) broken.Values[k] = -1;
            factor.TwoThreads = false;
            Assert.False(factor.TryFactorize(broken, out int serialRow, out _));
            factor.TwoThreads = true;
            Assert.False(factor.TryFactorize(broken, out int parallelRow, out _));
            Assert.Equal(serialRow, parallelRow);
        }
    }
}
