using Tessel.Benchmarks;

// Usage: dotnet run -c Release --project tests/Tessel.Benchmarks -- <verb> [options]
// Verbs: solvers [--max-grid N]   sparse SPD solvers on Gauss-Newton edge-length systems
var verb = args.Length > 0 ? args[0] : "";
switch (verb)
{
    case "solvers":
        SolverBenchmark.Run(args[1..]);
        break;
    default:
        Console.Error.WriteLine("usage: Tessel.Benchmarks <verb>   verbs: solvers [--max-grid N]");
        Environment.ExitCode = 2;
        break;
}
