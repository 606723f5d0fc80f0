namespace Tessel.Core.LinearAlgebra;

/// <summary>Solves A x = b for a symmetric positive definite sparse A (both triangles stored).</summary>
public interface ISpdSolver
{
    /// <summary>Solves into <paramref name="x"/>; its incoming contents are a warm start where the method uses one.</summary>
    SolveStats Solve(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x);

    /// <summary>Solves again with the matrix of the last <see cref="Solve"/> call, unchanged (a second
    /// right-hand side). Solvers that keep a factor reuse it, which costs only triangular solves.</summary>
    SolveStats SolveAgain(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x) => Solve(a, b, x);
}

/// <summary>What one solve cost and how well it ended.</summary>
public readonly record struct SolveStats(string Method, int Iterations, double RelativeResidual, bool Converged);
