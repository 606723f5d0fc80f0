using Tessel.Core.LinearAlgebra;

namespace Tessel.Tests.LinearAlgebra;

public class ConjugateGradientSolverTests
{
    [Fact]
    public void WarmStartAtTheSolutionNeedsNoIterations()
    {
        var (a, b) = SparseTestSystems.GaussNewtonSystem(6, 6, 1e-2);
        var x = SparseTestSystems.OracleSolve(a, b);
        var stats = new ConjugateGradientSolver { RelativeTolerance = 1e-8 }.Solve(a, b, x);
        Assert.Equal(0, stats.Iterations);
        Assert.True(stats.Converged);

        var cold = new double[b.Length];
        var coldStats = new ConjugateGradientSolver { RelativeTolerance = 1e-8 }.Solve(a, b, cold);
        Assert.True(coldStats.Iterations > 5, $"{coldStats}");
    }

    [Fact]
    public void ReportsTheTrueResidualAndStopsAtTheIterationLimit()
    {
        var a = SparseTestSystems.GridLaplacian(20, 20, 1e-4);
        var b = SparseTestSystems.RandomVector(a.Rows, 9);
        var x = new double[b.Length];
        var stats = new ConjugateGradientSolver { MaxIterations = 3 }.Solve(a, b, x);
        Assert.False(stats.Converged);
        Assert.Equal(3, stats.Iterations);
        // Recompute |b - A x| / |b| independently.
        var ax = new double[b.Length];
        a.Multiply(x, ax);
        double num = Math.Sqrt(ax.Zip(b, (u, v) => (v - u) * (v - u)).Sum()), den = Math.Sqrt(b.Sum(v => v * v));
        Assert.Equal(num / den, stats.RelativeResidual, 12);
        Assert.True(stats.RelativeResidual > 1e-8);
    }

    [Fact]
    public void ShiftsTheIncompleteFactorOnBreakdownAndStillSolves()
    {
        // IC(0) can meet a non-positive pivot on SPD matrices that are not M-matrices (Kershaw 1978).
        // A 4-cycle with one sign flipped: eigenvalues 3 +- 2 sqrt 2 (> 0, so SPD), but with the fill
        // (3,1) dropped the last pivot is 3 - 4/3 - 4/0.6 = -5 (hand-computed).
        var a = CsrMatrix.FromTriplets(4, 4,
            [(0, 0, 3.0), (1, 1, 3.0), (2, 2, 3.0), (3, 3, 3.0),
             (0, 1, -2.0), (1, 0, -2.0), (1, 2, -2.0), (2, 1, -2.0), (2, 3, -2.0), (3, 2, -2.0), (0, 3, 2.0), (3, 0, 2.0)]);
        Assert.False(IncompleteCholesky.Analyze(a).TryFactorize(a, 0, out int failedRow));
        Assert.Equal(3, failedRow);
        var b = SparseTestSystems.RandomVector(a.Rows, 4);
        var x = new double[b.Length];
        var solver = new ConjugateGradientSolver { RelativeTolerance = 1e-14 };
        var stats = solver.Solve(a, b, x);
        Assert.True(stats.Converged, $"{stats}");
        Assert.True(solver.LastShift > 0);
        Assert.True(SparseTestSystems.RelativeDifference(x, SparseTestSystems.OracleSolve(a, b)) <= 1e-8);
    }

    [Fact]
    public void FallsBackToJacobiWhenNoShiftIsAllowed()
    {
        // The Kershaw-type matrix above with MaxShift = 0: IC(0) cannot be repaired, so the diagonal
        // preconditioner takes over, and CG still reaches the oracle's solution (MathNet dense Cholesky).
        var a = CsrMatrix.FromTriplets(4, 4,
            [(0, 0, 3.0), (1, 1, 3.0), (2, 2, 3.0), (3, 3, 3.0),
             (0, 1, -2.0), (1, 0, -2.0), (1, 2, -2.0), (2, 1, -2.0), (2, 3, -2.0), (3, 2, -2.0), (0, 3, 2.0), (3, 0, 2.0)]);
        var b = new[] { 1.0, -2.0, 0.5, 3.0 };
        var x = new double[4];
        var solver = new ConjugateGradientSolver { MaxShift = 0, RelativeTolerance = 1e-14 };
        var stats = solver.Solve(a, b, x);
        Assert.Equal(-1, solver.LastShift);
        Assert.True(stats.Converged, $"{stats}");
        Assert.True(SparseTestSystems.RelativeDifference(x, SparseTestSystems.OracleSolve(a, b)) <= 1e-10);
    }

    [Fact]
    public void NegativeDefiniteInputIsReportedNotSolved()
    {
        // -(L + I) is negative definite: no CG step exists, so Converged must be false.
        var a = SparseTestSystems.GridLaplacian(6, 5, 1);
        for (int k = 0; k < a.NonZeroCount; k++) a.Values[k] = -a.Values[k];
        var x = new double[a.Rows];
        var stats = new ConjugateGradientSolver().Solve(a, SparseTestSystems.RandomVector(a.Rows, 2), x);
        Assert.False(stats.Converged);
    }

    [Fact]
    public void ZeroRightHandSideGivesZero()
    {
        var a = SparseTestSystems.GridLaplacian(4, 4, 1);
        var x = SparseTestSystems.RandomVector(16, 1);
        var stats = new ConjugateGradientSolver().Solve(a, new double[16], x);
        Assert.True(stats.Converged);
        Assert.All(x, v => Assert.Equal(0.0, v));
    }
}
