using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Double;

namespace Tessel.Core.LinearAlgebra;

/// <summary>Smallest eigenpairs of J^T J by subspace (block inverse) iteration with a shift-invert
/// factorisation of J^T J + shift I and a Rayleigh-Ritz step on J^T J itself each sweep.</summary>
/// <remarks>Ritz values are upper bounds of the true eigenvalues; null vectors converge at the rate
/// shift / (lambda_first_nonzero + shift) per sweep, so a small shift separates them in a few sweeps.</remarks>
internal static class ShiftInvertSubspace
{
    /// <summary>Ritz pairs, ascending.</summary>
    /// <param name="Values">p Ritz values of J^T J, ascending.</param>
    /// <param name="Vectors">p orthonormal Ritz vectors of length n (zero on fixed columns).</param>
    /// <param name="Residuals">p norms of J^T J x - theta x.</param>
    /// <param name="Sweeps">Block solves done.</param>
    internal sealed record RitzPairs(double[] Values, double[][] Vectors, double[] Residuals, int Sweeps);

    /// <summary>Runs sweeps until the Ritz values at or below <paramref name="threshold"/> and the first one above it
    /// change by less than 1e-6 relative plus <paramref name="absoluteTolerance"/> between sweeps, at least 3 and at
    /// most <paramref name="maxSweeps"/> sweeps.</summary>
    /// <param name="j">m x n matrix.</param>
    /// <param name="factor">Factor of J^T J + shift I with the same fixed columns.</param>
    /// <param name="start">p start vectors of length n (used as given, then orthonormalised).</param>
    /// <param name="fixedColumns">n flags or null.</param>
    public static RitzPairs Iterate(CsrMatrix j, EnvelopeCholesky factor, double[][] start, bool[]? fixedColumns,
        double threshold, double absoluteTolerance, int maxSweeps)
    {
        int n = j.Columns, p = start.Length;
        var x = start.Select(v => (double[])v.Clone()).ToArray();
        double[] previous = Enumerable.Repeat(double.PositiveInfinity, p).ToArray();
        RitzPairs? result = null;
        for (int sweep = 1; sweep <= maxSweeps; sweep++)
        {
            var y = new double[p][];
            for (int k = 0; k < p; k++)
            {
                y[k] = new double[n];
                factor.Solve(x[k], y[k]);
                if (fixedColumns != null) for (int c = 0; c < n; c++) if (fixedColumns[c]) y[k][c] = 0;
            }
            Orthonormalise(y);
            result = RayleighRitz(j, y);
            x = result.Vectors;
            bool settled = sweep >= 3;
            int watch = result.Values.Count(v => v <= threshold) + 1;
            for (int k = 0; k < Math.Min(watch, p); k++)
                if (Math.Abs(result.Values[k] - previous[k]) > 1e-6 * Math.Abs(result.Values[k]) + absoluteTolerance) settled = false;
            previous = result.Values;
            result = result with { Sweeps = sweep };
            if (settled) break;
        }
        return result!;
    }

    /// <summary>Like <see cref="Iterate"/>, doubling the block while fewer than two of its Ritz values lie above
    /// <paramref name="threshold"/>, so the whole numerical null space and the first value above it are found.</summary>
    /// <param name="warmStart">Vectors to start from (e.g. the previous null space), topped up with
    /// deterministic pseudo-random ones to <paramref name="initialBlock"/>.</param>
    public static RitzPairs SmallestWithGrowth(CsrMatrix j, EnvelopeCholesky factor, bool[]? fixedColumns,
        double threshold, int initialBlock, IReadOnlyList<double[]>? warmStart = null, int maxSweeps = 60)
    {
        int n = j.Columns;
        int free = fixedColumns == null ? n : fixedColumns.Count(f => !f);
        int p = Math.Min(free, Math.Max(initialBlock, (warmStart?.Count ?? 0) + 2));
        var start = (warmStart ?? []).Take(p).Select(v => (double[])v.Clone()).ToList();
        start.AddRange(RandomBlock(n, p - start.Count, start.Count, fixedColumns));
        while (true)
        {
            var ritz = Iterate(j, factor, start.ToArray(), fixedColumns, threshold, 1e-3 * threshold, maxSweeps);
            int below = ritz.Values.Count(v => v <= threshold);
            if (below < p - 1 || p >= free) return ritz;
            int grown = Math.Min(free, 2 * p);
            start = ritz.Vectors.Concat(RandomBlock(n, grown - p, p, fixedColumns)).ToList();
            p = grown;
        }
    }

