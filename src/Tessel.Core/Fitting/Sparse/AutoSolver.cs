namespace Tessel.Core.Fitting.Sparse;

/// <summary>Solver policy for Gauss-Newton / Levenberg-Marquardt steps: preconditioned CG with IC(0)
/// at a loose tolerance first; the skyline Cholesky direct solver when CG stalls (no convergence within
/// its iteration budget) or when the caller says the damping is small. Reports which was used.</summary>
/// <remarks>
/// Measured on this machine (shared numerics notes, and the solvers benchmark): PCG wins clearly when the
/// damping / target weight is large (1e-2), the two are level at 1e-4 and the direct solver wins below
/// that. After a stall the policy stays direct for the same pattern for <see cref="StickyDirectSolves"/>
/// further solves, because consecutive LM steps have similar conditioning.
/// </remarks>
public sealed class AutoSolver : ISpdSolver
{
    /// <summary>Method reported when CG stalled and the direct solver finished the job.</summary>
    public const string FallbackMethodName = ConjugateGradientSolver.MethodName + "->" + SkylineCholeskySolver.MethodName;

    private readonly ConjugateGradientSolver iterative = new() { RelativeTolerance = 1e-6, MaxIterations = 300 };
    private readonly SkylineCholeskySolver direct = new();
    private int directSolvesLeft;
    private int[]? stalledPattern;

    /// <summary>CG stopping tolerance |b - A x| / |b| (loose: inexact Newton steps are fine).</summary>
    public double RelativeTolerance { get => iterative.RelativeTolerance; set => iterative.RelativeTolerance = value; }
    /// <summary>CG iteration budget before falling back to the direct solver.</summary>
    public int MaxIterations { get => iterative.MaxIterations; set => iterative.MaxIterations = value; }
    /// <summary>Below this damping (passed to <see cref="Solve(CsrMatrix, ReadOnlySpan{double}, Span{double}, double)"/>)
    /// the direct solver is used straight away.</summary>
    public double DirectBelowDamping { get; set; } = 1e-5;
    /// <summary>How many solves on the same pattern go direct after a CG stall.</summary>
    public int StickyDirectSolves { get; set; } = 3;
    /// <summary>Method of the last solve: <see cref="ConjugateGradientSolver.MethodName"/>,
    /// <see cref="SkylineCholeskySolver.MethodName"/> or <see cref="FallbackMethodName"/>.</summary>
    public string LastMethod { get; private set; } = "";

    /// <summary>The CG solver used (for its diagnostics such as the last IC(0) shift).</summary>
    public ConjugateGradientSolver Iterative => iterative;
    /// <summary>The direct solver used.</summary>
    public SkylineCholeskySolver Direct => direct;

    /// <inheritdoc/>
    public SolveStats Solve(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x) => Solve(a, b, x, double.PositiveInfinity);

    /// <summary>Solves with a damping hint: the smallest value the caller added to the diagonal (LM lambda
    /// or target weight), on the scale where the rows of J have entries of order 1 (as for unit-scaled
    /// residuals; scale it by the typical diagonal of J^T W J otherwise). Throws
    /// <see cref="NotPositiveDefiniteException"/> when the direct solver finds A not positive definite.</summary>
    public SolveStats Solve(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x, double damping)
    {
        bool sameStalledPattern = ReferenceEquals(stalledPattern, a.ColumnIndices) && directSolvesLeft > 0;
        if (damping < DirectBelowDamping || sameStalledPattern)
        {
            if (sameStalledPattern) directSolvesLeft--;
            var stats = direct.Solve(a, b, x);
            LastMethod = stats.Method;
            return stats;
        }

        var cg = iterative.Solve(a, b, x);
        if (cg.Converged)
        {
            LastMethod = cg.Method;
            return cg;
        }
        stalledPattern = a.ColumnIndices;
        directSolvesLeft = StickyDirectSolves;
        var fallback = direct.Solve(a, b, x);
        LastMethod = FallbackMethodName;
        return new SolveStats(FallbackMethodName, cg.Iterations + fallback.Iterations, fallback.RelativeResidual, fallback.Converged);
    }
}
