namespace Tessel.Core.LinearAlgebra;

/// <summary>Which direct factorisation <see cref="AutoSolver"/> falls back to.</summary>
public enum DirectFactorization
{
    /// <summary>The one with the smaller operation count for the pattern (supernodal counted 1.5 times,
    /// its small fronts run slower per operation than the skyline's long dot products).</summary>
    Cheaper,
    /// <summary>Reverse Cuthill-McKee + skyline Cholesky.</summary>
    Skyline,
    /// <summary>Nested dissection + multifrontal supernodal Cholesky.</summary>
    Supernodal,
}

/// <summary>Solver policy for Gauss-Newton / Levenberg-Marquardt steps: preconditioned CG with IC(0) at a
/// loose tolerance first, a direct Cholesky when CG stalls or the caller says the damping is small.
/// Reports which was used (<see cref="SolveStats.Method"/>, <see cref="LastMethod"/>).</summary>
/// <remarks>
/// CG's iteration budget is what the direct solve would cost: the direct factorisation's multiply-adds
/// divided by one CG iteration's (about 2 nnz(A) + 6 n, weighted 4 times for being memory-bound), clamped to [<see cref="MinIterations"/>,
/// <see cref="MaxIterations"/>]. So a stalled CG never wastes more than about one direct solve, and a
/// CG that converges is cheaper than factorising. The measured picture (solvers benchmark): CG wins
/// clearly at damping 1e-2, the direct solvers at 1e-4 and below. After a stall the policy stays direct
/// for the same pattern for <see cref="StickyDirectSolves"/> further solves, because consecutive LM steps
/// have similar conditioning. The choice depends only on the inputs and the call sequence, never on
/// timing, so results stay reproducible. An instance caches analyses and scratch: use one per thread.
/// </remarks>
public sealed class AutoSolver : ISpdSolver
{
    /// <summary>A CG iteration's multiply-adds (sparse products and triangular solves, memory-bound) take
    /// about this many times as long as the dense kernels' of a factorisation (solvers benchmark: about
    /// 0.6 vs 2.5 G per second on this machine).</summary>
    private const double IterationCostFactor = 4;

    private readonly ConjugateGradientSolver iterative = new() { RelativeTolerance = 1e-6, MaxIterations = 1000 };
    private readonly SkylineCholeskySolver skyline = new();
    private readonly SupernodalCholeskySolver supernodal = new();
    private int directSolvesLeft;
    private int[]? stalledPattern;
    private int[]? costedPattern;
    private ISpdSolver? cheaperDirect;
    private double directCost;
    private DirectFactorization chosenFor;

    /// <summary>CG stopping tolerance |b - A x| / |b| (loose by default: inexact Newton steps are fine).</summary>
    public double RelativeTolerance { get => iterative.RelativeTolerance; set => iterative.RelativeTolerance = value; }
    /// <summary>Hard cap on CG iterations per solve.</summary>
    public int MaxIterations { get; set; } = 1000;
    /// <summary>CG always gets at least this many iterations before a fallback.</summary>
    public int MinIterations { get; set; } = 20;
    /// <summary>Below this damping (see <see cref="Solve(CsrMatrix, ReadOnlySpan{double}, Span{double}, double)"/>)
    /// the direct solver is used straight away.</summary>
    public double DirectBelowDamping { get; set; } = 1e-5;
    /// <summary>How many solves on the same pattern go direct after a CG stall.</summary>
    public int StickyDirectSolves { get; set; } = 3;
    /// <summary>Which direct factorisation to fall back to.</summary>
    public DirectFactorization DirectMethod { get; set; } = DirectFactorization.Cheaper;
    /// <summary>Method of the last solve: a solver's MethodName, or "pcg-ic0->" + the direct one's after a fallback.</summary>
    public string LastMethod { get; private set; } = "";

    /// <summary>The CG solver (for diagnostics such as the last IC(0) shift).</summary>
    public ConjugateGradientSolver Iterative => iterative;
    /// <summary>The skyline direct solver.</summary>
    public SkylineCholeskySolver Direct => skyline;
    /// <summary>The supernodal direct solver.</summary>
    public SupernodalCholeskySolver Supernodal => supernodal;

    /// <inheritdoc/>
    public SolveStats Solve(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x) => Solve(a, b, x, double.PositiveInfinity);

    /// <summary>Solves with a damping hint: the smallest value the caller added to the diagonal (LM lambda
    /// or target weight), on the scale where the rows of J have entries of order 1 (as for unit-scaled
    /// residuals; scale it by the typical diagonal of J^T W J otherwise). Throws
    /// <see cref="NotPositiveDefiniteException"/> when the direct solver finds A not positive definite.</summary>
    public SolveStats Solve(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x, double damping)
    {
        var direct = ChooseDirect(a);
        bool sameStalledPattern = ReferenceEquals(stalledPattern, a.ColumnIndices) && directSolvesLeft > 0;
        if (damping < DirectBelowDamping || sameStalledPattern)
        {
            if (sameStalledPattern) directSolvesLeft--;
            var stats = direct.Solve(a, b, x);
            LastMethod = stats.Method;
            return stats;
        }

        double perIteration = IterationCostFactor * (2.0 * a.NonZeroCount + 6.0 * a.Rows);
        double budget = Math.Min(MaxIterations, Math.Max(MinIterations, directCost / perIteration));
        iterative.MaxIterations = (int)budget;
        var cg = iterative.Solve(a, b, x);
        if (cg.Converged)
        {
            LastMethod = cg.Method;
            return cg;
        }
        stalledPattern = a.ColumnIndices;
        directSolvesLeft = StickyDirectSolves;
        var fallback = direct.Solve(a, b, x);
        string method = ConjugateGradientSolver.MethodName + "->" + fallback.Method;
        LastMethod = method;
        return new SolveStats(method, cg.Iterations + fallback.Iterations, fallback.RelativeResidual, fallback.Converged);
    }

    /// <summary>Direct solver for this pattern and its cost in multiply-adds (symbolic analyses cached).</summary>
    private ISpdSolver ChooseDirect(CsrMatrix a)
    {
        if (ReferenceEquals(costedPattern, a.ColumnIndices) && cheaperDirect is not null && chosenFor == DirectMethod) return cheaperDirect;
        double skylineCost = double.PositiveInfinity, supernodalCost = double.PositiveInfinity;
        if (DirectMethod != DirectFactorization.Supernodal)
        {
            var analysis = skyline.AnalysisFor(a);
            if (analysis.FactorEntries <= Array.MaxLength) skylineCost = analysis.FactorFlops;
        }
        if (DirectMethod != DirectFactorization.Skyline) supernodalCost = 1.5 * supernodal.AnalysisFor(a).FactorFlops;
        bool useSkyline = skylineCost <= supernodalCost;
        cheaperDirect = useSkyline ? skyline : supernodal;
        directCost = Math.Min(skylineCost, supernodalCost);
        costedPattern = a.ColumnIndices;
        chosenFor = DirectMethod;
        return cheaperDirect;
    }
}
