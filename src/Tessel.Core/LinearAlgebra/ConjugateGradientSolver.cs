namespace Tessel.Core.LinearAlgebra;

/// <summary>Preconditioned conjugate gradients (Hestenes &amp; Stiefel 1952) with an incomplete Cholesky
/// IC(0) preconditioner, for symmetric positive definite A (both triangles stored).</summary>
/// <remarks>
/// The IC(0) pattern analysis is cached per matrix pattern (reference identity of RowStart and
/// ColumnIndices), the numeric factor is rebuilt on every solve. On an IC(0) breakdown the factor is
/// retried on A + shift * diag(A), the shift growing tenfold from 1e-3. Convergence is judged on the
/// true residual |b - A x| / |b|: when the recurred residual says "done" the true one is recomputed and
/// CG restarts from it if it is not. All loops are sequential, so results are bit-reproducible.
/// An instance keeps scratch and caches: use one per thread.
/// </remarks>
public sealed class ConjugateGradientSolver : ISpdSolver
{
    /// <summary>Name reported in <see cref="SolveStats.Method"/>.</summary>
    public const string MethodName = "pcg-ic0";

    private IncompleteCholesky? preconditioner;
    private double[] r = [], z = [], p = [], q = [], jacobi = [];

    /// <summary>Stop when |b - A x| &lt;= RelativeTolerance * |b|.</summary>
    public double RelativeTolerance { get; set; } = 1e-8;
    /// <summary>Give up (Converged = false) after this many iterations.</summary>
    public int MaxIterations { get; set; } = 2000;
    /// <summary>When false, x is zeroed before solving instead of used as a start.</summary>
    public bool WarmStart { get; set; } = true;
    /// <summary>Largest IC(0) diagonal shift tried before falling back to a Jacobi (diagonal) preconditioner.</summary>
    public double MaxShift { get; set; } = 1e3;
    /// <summary>Diagonal shift the last IC(0) factor needed (0 when none; -1 when Jacobi was used).</summary>
    public double LastShift { get; private set; }

    /// <inheritdoc/>
    public SolveStats Solve(CsrMatrix a, ReadOnlySpan<double> b, Span<double> x)
    {
        int n = a.Rows;
        if (a.Columns != n || b.Length != n || x.Length != n) throw new ArgumentException("A must be n x n, b and x of length n");
        if (r.Length != n) { r = new double[n]; z = new double[n]; p = new double[n]; q = new double[n]; }
        if (!WarmStart) x.Clear();

        double bNorm = Math.Sqrt(Dot(b, b));
        if (bNorm == 0)
        {
            x.Clear();
            return new SolveStats(MethodName, 0, 0, true);
        }
        bool useJacobi = !FactorPreconditioner(a);
        double target = RelativeTolerance * bNorm;

        TrueResidual(a, b, x, r);
        double rNorm = Math.Sqrt(Dot(r, r));
        int iterations = 0;
        bool converged = rNorm <= target;
        bool brokeDown = false;
        while (!converged && !brokeDown && iterations < MaxIterations)
        {
            // (Re)start from the residual in r.
            Precondition(useJacobi, r, z);
            z.CopyTo(p, 0);
            double rz = Dot(r, z);
            while (iterations < MaxIterations)
            {
                a.Multiply(p, q);
                double pq = Dot(p, q);
                if (!(pq > 0) || !(rz > 0))
                {
                    // A (or the preconditioner) is not positive definite along p: no CG step exists.
                    brokeDown = true;
                    break;
                }
                double alpha = rz / pq;
                for (int i = 0; i < n; i++) { x[i] += alpha * p[i]; r[i] -= alpha * q[i]; }
                iterations++;
                rNorm = Math.Sqrt(Dot(r, r));
                if (rNorm <= target) break;
                Precondition(useJacobi, r, z);
                double rzNew = Dot(r, z);
                double beta = rzNew / rz;
                rz = rzNew;
                for (int i = 0; i < n; i++) p[i] = z[i] + beta * p[i];
            }
            TrueResidual(a, b, x, r);
            rNorm = Math.Sqrt(Dot(r, r));
            converged = rNorm <= target;
        }
        return new SolveStats(MethodName, iterations, rNorm / bNorm, converged);
    }

    /// <summary>Builds IC(0) for this matrix, shifting on breakdown; false means use Jacobi instead.</summary>
    private bool FactorPreconditioner(CsrMatrix a)
    {
        if (preconditioner is null || !preconditioner.Matches(a)) preconditioner = IncompleteCholesky.Analyze(a);
        double shift = 0;
        while (true)
        {
            if (preconditioner.TryFactorize(a, shift, out _)) { LastShift = shift; return true; }
            shift = shift == 0 ? 1e-3 : shift * 10;
            if (shift > MaxShift)
            {
                LastShift = -1;
                if (jacobi.Length != a.Rows) jacobi = new double[a.Rows];
                for (int i = 0; i < a.Rows; i++)
                {
                    double d = a.At(i, i);
                    jacobi[i] = d > 0 ? 1 / d : 1;
                }
                return false;
            }
        }
    }

    private void Precondition(bool useJacobi, ReadOnlySpan<double> residual, Span<double> result)
    {
        if (!useJacobi) { preconditioner!.Apply(residual, result); return; }
        for (int i = 0; i < residual.Length; i++) result[i] = residual[i] * jacobi[i];
    }

    private static void TrueResidual(CsrMatrix a, ReadOnlySpan<double> b, ReadOnlySpan<double> x, Span<double> residual)
    {
        a.Multiply(x, residual);
        for (int i = 0; i < residual.Length; i++) residual[i] = b[i] - residual[i];
    }

    private static double Dot(ReadOnlySpan<double> u, ReadOnlySpan<double> v)
    {
        double s = 0;
        for (int i = 0; i < u.Length; i++) s += u[i] * v[i];
        return s;
    }
}
