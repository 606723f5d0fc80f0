using Tessel.Core.LinearAlgebra;

namespace Tessel.Core.Fitting;

/// <summary>The fitter's default SPD solver: an exact banded Cholesky while the band is small (it
/// measured fastest on sheets up to a few thousand vertices, numbered row by row), the nested-dissection
/// supernodal Cholesky beyond that (its fill grows far slower than the band's). The choice depends only
/// on the pattern, so results stay reproducible.</summary>
internal sealed class DefaultFitSolver : ISpdSolver
{
    /// <summary>Largest band storage n * (b + 1), in numbers, handled by the banded solver. The fit's own
    /// matrices (benchmark verb `factor`) cross over at about 24 x 24 Miura cells (1.1 M numbers, both
    /// about 50 ms); at 40 x 40 the supernodal factor is twice as fast (209 vs 379 ms).</summary>
    public const long BandLimit = 1_500_000;

    private readonly BandedCholeskySolver _banded = new();
    private readonly SupernodalCholeskySolver _supernodal = new();
    private int[]? _pattern;
    private bool _useBand;

    public SolveStats Solve(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x)
    {
        if (!ReferenceEquals(_pattern, a.ColumnIndices))
        {
            _pattern = a.ColumnIndices;
            long bw = 0;
            for (int i = 0; i < a.Rows; i++)
                if (a.RowStart[i + 1] > a.RowStart[i]) bw = Math.Max(bw, i - a.ColumnIndices[a.RowStart[i]]);
            _useBand = (long)a.Rows * (bw + 1) <= BandLimit;
        }
        return _useBand ? _banded.Solve(a, b, x) : _supernodal.Solve(a, b, x);
    }

    public SolveStats SolveAgain(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x) =>
        _useBand ? _banded.SolveAgain(a, b, x) : _supernodal.SolveAgain(a, b, x);
}
