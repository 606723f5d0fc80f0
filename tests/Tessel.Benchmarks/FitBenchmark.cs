using System.Diagnostics;
using System.Globalization;
using Tessel.Core.Fitting;
using Tessel.Core.LinearAlgebra;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Benchmarks;

/// <summary>`fit` verb: one-start epsilon = 0 fits of a Miura sheet on the saddle z = x y / c for a list
/// of sizes: wall time, linear solves, peak working set, the log-log slope of time against unknowns,
/// and the ratio against the dense oracle on the largest size it is run on.</summary>
/// <remarks>Usage: fit [10,20,40,80,100] [solver=supernodal|skyline|auto|banded|dense] [dense=10] [cap=300] [-v].
/// Sizes run in increasing order in one process, so the peak working set reported for a size is the
/// peak over it and every smaller one.</remarks>
public static class FitBenchmark
{
    public static void Run(string[] args)
    {
        int[] sizes = args.FirstOrDefault(a => char.IsDigit(a[0])) is string list ? list.Split(',').Select(int.Parse).ToArray() : [10, 20, 40, 80, 100];
        bool verbose = args.Contains("-v");
        string solverName = Option(args, "solver") ?? "default";
        int denseSize = int.Parse(Option(args, "dense") ?? "0", CultureInfo.InvariantCulture);
        var settings = new FitSettings { StartPerturbation = 0 };
        if (Option(args, "cap") is string cap) settings = settings with { MaxIterations = int.Parse(cap, CultureInfo.InvariantCulture) };
        if (Option(args, "mu") is string mu) settings = settings with { InitialPenalty = double.Parse(mu, CultureInfo.InvariantCulture) };

        Console.WriteLine($"saddle fit, one start, eps = 0, solver {solverName}, {Environment.ProcessorCount} cores");
        Console.WriteLine("| cells | unknowns | time (s) | in solver (s) | LM solves | converged | rms (mm) | max resid (rad) | peak (MB) |");
        Console.WriteLine("|---|---|---|---|---|---|---|---|---|");
        var logN = new List<double>(); var logT = new List<double>();
        foreach (int n in sizes.Order())
        {
            var (pattern, target) = Saddle(n);
            var sw = Stopwatch.StartNew();
            // Large sheets start from a fit with half the cells, as in a build (Fitting/CoarseStart); its time
            // and steps are counted in the row.
            var coarser = TessellationFamilies.Find("miura")!.Coarser(target, SaddleParameters(n));
            var coarse = CoarseStart.For(pattern, target, settings, coarser, () => MakeSolver(solverName), verbose ? Console.WriteLine : null);
            var r = EpsilonConstraintFitter.Fit(pattern, target, CoarseStart.SettingsFrom(settings, coarse), MakeSolver(solverName), coarse?.Positions);
            sw.Stop();
            if (verbose)
                foreach (var h in r.History)
                    Console.WriteLine($"  {h.Index,4} {h.Phase,-20} obj {h.Objective:E3} fair {h.Fairness:E2} rms {h.ShapeRms:E3} P {h.MaxPlanarity:E2} K {h.MaxKawasaki:E2} D {h.MaxDevelopabilityExcess:E2} B {h.MaxBoundViolation:E2} {(h.Accepted ? "" : "rej")} {h.ElapsedSeconds:F2}s");
            double peak = Process.GetCurrentProcess().PeakWorkingSet64 / 1e6;
            Console.WriteLine(FormattableString.Invariant(
                $"| {n}x{n} | {r.Solver.Unknowns} | {sw.Elapsed.TotalSeconds:F2} | {r.Solver.SolveSeconds + (coarse?.Coarse.Solver.SolveSeconds ?? 0):F2} | {r.Solver.LinearSolves + (coarse?.Coarse.Solver.LinearSolves ?? 0)} | {r.Converged} | {r.Shape.Rms * 1e3:F3} | {r.Residuals.MaxConstraintViolation:E1} | {peak:F0} |"));
            logN.Add(Math.Log(r.Solver.Unknowns)); logT.Add(Math.Log(sw.Elapsed.TotalSeconds));
        }
        if (logN.Count >= 2) Console.WriteLine(FormattableString.Invariant($"log-log slope of time against unknowns: {Slope(logN, logT):F2}"));

        if (denseSize > 0)
        {
            var (pattern, target) = Saddle(denseSize);
            var sw = Stopwatch.StartNew();
            var sparse = EpsilonConstraintFitter.Fit(pattern, target, settings, MakeSolver(solverName));
            double ts = sw.Elapsed.TotalSeconds;
            sw.Restart();
            var dense = EpsilonConstraintFitter.Fit(pattern, target, settings, new DenseOracleSolver());
            double td = sw.Elapsed.TotalSeconds;
            double diff = 0;
            for (int k = 0; k < sparse.Mesh.Positions.Length; k++) diff = Math.Max(diff, Math.Abs(sparse.Mesh.Positions[k] - dense.Mesh.Positions[k]));
            Console.WriteLine(FormattableString.Invariant(
                $"dense oracle at {denseSize}x{denseSize}: {td:F2} s vs {ts:F2} s ({td / ts:F1}x), largest coordinate difference {diff:E1} m"));
        }
    }

    private static string? Option(string[] args, string name) =>
        args.FirstOrDefault(a => a.StartsWith(name + "=", StringComparison.Ordinal)) is string s ? s[(name.Length + 1)..] : null;

    private static double Slope(List<double> x, List<double> y)
    {
        double mx = x.Average(), my = y.Average(), sxy = 0, sxx = 0;
        for (int i = 0; i < x.Count; i++) { sxy += (x[i] - mx) * (y[i] - my); sxx += (x[i] - mx) * (x[i] - mx); }
        return sxy / sxx;
    }

    public static ISpdSolver MakeSolver(string name) => name switch
    {
        "auto" => new AutoSolver(),
        "skyline" => new SkylineCholeskySolver(),
        "supernodal" => new SupernodalCholeskySolver(),
        "dense" => new DenseOracleSolver(),
        "banded" => new BandedCholeskySolver(),
        _ => EpsilonConstraintFitter.DefaultSolver(),
    };

    /// <summary>The benchmark case: saddle z = x y / c over a square footprint of 0.1 m cells,
    /// c = 0.25 m per cell (the same total shape at every size), 60 deg facets, 0.03 m deep.</summary>
    public static (GeneratedPattern, ITargetSurface) Saddle(int cells)
    {
        double size = 0.1 * cells;
        var target = new HyperbolicParaboloidSurface(Footprint.Rectangle(size, size), c: 2.5 * size);
        return (TessellationFamilies.Generate("miura", target, SaddleParameters(cells)), target);
    }

    private static FamilyParameters SaddleParameters(int cells) => new(CellsX: cells, CellsY: cells, SectorAngleDeg: 60, FoldDepth: 0.03);
}
