using Tessel.Core.Fitting;
using Tessel.Core.Fitting.Residuals;
using Tessel.Core.LinearAlgebra;
using Tessel.Core.Geometry;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Tests.Fitting;

public class EpsilonConstraintFitterTests
{
    private static readonly double Deg = Math.PI / 180;

    private static double Plan(Vec3 a, Vec3 b) => Math.Sqrt((a.X - b.X) * (a.X - b.X) + (a.Y - b.Y) * (a.Y - b.Y));

    [Fact]
    public void PlaneTargetReproducesSchenkGuestCell()
    {
        var target = new PlaneSurface(Footprint.Rectangle(1.2, 1.0), height: 0.5);
        var p = new MiuraParameters(CellsX: 6, CellsY: 5, SectorAngleDeg: 60, FoldDepth: 0.04);
        var pattern = MiuraGenerator.Generate(target, p);
        // The draped regular sheet is already optimal on a plane: the fit must keep it exactly.
        var fit = EpsilonConstraintFitter.Fit(pattern, target, new FitSettings { StartPerturbation = 0 }, new SupernodalCholeskySolver());
        Assert.True(fit.Converged, fit.StopReason);
        var m = fit.Mesh;
        int nx = 13;
        Vec3 X(int i, int j) => m.Vertex(j * nx + i);
        // Measure an interior cell around top vertex (i, j) = (4, 3) (odd rows are the top layer).
        for (int i = 2; i <= 8; i += 2)
            for (int j = 1; j <= 7; j += 2)
            {
                var o = X(i, j);
                double a = (X(i, j + 1) - o).Length, b = (X(i + 1, j) - o).Length;
                double corner = Vec3.Angle(X(i + 1, j) - o, X(i, j + 1) - o);
                double gamma = Math.Min(corner, Math.PI - corner);
                double h = o.Z - X(i, j + 1).Z;
                var cell = new MiuraCell(a, b, gamma, Math.Asin(h / (a * Math.Sin(gamma))));
                // Schenk & Guest, PNAS 110(9) 2013: closed forms for S, L, V (and H by construction of theta).
                Assert.Equal(cell.S, 0.5 * Plan(X(i + 2, j), o), 9);
                Assert.Equal(cell.L, 0.5 * Plan(X(i, j + 2), o), 9);
                var along = X(i + 2, j) - o;
                var off = X(i + 1, j) - o;
                double v = Math.Abs(along.X * off.Y - along.Y * off.X) / Plan(X(i + 2, j), o);
                Assert.Equal(cell.V, v, 9);
                Assert.Equal(cell.H, h, 9);
                // The fold depth asked for is the cell height.
                Assert.Equal(0.04, h, 9);
                Assert.Equal(60 * Deg, gamma, 6);
            }
    }

    [Fact]
    public void ACornerFacetTurnedInsideOutIsNotBuildable()
    {
        // A corner vertex belongs to one facet and to no developability or Kawasaki row; moved within its
        // facet's plane past the diagonal, the facet becomes an arrowhead (reflex corner) whose unsigned
        // corner angles all lie inside the sector-angle bounds. Only the corner-order rows see it, so a fit
        // that ends like this is not called buildable (the flat layout would turn the facet over).
        var target = new PlaneSurface(Footprint.Rectangle(1.0, 0.8), height: 0.3);
        var pattern = MiuraGenerator.Generate(target, new MiuraParameters(CellsX: 5, CellsY: 4, SectorAngleDeg: 60, FoldDepth: 0.04));
        var mesh = pattern.Mesh;
        int[] f = mesh.Faces[Array.FindIndex(mesh.Faces, face => face.Contains(0))];
        int k = Array.IndexOf(f, 0);
        var (a, b, c, d) = (mesh.Vertex(f[k]), mesh.Vertex(f[(k + 1) % 4]), mesh.Vertex(f[(k + 2) % 4]), mesh.Vertex(f[(k + 3) % 4]));
        var middle = 0.5 * (b + d);
        var moved = (double[])mesh.Positions.Clone();
        var settings = new FitSettings();
        var corner = middle + 0.5 * (middle - a);
        corner.Write(moved, 0);
        Assert.InRange(Vec3.Angle(b - corner, d - corner) / Deg, settings.MinSectorAngleDeg, settings.MaxSectorAngleDeg);

        var drape = EpsilonConstraintFitter.Measure(pattern, target, settings, mesh.Positions);
        var turned = EpsilonConstraintFitter.Measure(pattern, target, settings, moved);

        Assert.True(drape.Buildable, drape.Residuals.ToString());
        Assert.False(turned.Buildable);
        // The corner-order value of the arrowhead, worked from its corners: n_a . n_c over the drape's
        // four corner edge lengths is negative, and the violation is its size.
        var g = new double[12];
        double scale = FacetCornerOrder.Scale(mesh.Positions, f[k], f[(k + 1) % 4], f[(k + 2) % 4], f[(k + 3) % 4]);
        double value = FacetCornerOrder.Evaluate(moved, f[k], f[(k + 1) % 4], f[(k + 2) % 4], f[(k + 3) % 4], scale, g);
        Assert.True(value < 0, $"{value}");
        Assert.Equal(-value, turned.Residuals.MaxBoundViolation, 12);
    }

