using System.Diagnostics;
using System.Globalization;
using Tessel.Core.Fitting;
using Tessel.Core.LinearAlgebra;

namespace Tessel.Benchmarks;

/// <summary>`factor` verb: the fit's own normal matrix (saddle Miura, n x n cells, draped state, penalty
/// weights) factorised by each direct solver: symbolic size, multiply-adds and the time of one numeric
/// factorisation plus solve (best of 3); then IC(0)-preconditioned CG on the same system.</summary>
public static class FactorBenchmark
{
    public static void Run(string[] args)
    {
        int[] sizes = args.Length > 0 ? args[0].Split(',').Select(int.Parse).ToArray() : [20, 40];
        Console.WriteLine("| cells | unknowns | nnz(A) | solver | factor entries | multiply-adds | time (ms) |");
        Console.WriteLine("|---|---|---|---|---|---|---|");
        foreach (int n in sizes)
        {
            var (pattern, target) = FitBenchmark.Saddle(n);
            var settings = new FitSettings();
            var rows = new FitRows(pattern, target, pattern.LayerOffset, settings);
            var system = new BlockNormalSystem(rows, pattern.Mesh.VertexCount, [pattern.AnchorVertex]);
            var value = new double[rows.RowCount];
            var grad = new double[3 * rows.Vertices.Length];
            rows.Evaluate(pattern.Mesh.Positions, value, grad);
            var weight = new double[rows.RowCount];
            var residual = new double[rows.RowCount];
            for (int r = 0; r < rows.RowCount; r++) { weight[r] = rows.IsConstraint(r) ? 1e3 : 1; residual[r] = weight[r] * value[r]; }
            var rhs = new double[system.Unknowns];
            system.Assemble(weight, residual, grad, rhs);
            system.Damp(1e-6, 1e-9);
            var a = system.Matrix;
            var x = new double[rhs.Length];
            var supernodal = new SupernodalCholeskySolver();
            var skyline = new SkylineCholeskySolver();
            foreach (var (name, solver, entries, flops) in new (string, ISpdSolver, Func<double>, Func<double>)[]
            {
                ("supernodal", supernodal, () => supernodal.Analysis!.FactorEntries, () => supernodal.Analysis!.FactorFlops),
                ("skyline", skyline, () => skyline.Analysis!.FactorEntries, () => skyline.Analysis!.FactorFlops),
                ("banded", new BandedCholeskySolver(), () => double.NaN, () => double.NaN),
            })
            {
                solver.Solve(a, rhs, x);
                double best = double.PositiveInfinity;
                for (int k = 0; k < 3; k++)
                {
                    var sw = Stopwatch.StartNew();
                    solver.Solve(a, rhs, x);
                    best = Math.Min(best, sw.Elapsed.TotalMilliseconds);
                }
                Console.WriteLine(FormattableString.Invariant($"| {n}x{n} | {a.Rows} | {a.NonZeroCount} | {name} | {entries():E2} | {flops():E2} | {best:F0} |"));
            }
            // The iterative alternative on the same stiff system (penalty 1e6, as a fit's first round):
            // iterations of IC(0)-preconditioned CG to a 1e-8 relative residual, from zero.
            var cg = new ConjugateGradientSolver { WarmStart = false, MaxIterations = 5000 };
            var watch = Stopwatch.StartNew();
            var cgStats = cg.Solve(a, rhs, x);
            Console.WriteLine(FormattableString.Invariant(
                $"| {n}x{n} | {a.Rows} | {a.NonZeroCount} | pcg-ic0 | {(cgStats.Converged ? "" : "not ")}converged in {cgStats.Iterations} iterations | | {watch.Elapsed.TotalMilliseconds:F0} |"));
        }
    }
}
