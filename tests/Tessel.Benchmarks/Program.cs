using Tessel.Benchmarks;

// Usage: dotnet run -c Release --project tests/Tessel.Benchmarks -- <verb> [options]
// Verbs: solvers [--max-grid N]   sparse SPD solvers on Gauss-Newton edge-length systems
//        fit [sizes] [cap=N] [-v] Miura-to-saddle fit times and peak memory (see FitBenchmark.cs)
//        factor [sizes]           one factorisation of the fit's own matrix by each direct solver, then PCG
//        robust [cells=6,12,20] [seeds=1,2,3] [targets=..] [families=..] [scale=50] [fit-only] [-v]  builds of an invented job corpus
var verb = args.Length > 0 ? args[0] : "";
switch (verb)
{
    case "solvers":
        SolverBenchmark.Run(args[1..]);
        break;
    case "factor":
        FactorBenchmark.Run(args[1..]);
        break;
    case "fit":
        FitBenchmark.Run(args[1..]);
        break;
    case "robust":
        RobustnessBenchmark.Run(args[1..]);
        break;
    default:
        Console.Error.WriteLine("usage: Tessel.Benchmarks <verb>   verbs: solvers [--max-grid N], fit [10,20,40] [-v]");
        Environment.ExitCode = 2;
        break;
}
