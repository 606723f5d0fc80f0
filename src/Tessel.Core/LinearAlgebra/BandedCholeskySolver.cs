using System.Numerics;
using System.Runtime.InteropServices;

namespace Tessel.Core.LinearAlgebra;

/// <summary>Banded Cholesky in the natural order: a small exact stand-in used by the fitter until
/// (or unless) a sparse solver is supplied. Cost n * b^2 / 2 for half-bandwidth b, so it suits
/// grid problems numbered row by row up to a few tens of thousands of unknowns.</summary>
internal sealed class BandedCholeskySolver : ISpdSolver
{
    private double[] _factor = [];
    private int _n = -1, _bw;
    private CsrMatrix? _factored;

    public SolveStats Solve(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x)
    {
        int n = a.Rows;
        int bw = 0;
        for (int i = 0; i < n; i++)
            if (a.RowStart[i + 1] > a.RowStart[i]) bw = Math.Max(bw, i - a.ColumnIndices[a.RowStart[i]]);
        int w = bw + 1;
        _factored = null;
        if (_factor.LongLength != (long)n * w) _factor = new double[(long)n * w];
        else Array.Clear(_factor);
        var l = _factor;
        for (int i = 0; i < n; i++)
            for (int k = a.RowStart[i]; k < a.RowStart[i + 1]; k++)
            {
                int j = a.ColumnIndices[k];
                if (j <= i) l[(long)i * w + (j - i + bw)] = a.Values[k];
            }
        for (int i = 0; i < n; i++)
        {
            long ri = (long)i * w;
            int j0 = Math.Max(0, i - bw);
            for (int j = j0; j <= i; j++)
            {
                long rj = (long)j * w;
                int k0 = Math.Max(j0, j - bw);
                double s = l[ri + (j - i + bw)] - Dot(l, ri + (k0 - i + bw), rj + (k0 - j + bw), j - k0);
                if (j < i) l[ri + (j - i + bw)] = s / l[rj + bw];
                else
                {
                    if (!(s > 0)) return new SolveStats("banded-cholesky", 0, double.PositiveInfinity, false);
                    l[ri + bw] = Math.Sqrt(s);
                }
            }
        }
        _factored = a; _n = n; _bw = bw;
        Substitute(b, x);
        return new SolveStats("banded-cholesky", 1, 0, true);
    }

    /// <summary>Triangular solves with the factor of the last successful <see cref="Solve"/>.</summary>
    public SolveStats SolveAgain(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x)
    {
        if (!ReferenceEquals(a, _factored) || a.Rows != _n) return Solve(a, b, x);
        Substitute(b, x);
        return new SolveStats("banded-cholesky", 1, double.NaN, true);
    }

    private void Substitute(ReadOnlySpan<double> b, Span<double> x)
    {
        int n = _n, bw = _bw, w = bw + 1;
        var l = _factor;
        var y = new double[n];
        for (int i = 0; i < n; i++)
        {
            long ri = (long)i * w;
            double s = b[i];
            for (int k = Math.Max(0, i - bw); k < i; k++) s -= l[ri + (k - i + bw)] * y[k];
            y[i] = s / l[ri + bw];
        }
        for (int i = n - 1; i >= 0; i--)
        {
            double s = y[i] / l[(long)i * w + bw];
            y[i] = s;
            // Subtract column i of L^T from the rows above, walking L's row i.
            long ri = (long)i * w;
            for (int k = Math.Max(0, i - bw); k < i; k++) y[k] -= l[ri + (k - i + bw)] * s;
        }
        y.CopyTo(x);
    }

    private static double Dot(double[] data, long p, long q, int len)
    {
        var s1 = MemoryMarshal.Cast<double, Vector<double>>(data.AsSpan((int)p, len));
        var s2 = MemoryMarshal.Cast<double, Vector<double>>(data.AsSpan((int)q, len));
        var acc = Vector<double>.Zero;
        for (int k = 0; k < s1.Length; k++) acc += s1[k] * s2[k];
        double sum = Vector.Sum(acc);
        for (int k = s1.Length * Vector<double>.Count; k < len; k++) sum += data[p + k] * data[q + k];
        return sum;
    }
}
