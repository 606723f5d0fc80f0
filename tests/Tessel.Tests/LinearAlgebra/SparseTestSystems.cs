using Tessel.Core.LinearAlgebra;

namespace Tessel.Tests.LinearAlgebra;

/// <summary>Seeded test matrices for the sparse solvers; also compiled into the benchmark project so the
/// benchmark measures exactly the systems the tests check.</summary>
public static class SparseTestSystems
{
    /// <summary>Jacobian of edge-length residuals r_e = |p_a - p_b| - L_e on a curved triangulated grid
    /// of nx x ny vertices (3 unknowns per vertex, one diagonal per quad) and the residuals, with L_e the
    /// flat-grid length. Rows: edges, 6 entries each (d r / d p_a = u, d r / d p_b = -u, u the unit edge
    /// direction a - b). Columns are sorted because a &lt; b.</summary>
    public static (CsrMatrix Jacobian, double[] Residuals) EdgeLengthJacobian(int nx, int ny)
    {
        double h = 1.0 / Math.Max(nx - 1, 1);
        var p = new double[nx * ny * 3];
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                double x = i * h, y = j * h;
                int v = 3 * (j * nx + i);
                p[v] = x;
                p[v + 1] = y;
                // A doubly curved (saddle plus bump) height field so J has no special structure.
                p[v + 2] = 0.4 * x * y - 0.3 * Math.Sin(2.1 * x) * Math.Cos(1.7 * y);
            }
        var edges = new List<(int A, int B, double RestLength)>();
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                int v = j * nx + i;
                if (i + 1 < nx) edges.Add((v, v + 1, h));
                if (j + 1 < ny) edges.Add((v, v + nx, h));
                if (i + 1 < nx && j + 1 < ny) edges.Add((v, v + nx + 1, h * Math.Sqrt(2)));
            }
        int m = edges.Count;
        var rowStart = new int[m + 1];
        var cols = new int[6 * m];
        var vals = new double[6 * m];
        var residuals = new double[m];
        for (int e = 0; e < m; e++)
        {
            var (a, b, restLength) = edges[e];
            double dx = p[3 * a] - p[3 * b], dy = p[3 * a + 1] - p[3 * b + 1], dz = p[3 * a + 2] - p[3 * b + 2];
            double len = Math.Sqrt(dx * dx + dy * dy + dz * dz);
            residuals[e] = len - restLength;
            double[] u = [dx / len, dy / len, dz / len];
            for (int c = 0; c < 3; c++)
            {
                cols[6 * e + c] = 3 * a + c; vals[6 * e + c] = u[c];
                cols[6 * e + 3 + c] = 3 * b + c; vals[6 * e + 3 + c] = -u[c];
            }
            rowStart[e + 1] = 6 * (e + 1);
        }
        return (new CsrMatrix(m, 3 * nx * ny, rowStart, cols, vals), residuals);
    }

    /// <summary>Gauss-Newton system of <see cref="EdgeLengthJacobian"/>: A = J^T J + w I, b = -J^T r.</summary>
    public static (CsrMatrix A, double[] B) GaussNewtonSystem(int nx, int ny, double w)
    {
        var (jacobian, residuals) = EdgeLengthJacobian(nx, ny);
        var normal = NormalEquations.Analyze(jacobian);
        var diagonal = new double[normal.Unknowns];
        Array.Fill(diagonal, w);
        var a = normal.Fill(jacobian, [], diagonal);
        var b = new double[normal.Unknowns];
        normal.Gradient(jacobian, [], residuals, b);
        for (int i = 0; i < b.Length; i++) b[i] = -b[i];
        return (a, b);
    }

    /// <summary>5-point Laplacian of an nx x ny grid (natural row-by-row numbering, x fastest) plus
    /// shift * I. Its natural bandwidth is nx.</summary>
    public static CsrMatrix GridLaplacian(int nx, int ny, double shift)
    {
        var t = new List<(int, int, double)>();
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                int v = j * nx + i;
                t.Add((v, v, 4 + shift));
                if (i > 0) t.Add((v, v - 1, -1));
                if (i + 1 < nx) t.Add((v, v + 1, -1));
                if (j > 0) t.Add((v, v - nx, -1));
                if (j + 1 < ny) t.Add((v, v + nx, -1));
            }
        return CsrMatrix.FromTriplets(nx * ny, nx * ny, t);
    }

    /// <summary>Symmetric renumbering P A P^T: entry (r, c) moves to (oldToNew[r], oldToNew[c]).</summary>
    public static CsrMatrix Permute(CsrMatrix a, int[] oldToNew)
    {
        var t = new List<(int, int, double)>(a.NonZeroCount);
        for (int r = 0; r < a.Rows; r++)
            for (int k = a.RowStart[r]; k < a.RowStart[r + 1]; k++)
                t.Add((oldToNew[r], oldToNew[a.ColumnIndices[k]], a.Values[k]));
        return CsrMatrix.FromTriplets(a.Rows, a.Columns, t);
    }

    /// <summary>Seeded random permutation of 0..n-1 (Fisher-Yates).</summary>
    public static int[] RandomPermutation(int n, int seed)
    {
        var rng = new Random(seed);
        var p = Enumerable.Range(0, n).ToArray();
        for (int i = n - 1; i > 0; i--)
        {
            int j = rng.Next(i + 1);
            (p[i], p[j]) = (p[j], p[i]);
        }
        return p;
    }

    /// <summary>Random sparse SPD matrix B^T B + shift * I, B of (2n) x n with about perRow random
    /// entries in [-1, 1] per row (seeded). Not diagonally dominant, so IC(0) can break down.</summary>
    public static CsrMatrix RandomSpd(int n, int perRow, double shift, int seed)
    {
        var rng = new Random(seed);
        var t = new List<(int, int, double)>();
        for (int r = 0; r < 2 * n; r++)
            for (int k = 0; k < perRow; k++) t.Add((r, rng.Next(n), 2 * rng.NextDouble() - 1));
        var bMatrix = CsrMatrix.FromTriplets(2 * n, n, t);
        var normal = NormalEquations.Analyze(bMatrix);
        var diagonal = new double[n];
        Array.Fill(diagonal, shift);
        return normal.Fill(bMatrix, [], diagonal);
    }

    /// <summary>Seeded random vector with entries in [-1, 1].</summary>
    public static double[] RandomVector(int n, int seed)
    {
        var rng = new Random(seed);
        var v = new double[n];
        for (int i = 0; i < n; i++) v[i] = 2 * rng.NextDouble() - 1;
        return v;
    }

    /// <summary>|x - y| / |y|.</summary>
    public static double RelativeDifference(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        double d = 0, s = 0;
        for (int i = 0; i < x.Length; i++) { d += (x[i] - y[i]) * (x[i] - y[i]); s += y[i] * y[i]; }
        return Math.Sqrt(d / s);
    }

    /// <summary>The dense Cholesky oracle's solution (MathNet).</summary>
    public static double[] OracleSolve(CsrMatrix a, double[] b)
    {
        var x = new double[b.Length];
        new DenseOracleSolver().Solve(a, b, x);
        return x;
    }
}
