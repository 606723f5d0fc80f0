using System.Diagnostics;
using Tessel.Core.Fitting;
using Tessel.Core.Fitting.Sparse;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Benchmarks;

/// <summary>`fit` verb: fit time and peak memory of the Miura-to-saddle fit over sheet sizes.</summary>
public static class FitBenchmark
{
    public static void Run(string[] args)
    {
        int[] sizes = args.Length > 0 ? args[0].Split(',').Select(int.Parse).ToArray() : [10, 20, 40, 80, 100];
        bool verbose = args.Contains("-v");
        string solverName = args.FirstOrDefault(a => a.StartsWith("solver=")) is string sn ? sn[7..] : "supernodal";
        double mu = args.FirstOrDefault(a => a.StartsWith("mu=")) is string m ? double.Parse(m[3..], System.Globalization.CultureInfo.InvariantCulture) : new FitSettings().InitialPenalty;
        foreach (int n in sizes)
        {
            var (pattern, target) = Saddle(n);
            var sw = Stopwatch.StartNew();
            var r = EpsilonConstraintFitter.Fit(pattern, target, new FitSettings { StartPerturbation = 0, InitialPenalty = mu }, MakeSolver(solverName));
            sw.Stop();
            if (verbose)
                foreach (var h in r.History)
                    Console.WriteLine($"  {h.Index,4} {h.Phase,-20} obj {h.Objective:E3} fair {h.Fairness:E2} rms {h.ShapeRms:E3} P {h.MaxPlanarity:E2} K {h.MaxKawasaki:E2} D {h.MaxDevelopabilityExcess:E2} B {h.MaxBoundViolation:E2} {(h.Accepted ? "" : "rej")} {h.ElapsedSeconds:F2}s");
            Console.WriteLine($"{n}x{n}: {sw.Elapsed.TotalSeconds:F2} s, {r.Solver.LinearSolves} solves ({r.Solver.Method}, n={r.Solver.Unknowns}), converged {r.Converged} ({r.StopReason}), rms {r.Shape.Rms:E3} m max {r.Shape.Max:E3}, dev {r.Residuals.MaxDevelopability:E2} kaw {r.Residuals.MaxKawasaki:E2} plan {r.Residuals.MaxPlanarity:E2} bound {r.Residuals.MaxBoundViolation:E2}, peak {Process.GetCurrentProcess().PeakWorkingSet64 / 1e6:F0} MB");
        }
    }

    public static ISpdSolver MakeSolver(string name) => name switch
    {
        "auto" => new AutoSolver(),
        "skyline" => new SkylineCholeskySolver(),
        "dense" => new DenseOracleSolver(),
        "banded" => EpsilonConstraintFitter.DefaultSolver(),
        _ => new SupernodalCholeskySolver(),
    };

    /// <summary>The benchmark case: saddle z = x y / c over a square footprint, cell about 0.1 m.</summary>
    public static (Tessel.Core.Tessellation.GeneratedPattern, ITargetSurface) Saddle(int cells)
    {
        double size = 0.1 * cells;
        var target = new HyperbolicParaboloidSurface(Footprint.Rectangle(size, size), c: 2.5 * size);
        var p = new MiuraParameters(CellsX: cells, CellsY: cells, SectorAngleDeg: 60, FoldDepth: 0.03);
        return (MiuraGenerator.Generate(target, p), target);
    }
}
