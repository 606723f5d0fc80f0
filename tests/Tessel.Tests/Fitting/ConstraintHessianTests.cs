using Tessel.Core.Fitting;
using Tessel.Core.LinearAlgebra;
using Tessel.Tests.LinearAlgebra;

namespace Tessel.Tests.Fitting;

/// <summary>The constraint-curvature term of the second-order fit: row Hessians against second
/// differences of the row values (an independent route: values only, central differences), and the
/// reused-factor solve against a fresh one.</summary>
public class ConstraintHessianTests
{
    [Fact]
    public void RowHessiansMatchSecondDifferencesOfValues()
    {
        var (pattern, target) = SaddleCase.Make(3);
        var rows = new FitRows(pattern, target, pattern.LayerOffset, new FitSettings());
        var x = (double[])pattern.Mesh.Positions.Clone();
        // Move off the regular drape so no row sits at a symmetric point where second terms vanish.
        var random = new Random(7);
        for (int k = 0; k < x.Length; k++) x[k] += 0.05 * rows.Scale * (random.NextDouble() - 0.5);
        var hess = new double[15 * 15]; var g0 = new double[15]; var g1 = new double[15]; var scratch = new double[15];
        var kinds = new Dictionary<ResidualKind, int>();
        for (int r = rows.FirstConstraint; r < rows.RowCount; r++)
        {
            var kind = rows.Kind[r];
            if (kind is not (ResidualKind.Planarity or ResidualKind.Kawasaki or ResidualKind.Developability or ResidualKind.FoldAngleBound)) continue;
            if (kinds.GetValueOrDefault(kind) >= 12) continue;
            int s0 = rows.Start[r], m = 3 * (rows.Start[r + 1] - s0);
            rows.RowHessian(r, x, hess, g0, g1);
            double h = 1e-4 * rows.Scale, largest = 0;
            for (int i = 0; i < m; i++) for (int j = 0; j < m; j++) largest = Math.Max(largest, Math.Abs(hess[i * m + j]));
            // Sample a few (i, j) pairs per row: full second differences of every pair would be slow.
            for (int i = 0; i < m; i += 4)
                for (int j = 1; j < m; j += 5)
                {
                    int ci = 3 * rows.Vertices[s0 + i / 3] + i % 3, cj = 3 * rows.Vertices[s0 + j / 3] + j % 3;
                    double F(double di, double dj)
                    {
                        var y = (double[])x.Clone(); y[ci] += di; y[cj] += dj;
                        return rows.EvaluateRow(r, y, scratch);
                    }
                    double second = (F(h, h) - F(h, -h) - F(-h, h) + F(-h, -h)) / (4 * h * h);
                    Assert.True(Math.Abs(second - hess[i * m + j]) <= 1e-4 * largest + 1e-6 / (rows.Scale * rows.Scale),
                        $"row {r} ({kind}) entry ({i}, {j}): forward-difference Hessian {hess[i * m + j]:E4} vs second difference {second:E4}");
                }
            kinds[kind] = kinds.GetValueOrDefault(kind) + 1;
        }
        Assert.Equal(4, kinds.Count);
    }

    [Fact]
    public void SecondSolveWithTheSameFactorMatchesAFreshSolve()
    {
        var (a, b) = SparseTestSystems.GaussNewtonSystem(8, 8, 1e-3);
        foreach (ISpdSolver solver in new ISpdSolver[] { new SupernodalCholeskySolver(), new SkylineCholeskySolver(), new DefaultFitSolver() })
        {
            var first = new double[b.Length];
            solver.Solve(a, b, first);
            var other = new double[b.Length];
            for (int i = 0; i < other.Length; i++) other[i] = Math.Sin(i);
            var again = new double[b.Length];
            var stats = solver.SolveAgain(a, other, again);
            Assert.True(stats.Converged);
            var fresh = new double[b.Length];
            new DenseOracleSolver().Solve(a, other, fresh);
            for (int i = 0; i < fresh.Length; i++) Assert.Equal(fresh[i], again[i], 1e-8 * (1 + Math.Abs(fresh[i])));
        }
    }
}
