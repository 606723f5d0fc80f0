using System.Diagnostics;
using Tessel.Core.LinearAlgebra;
using Tessel.Tests.LinearAlgebra;

namespace Tessel.Benchmarks;

/// <summary>Times the sparse SPD solvers on Gauss-Newton systems A = J^T J + w I, b = -J^T r of
/// edge-length residuals on curved triangulated grids (the systems the solver tests check), and the
/// dense MathNet oracle on a size it finishes in a few seconds. Prints a Markdown table.</summary>
internal static class SolverBenchmark
{
    private const double Tolerance = 1e-8;
    /// <summary>Skip the skyline solver when its factor would exceed this many doubles (memory).</summary>
    private const long MaxSkylineEntries = 80_000_000;
    /// <summary>... or would take this many multiply-adds (several seconds per solve).</summary>
    private const double MaxSkylineFlops = 5e9;

    public static void Run(string[] options)
    {
        int maxGrid = 200;
        for (int i = 0; i + 1 < options.Length; i++)
            if (options[i] == "--max-grid") maxGrid = int.Parse(options[i + 1]);

        Console.WriteLine($"Solvers on GN edge-length systems, relative tolerance {Tolerance:E0} for PCG, " +
                          $"{Environment.ProcessorCount} cores, .NET {Environment.Version}, single-threaded.");
        Console.WriteLine();
        Console.WriteLine("| grid | n | w | solver | time ms | iterations | rel. residual | allocated MB | process peak MB |");
        Console.WriteLine("|---|---|---|---|---|---|---|---|---|");

        // Warm the JIT on a small system so the first timed row is not penalised.
        var (wa, wb) = SparseTestSystems.GaussNewtonSystem(10, 10, 1e-2);
        new ConjugateGradientSolver().Solve(wa, wb, new double[wb.Length]);
        new SkylineCholeskySolver().Solve(wa, wb, new double[wb.Length]);
        new AutoSolver().Solve(wa, wb, new double[wb.Length]);

        foreach (int grid in new[] { 40, 100, 200 })
        {
            if (grid > maxGrid) continue;
            foreach (double w in new[] { 1e-2, 1e-4 })
            {
                var (jacobian, residuals) = SparseTestSystems.EdgeLengthJacobian(grid, grid);
                var normal = NormalEquations.Analyze(jacobian);
                var diagonal = Enumerable.Repeat(w, normal.Unknowns).ToArray();
                var clock = Stopwatch.StartNew();
                var a = normal.Fill(jacobian, [], diagonal);
                double fillMs = clock.Elapsed.TotalMilliseconds;
                var b = new double[normal.Unknowns];
                normal.Gradient(jacobian, [], residuals, b);
                for (int i = 0; i < b.Length; i++) b[i] = -b[i];
                Row(grid, a.Rows, w, $"normal-equations refill (nnz {a.NonZeroCount:N0})", fillMs, 0, double.NaN, 0);

                Measure(grid, w, a, b, new ConjugateGradientSolver { RelativeTolerance = Tolerance, MaxIterations = 5000 });
                var skyline = SkylineCholesky.Analyze(a);
                long skylineEntries = skyline.FactorEntries;
                if (skylineEntries <= MaxSkylineEntries && skyline.FactorFlops <= MaxSkylineFlops) Measure(grid, w, a, b, new SkylineCholeskySolver(), $" (factor {skylineEntries * 8 / 1e6:F0} MB, {skyline.FactorFlops / 1e9:F2} G multiply-adds)");
                else Console.WriteLine($"| {grid}x{grid} | {a.Rows:N0} | {w:G} | {SkylineCholeskySolver.MethodName} | skipped: factor {skylineEntries * 8 / 1e6:F0} MB, {skyline.FactorFlops / 1e9:F1} G multiply-adds | | | | |");
                var supernodal = SupernodalCholesky.Analyze(a);
                Measure(grid, w, a, b, new SupernodalCholeskySolver(),
                    $" (factor {supernodal.FactorEntries * 8 / 1e6:F0} MB, {supernodal.FactorFlops / 1e9:F2} G multiply-adds, {supernodal.SupernodeCount:N0} supernodes)");
                Measure(grid, w, a, b, new AutoSolver { RelativeTolerance = Tolerance, MaxIterations = 5000 });
            }
        }

        // Dense oracle and the sparse solvers on the same system for the ratio (last: its memory
        // would mask the sparse solvers' peaks).
        DenseComparison(20);
    }

    private static void DenseComparison(int grid)
    {
        var (a, b) = SparseTestSystems.GaussNewtonSystem(grid, grid, 1e-2);
        double dense = Measure(grid, 1e-2, a, b, new DenseOracleSolver());
        double cg = Measure(grid, 1e-2, a, b, new ConjugateGradientSolver { RelativeTolerance = Tolerance });
        double skyline = Measure(grid, 1e-2, a, b, new SkylineCholeskySolver());
        double supernodal = Measure(grid, 1e-2, a, b, new SupernodalCholeskySolver());
        Console.WriteLine($"| {grid}x{grid} | {a.Rows:N0} | 0.01 | time ratio dense / pcg = {dense / cg:F0}, dense / skyline = {dense / skyline:F0}, dense / supernodal = {dense / supernodal:F0} | | | | | |");
    }

    /// <summary>Times one cold solve (symbolic analysis included) and one repeated solve on the same
    /// pattern (the per-iteration cost in a fit); prints both; returns the repeated time in ms.</summary>
    private static double Measure(int grid, double w, CsrMatrix a, double[] b, ISpdSolver solver, string note = "")
    {
        var x = new double[b.Length];
        GC.Collect();
        long before = GC.GetTotalAllocatedBytes(precise: true);
        var clock = Stopwatch.StartNew();
        var stats = solver.Solve(a, b, x);
        double coldMs = clock.Elapsed.TotalMilliseconds;
        double allocatedMb = (GC.GetTotalAllocatedBytes(precise: true) - before) / 1e6;

        Array.Clear(x);
        clock.Restart();
        stats = solver.Solve(a, b, x);
        double warmMs = clock.Elapsed.TotalMilliseconds;
        string method = stats.Method + note + (solver is AutoSolver auto ? $" [auto: {auto.LastMethod}]" : "");
        Row(grid, a.Rows, w, method + $" cold {coldMs:F1} ms", warmMs, stats.Iterations, stats.RelativeResidual, allocatedMb);
        return warmMs;
    }

    private static void Row(int grid, int n, double w, string solver, double ms, int iterations, double residual, double allocatedMb)
    {
        long peak = Process.GetCurrentProcess().PeakWorkingSet64;
        string res = double.IsNaN(residual) ? "" : residual.ToString("E1");
        Console.WriteLine($"| {grid}x{grid} | {n:N0} | {w:G} | {solver} | {ms:F1} | {iterations} | {res} | {allocatedMb:F1} | {peak / 1e6:F0} |");
    }
}
