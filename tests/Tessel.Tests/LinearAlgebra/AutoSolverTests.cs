using Tessel.Core.LinearAlgebra;

namespace Tessel.Tests.LinearAlgebra;

public class AutoSolverTests
{
    private static readonly string[] DirectMethods = [SkylineCholeskySolver.MethodName, SupernodalCholeskySolver.MethodName];

    [Fact]
    public void UsesConjugateGradientsWhenTheyConverge()
    {
        // CG's budget is the direct factorisation's cost; at 30 x 30 vertices and w = 0.1 CG fits in it.
        var (a, b) = SparseTestSystems.GaussNewtonSystem(30, 30, 1e-1);
        var solver = new AutoSolver();
        var x = new double[b.Length];
        var stats = solver.Solve(a, b, x, damping: 1e-1);
        Assert.Equal(ConjugateGradientSolver.MethodName, stats.Method);
        Assert.Equal(stats.Method, solver.LastMethod);
        Assert.True(stats.RelativeResidual <= 1e-6, $"{stats}");
    }

    [Fact]
    public void FallsBackToCholeskyWhenConjugateGradientsStall()
    {
        var (a, b) = SparseTestSystems.GaussNewtonSystem(8, 8, 1e-4);
        var solver = new AutoSolver { MaxIterations = 5 };
        var x = new double[b.Length];
        var stats = solver.Solve(a, b, x);
        Assert.StartsWith(ConjugateGradientSolver.MethodName + "->", stats.Method);
        Assert.Contains(stats.Method[(ConjugateGradientSolver.MethodName.Length + 2)..], DirectMethods);
        Assert.True(stats.Iterations > 5);
        Assert.True(SparseTestSystems.RelativeDifference(x, SparseTestSystems.OracleSolve(a, b)) <= 1e-8);
        // The next solve on the same pattern goes direct at once.
        var again = solver.Solve(a, b, x);
        Assert.Contains(again.Method, DirectMethods);
    }

    [Fact]
    public void GoesDirectForSmallDamping()
    {
        var (a, b) = SparseTestSystems.GaussNewtonSystem(8, 8, 1e-7);
        var x = new double[b.Length];
        var stats = new AutoSolver().Solve(a, b, x, damping: 1e-7);
        Assert.Contains(stats.Method, DirectMethods);
        Assert.True(stats.RelativeResidual <= 1e-10);
    }

    [Theory]
    [InlineData(DirectFactorization.Skyline, SkylineCholeskySolver.MethodName)]
    [InlineData(DirectFactorization.Supernodal, SupernodalCholeskySolver.MethodName)]
    public void UsesTheRequestedDirectFactorization(DirectFactorization choice, string expected)
    {
        var (a, b) = SparseTestSystems.GaussNewtonSystem(8, 8, 1e-7);
        var x = new double[b.Length];
        var stats = new AutoSolver { DirectMethod = choice }.Solve(a, b, x, damping: 1e-7);
        Assert.Equal(expected, stats.Method);
    }
}