    [Fact]
    public void SaddleFitMeetsConstraintsToRoundOff()
    {
        var fit = SaddleCase.Fit24;
        Assert.True(fit.Residuals.MaxDevelopability <= 1e-9, $"developability {fit.Residuals.MaxDevelopability}");
        Assert.True(fit.Residuals.MaxKawasaki <= 1e-9, $"Kawasaki {fit.Residuals.MaxKawasaki}");
        Assert.True(fit.Residuals.MaxPlanarity <= 1e-9, $"planarity {fit.Residuals.MaxPlanarity}");
        Assert.True(fit.Residuals.MaxBoundViolation <= 1e-9, $"bounds {fit.Residuals.MaxBoundViolation}");
        // The shape follows the saddle to a small fraction of the 0.1 m cell.
        Assert.True(fit.Shape.Rms < 5e-3, $"rms {fit.Shape.Rms}");
        Assert.True(fit.History.Count > 0);
        // 49 x 49 vertices, 3 unknowns each, minus the anchored vertex.
        Assert.Equal(49 * 49 * 3 - 3, fit.Solver.Unknowns);
    }

    [Fact]
    public void ParetoFrontTradesShapeErrorForDevelopability()
    {
        var (pattern, target) = SaddleCase.Make(6);
        var (front, fits) = ParetoSweep.Run(pattern, target, new FitSettings { StartPerturbation = 0 }, [0.0, 0.3], new SupernodalCholeskySolver());
        Assert.Equal(2, front.Count);
        // Haimes, Lasdon & Wismer 1971: relaxing the epsilon bound cannot worsen the optimum.
        Assert.True(front[1].ShapeRms < front[0].ShapeRms, $"rms at 0.3 deg {front[1].ShapeRms} vs at 0 {front[0].ShapeRms}");
        Assert.True(front[0].MaxDevelopability <= 1e-9);
        Assert.True(front[1].MaxDevelopability <= 0.3 * Deg + 1e-9);
        Assert.True(front[1].MaxDevelopability > 1e-6, "the relaxed fit should use some of its allowance");
        Assert.True(fits.All(f => f.Residuals.MaxKawasaki <= 1e-9));
    }

    [Fact]
    public void SparseAndDenseOracleAgree()
    {
        var (pattern, target) = SaddleCase.Make(3);
        var s = new FitSettings { StartPerturbation = 0 };
        var sparse = EpsilonConstraintFitter.Fit(pattern, target, s, new SupernodalCholeskySolver());
        var dense = EpsilonConstraintFitter.Fit(pattern, target, s, new DenseOracleSolver());
        Assert.Equal("dense-cholesky", dense.Solver.Method);
        Assert.NotEqual(dense.Solver.Method, sparse.Solver.Method);
        for (int k = 0; k < sparse.Mesh.Positions.Length; k++)
            Assert.True(Math.Abs(sparse.Mesh.Positions[k] - dense.Mesh.Positions[k]) <= 1e-6, $"coordinate {k}");
        Assert.Equal(dense.Objective, sparse.Objective, 6);
    }

    [Fact]
    public void IterationCapIsReportedAsNotConverged()
    {
        var (pattern, target) = SaddleCase.Make(4);
        var fit = EpsilonConstraintFitter.Fit(pattern, target, new FitSettings { MaxIterations = 2, StartPerturbation = 0 });
        Assert.False(fit.Converged);
        Assert.DoesNotContain("converged", fit.StopReason);
        Assert.True(fit.Solver.LinearSolves <= 2);
    }

    [Fact]
    public void MultiStartIsDeterministicPerSeed()
    {
        var (pattern, target) = SaddleCase.Make(4);
        var s = new FitSettings { Starts = 3, Seed = 11, StartPerturbation = 0.05 };
        var a = MultiStartFitter.Fit(pattern, target, s);
        var b = MultiStartFitter.Fit(pattern, target, s);
        var c = MultiStartFitter.Fit(pattern, target, s with { Seed = 12 });
        Assert.Equal(a.Mesh.Positions, b.Mesh.Positions);
        Assert.Equal(a.Spread.Objectives, b.Spread.Objectives);
        Assert.Equal(3, a.Spread.Objectives.Length);
        double diff = 0;
        for (int k = 0; k < a.Mesh.Positions.Length; k++) diff = Math.Max(diff, Math.Abs(a.Mesh.Positions[k] - c.Mesh.Positions[k]));
        Assert.True(diff > 1e-9, "different seeds should start, and so end, differently");
        Assert.True(a.Spread.Range >= 0);
    }
}
