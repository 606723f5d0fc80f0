namespace Tessel.Core.LinearAlgebra;

/// <summary>Direct SPD solver around a Cholesky factor whose symbolic analysis is cached per matrix
/// pattern (reference identity of RowStart and ColumnIndices), so refactorising a refilled matrix costs
/// only the numeric step.</summary>
/// <remarks>Throws <see cref="NotPositiveDefiniteException"/> (with the failing row) when A is not
/// positive definite: a wrong answer is never returned silently. One step of iterative refinement is
/// taken when the first solution's relative residual exceeds 1e-12.</remarks>
public abstract class CachedFactorSolver<TFactor> : ISpdSolver where TFactor : class, ICholeskyFactor
{
    private TFactor? analysis;
    private double[] residual = [], correction = [];

    /// <summary>Name reported in <see cref="SolveStats.Method"/>.</summary>
    protected abstract string Method { get; }

    /// <summary>Symbolic analysis (ordering and storage) of <paramref name="a"/>'s pattern.</summary>
    protected abstract TFactor Analyze(CsrMatrix a);

    /// <summary>The cached analysis of the last pattern solved (null before the first solve).</summary>
    public TFactor? Analysis => analysis;

    /// <summary>The symbolic analysis for <paramref name="a"/>'s pattern: the cached one when the pattern
    /// is the same, else a new one (which replaces the cache).</summary>
    public TFactor AnalysisFor(CsrMatrix a)
    {
        if (analysis is null || !analysis.Matches(a)) analysis = Analyze(a);
        return analysis;
    }

    /// <summary>Solves A x = b; the incoming x is ignored. Iterations counts solves with the factor (1 or 2).</summary>
    public SolveStats Solve(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x)
    {
        int n = a.Rows;
        if (a.Columns != n || b.Length != n || x.Length != n) throw new ArgumentException("A must be n x n, b and x of length n");
        var factor = AnalysisFor(a);
        factor.Factorize(a);
        factor.Solve(b, x);
        if (residual.Length != n) { residual = new double[n]; correction = new double[n]; }

        double bNorm = Norm(b);
        double relative = RelativeResidual(a, b, x, bNorm);
        int solves = 1;
        if (relative > 1e-12)
        {
            factor.Solve(residual, correction);
            for (int i = 0; i < n; i++) x[i] += correction[i];
            relative = RelativeResidual(a, b, x, bNorm);
            solves++;
        }
        return new SolveStats(Method, solves, relative, true);
    }

    /// <summary>Triangular solves with the factor of the last <see cref="Solve"/> (no refinement).</summary>
    public SolveStats SolveAgain(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x)
    {
        if (analysis is null || !analysis.Matches(a)) return Solve(a, b, x);
        analysis.Solve(b, x);
        return new SolveStats(Method, 1, double.NaN, true);
    }

    /// <summary>|b - A x| / |b| (plain |b - A x| when b = 0), leaving b - A x in <see cref="residual"/>.</summary>
    private double RelativeResidual(CsrMatrix a, ReadOnlySpan<double> b, ReadOnlySpan<double> x, double bNorm)
    {
        a.Multiply(x, residual);
        for (int i = 0; i < residual.Length; i++) residual[i] = b[i] - residual[i];
        return bNorm > 0 ? Norm(residual) / bNorm : Norm(residual);
    }

    private static double Norm(ReadOnlySpan<double> v)
    {
        double s = 0;
        for (int i = 0; i < v.Length; i++) s += v[i] * v[i];
        return Math.Sqrt(s);
    }
}
