using Tessel.Core.LinearAlgebra;

namespace Tessel.Tests.LinearAlgebra;

/// <summary>Every sparse solver against the dense Cholesky oracle (MathNet) on the same seeded systems.</summary>
public class SolverAgreementTests
{
    public static TheoryData<string> Solvers => ["pcg", "skyline", "supernodal", "auto"];

    private static ISpdSolver Create(string name) => name switch
    {
        // Tight CG tolerance: the check is on the solution, |x - x*| <= cond(A) * residual.
        "pcg" => new ConjugateGradientSolver { RelativeTolerance = 1e-14, WarmStart = false },
        "skyline" => new SkylineCholeskySolver(),
        "supernodal" => new SupernodalCholeskySolver(),
        _ => new AutoSolver { RelativeTolerance = 1e-14, MaxIterations = 2000 },
    };

    private static void AssertAgrees(string solverName, CsrMatrix a, double[] b)
    {
        var expected = SparseTestSystems.OracleSolve(a, b);
        var x = new double[b.Length];
        var stats = Create(solverName).Solve(a, b, x);
        Assert.True(stats.Converged, $"{stats}");
        double error = SparseTestSystems.RelativeDifference(x, expected);
        Assert.True(error <= 1e-8, $"{solverName}: relative error {error:E2} ({stats})");
    }

    [Theory]
    [MemberData(nameof(Solvers))]
    public void AgreesOnRandomSparseSpdMatrices(string solver)
    {
        for (int seed = 1; seed <= 3; seed++)
        {
            var a = SparseTestSystems.RandomSpd(150, 3, 0.05, seed);
            AssertAgrees(solver, a, SparseTestSystems.RandomVector(150, 100 + seed));
        }
    }

    [Theory]
    [MemberData(nameof(Solvers))]
    public void AgreesOnAShiftedGridLaplacian(string solver)
    {
        var a = SparseTestSystems.GridLaplacian(17, 13, 1e-3);
        AssertAgrees(solver, a, SparseTestSystems.RandomVector(a.Rows, 7));
    }

    [Theory]
    [MemberData(nameof(Solvers))]
    public void AgreesOnAGaussNewtonEdgeLengthSystem(string solver)
    {
        // J^T J of a curved triangulated 9 x 8 grid has a large null space (isometric bending);
        // w = 1e-3 makes it SPD with condition number of order 1e4.
        var (a, b) = SparseTestSystems.GaussNewtonSystem(9, 8, 1e-3);
        AssertAgrees(solver, a, b);
    }

    [Theory]
    [MemberData(nameof(Solvers))]
    public void AgreesOnADisconnectedShuffledMatrix(string solver)
    {
        // Two grid Laplacians of different shapes and five uncoupled unknowns, shuffled together: the
        // orderings and the elimination forest must cope with several components and roots.
        var first = SparseTestSystems.GridLaplacian(9, 5, 0.2);
        var second = SparseTestSystems.GridLaplacian(4, 11, 0.05);
        int n = first.Rows + second.Rows + 5;
        var t = new List<(int, int, double)>();
        foreach (var (m, offset) in new[] { (first, 0), (second, first.Rows) })
            for (int r = 0; r < m.Rows; r++)
                for (int k = m.RowStart[r]; k < m.RowStart[r + 1]; k++) t.Add((offset + r, offset + m.ColumnIndices[k], m.Values[k]));
        for (int i = first.Rows + second.Rows; i < n; i++) t.Add((i, i, 1.5 + i % 3));
        var a = SparseTestSystems.Permute(CsrMatrix.FromTriplets(n, n, t), SparseTestSystems.RandomPermutation(n, 17));
        AssertAgrees(solver, a, SparseTestSystems.RandomVector(n, 18));
    }

    [Theory]
    [MemberData(nameof(Solvers))]
    public void GivesBitIdenticalResultsOnRepeatedSolves(string solver)
    {
        var (a, b) = SparseTestSystems.GaussNewtonSystem(7, 7, 1e-2);
        var x1 = new double[b.Length];
        var x2 = new double[b.Length];
        Create(solver).Solve(a, b, x1);
        Create(solver).Solve(a, b, x2);
        Assert.Equal(x1, x2);
    }
}
