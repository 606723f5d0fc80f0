namespace Tessel.Core.LinearAlgebra;

/// <summary>A sparse Cholesky factorisation bound to one matrix pattern: numeric refactorisation of a
/// refilled matrix, then triangular solves.</summary>
public interface ICholeskyFactor
{
    /// <summary>True when <paramref name="a"/> has the pattern this factor was analysed for.</summary>
    bool Matches(CsrMatrix a);

    /// <summary>Numeric factorisation; throws <see cref="NotPositiveDefiniteException"/> with the failing row.</summary>
    void Factorize(CsrMatrix a);

    /// <summary>x = A^-1 b with the current factor.</summary>
    void Solve(ReadOnlySpan<double> b, Span<double> x);
}
