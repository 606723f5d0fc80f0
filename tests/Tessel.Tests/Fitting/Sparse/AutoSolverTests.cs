using Tessel.Core.Fitting.Sparse;

namespace Tessel.Tests.Fitting.Sparse;

public class AutoSolverTests
{
    [Fact]
    public void UsesConjugateGradientsWhenTheyConverge()
    {
        var (a, b) = SparseTestSystems.GaussNewtonSystem(8, 8, 1e-2);
        var solver = new AutoSolver();
        var x = new double[b.Length];
        var stats = solver.Solve(a, b, x, damping: 1e-2);
        Assert.Equal(ConjugateGradientSolver.MethodName, stats.Method);
        Assert.Equal(stats.Method, solver.LastMethod);
        Assert.True(stats.RelativeResidual <= 1e-6);
    }

    [Fact]
    public void FallsBackToCholeskyWhenConjugateGradientsStall()
    {
        var (a, b) = SparseTestSystems.GaussNewtonSystem(8, 8, 1e-4);
        var solver = new AutoSolver { MaxIterations = 5 };
        var x = new double[b.Length];
        var stats = solver.Solve(a, b, x);
        Assert.Equal(AutoSolver.FallbackMethodName, stats.Method);
        Assert.True(SparseTestSystems.RelativeDifference(x, SparseTestSystems.OracleSolve(a, b)) <= 1e-8);
        // The next solve on the same pattern goes direct at once.
        var again = solver.Solve(a, b, x);
        Assert.Equal(SkylineCholeskySolver.MethodName, again.Method);
    }

    [Fact]
    public void GoesDirectForSmallDamping()
    {
        var (a, b) = SparseTestSystems.GaussNewtonSystem(8, 8, 1e-7);
        var x = new double[b.Length];
        var stats = new AutoSolver().Solve(a, b, x, damping: 1e-7);
        Assert.Equal(SkylineCholeskySolver.MethodName, stats.Method);
        Assert.True(stats.RelativeResidual <= 1e-10);
    }
}