    /// <summary>count deterministic pseudo-random vectors of length n, zero on fixed columns.</summary>
    public static double[][] RandomBlock(int n, int count, int seed, bool[]? fixedColumns)
    {
        var block = new double[count][];
        for (int k = 0; k < count; k++)
        {
            var rng = new Random(1000 + seed + k);
            block[k] = new double[n];
            for (int c = 0; c < n; c++) block[k][c] = fixedColumns != null && fixedColumns[c] ? 0 : rng.NextDouble() - 0.5;
        }
        return block;
    }

    /// <summary>Modified Gram-Schmidt, twice for orthogonality to working precision; a vector that vanishes
    /// is replaced by a deterministic pseudo-random one.</summary>
    public static void Orthonormalise(double[][] v)
    {
        for (int pass = 0; pass < 2; pass++)
            for (int k = 0; k < v.Length; k++)
            {
                for (int i = 0; i < k; i++)
                {
                    double d = Dot(v[i], v[k]);
                    for (int c = 0; c < v[k].Length; c++) v[k][c] -= d * v[i][c];
                }
                double norm = Math.Sqrt(Dot(v[k], v[k]));
                if (norm == 0)
                {
                    var rng = new Random(7919 + k);
                    for (int c = 0; c < v[k].Length; c++) v[k][c] = rng.NextDouble() - 0.5;
                    k--; continue;
                }
                for (int c = 0; c < v[k].Length; c++) v[k][c] /= norm;
            }
    }

    private static RitzPairs RayleighRitz(CsrMatrix j, double[][] y)
    {
        int p = y.Length, n = j.Columns;
        var jy = new double[p][];
        for (int k = 0; k < p; k++) { jy[k] = new double[j.Rows]; j.Multiply(y[k], jy[k]); }
        var b = DenseMatrix.Create(p, p, 0);
        for (int a = 0; a < p; a++)
            for (int c = a; c < p; c++) { double d = Dot(jy[a], jy[c]); b[a, c] = d; b[c, a] = d; }
        var evd = b.Evd(Symmetricity.Symmetric);
        var order = Enumerable.Range(0, p).OrderBy(k => evd.EigenValues[k].Real).ToArray();
        var values = new double[p];
        var vectors = new double[p][];
        var residuals = new double[p];
        var jx = new double[j.Rows];
        var jtjx = new double[n];
        for (int t = 0; t < p; t++)
        {
            int k = order[t];
            values[t] = evd.EigenValues[k].Real;
            var x = new double[n];
            for (int a = 0; a < p; a++)
            {
                double w = evd.EigenVectors[a, k];
                for (int c = 0; c < n; c++) x[c] += w * y[a][c];
            }
            vectors[t] = x;
            j.Multiply(x, jx);
            MultiplyTransposed(j, jx, jtjx);
            double r = 0;
            for (int c = 0; c < n; c++) { double d = jtjx[c] - values[t] * x[c]; r += d * d; }
            residuals[t] = Math.Sqrt(r);
        }
        return new RitzPairs(values, vectors, residuals, 0);
    }

    /// <summary>y = J^T x (x has Rows entries, y Columns entries).</summary>
    public static void MultiplyTransposed(CsrMatrix j, ReadOnlySpan<double> x, Span<double> y)
    {
        y.Clear();
        for (int r = 0; r < j.Rows; r++)
        {
            double xr = x[r];
            if (xr == 0) continue;
            for (int k = j.RowStart[r]; k < j.RowStart[r + 1]; k++) y[j.ColumnIndices[k]] += j.Values[k] * xr;
        }
    }

    /// <summary>Largest eigenvalue of J^T J by power iteration (a lower bound that is within a few per cent
    /// after 40 steps, enough to scale a relative tolerance).</summary>
    public static double LargestEigenvalue(CsrMatrix j, int steps = 40)
    {
        int n = j.Columns;
        var rng = new Random(12345);
        var x = new double[n];
        for (int c = 0; c < n; c++) x[c] = rng.NextDouble() - 0.5;
        var jx = new double[j.Rows];
        var y = new double[n];
        double lambda = 0;
        for (int s = 0; s < steps; s++)
        {
            double norm = Math.Sqrt(Dot(x, x));
            if (norm == 0) return 0;
            for (int c = 0; c < n; c++) x[c] /= norm;
            j.Multiply(x, jx);
            lambda = Dot(jx, jx);
            MultiplyTransposed(j, jx, y);
            (x, y) = (y, x);
        }
        return lambda;
    }

    public static double Dot(double[] a, double[] b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s += a[i] * b[i];
        return s;
    }
}
