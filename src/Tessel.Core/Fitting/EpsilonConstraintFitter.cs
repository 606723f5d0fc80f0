using System.Diagnostics;
using Tessel.Core.Fitting.Sparse;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Fitting;

/// <summary>Fits a generated crease pattern to its target by the epsilon-constraint method (Haimes,
/// Lasdon &amp; Wismer, IEEE Trans. SMC-1, 1971): phase 1 minimises constraint violation from the start;
/// phase 2 minimises shape error + fairness subject to |developability| &lt;= epsilon and every other
/// constraint, by an augmented Lagrangian (Powell-Hestenes-Rockafellar multipliers for interval
/// constraints) with Levenberg-Marquardt inner steps on the sparse normal equations; a final
/// Gauss-Newton projection lands the constraints at round-off level.</summary>
public static class EpsilonConstraintFitter
{
    /// <summary>One start from <paramref name="start"/> (#V*3; null = the draped positions).
    /// <paramref name="solver"/> defaults to <see cref="DefaultSolver"/>.</summary>
    public static FitResult Fit(GeneratedPattern pattern, ITargetSurface target, FitSettings settings,
        ISpdSolver? solver = null, double[]? start = null)
    {
        var rows = new FitRows(pattern, target, pattern.LayerOffset, settings);
        var result = new FitRun(pattern, rows, settings, solver ?? DefaultSolver(),
            (double[])(start ?? pattern.Mesh.Positions).Clone()).Run();
        return result with { Spread = new StartSpread(0, [result.Objective], [result.Converged]) };
    }

    /// <summary>The solver used when none is given.</summary>
    public static ISpdSolver DefaultSolver() => new DefaultFitSolver();

    internal static FitResult FitWithRows(GeneratedPattern pattern, FitRows rows, FitSettings settings,
        ISpdSolver solver, double[] start) => new FitRun(pattern, rows, settings, solver, start).Run();
}

/// <summary>State of one fit: positions, multipliers, penalty, damping and the normal system.</summary>
internal sealed class FitRun
{
    private const string Feasibility = "feasibility", Optimality = "epsilon-constraint", Projection = "projection";
    private const double FeasibilityPull = 1e-3;
    private const double HandOver = 1e-6;

    private readonly GeneratedPattern _pattern;
    private readonly FitRows _rows;
    private readonly FitSettings _s;
    private readonly ISpdSolver _solver;
    private readonly BlockNormalSystem _system;
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private readonly List<FitIteration> _history = [];

    private double[] _x;
    private readonly double[] _value, _grad, _weight, _residual, _multiplier;
    private double _penalty;
    private int _solves;
    private double _solveSeconds;
    private long _linearIterations;
    private string _method = "none";
    private double _damping = 1e-4;

    public FitRun(GeneratedPattern pattern, FitRows rows, FitSettings settings, ISpdSolver solver, double[] start)
    {
        _pattern = pattern; _rows = rows; _s = settings; _solver = solver; _x = start;
        _system = new BlockNormalSystem(rows, pattern.Mesh.VertexCount, [pattern.AnchorVertex]);
        _value = new double[rows.RowCount];
        _grad = new double[3 * rows.Vertices.Length];
        _weight = new double[rows.RowCount];
        _residual = new double[rows.RowCount];
        _multiplier = new double[rows.RowCount];
        _penalty = settings.InitialPenalty;
    }

    public FitResult Run()
    {
        int budget = _s.MaxIterations;
        const int projectionReserve = 15;
        string stop;
        bool optimal = false;

        // Phase 1: constraint violation only, from the start.
        double tolerance = _s.ConstraintTolerance;
        // Phase 1a with a faint pull to the surfaces (well conditioned, lands near the constraint set),
        // phase 1b pure Gauss-Newton on the violation (lands on it).
        Minimise(Feasibility, Math.Max(1, Math.Min(15, budget - projectionReserve)), () => MaxViolation() <= tolerance, out _, stallDecrease: 1e-3);
        Minimise(Projection, Math.Max(1, Math.Min(10, budget - projectionReserve - _solves)), () => MaxViolation() <= tolerance, out _, initialDamping: 1e-8);

        // Phase 2: epsilon-constraint problem by augmented Lagrangian rounds.
        Evaluate(_x);
        double objective = Objective(out _), previousViolation = MaxViolation();
        stop = "iteration limit reached in phase 2";
        while (_solves < budget - projectionReserve)
        {
            int roundBudget = Math.Min(10, budget - projectionReserve - _solves);
            Minimise(Optimality, roundBudget, () => false, out bool stalled);
            Evaluate(_x);
            double violation = MaxViolation();
            UpdateMultipliers();
            if (violation > 0.25 * previousViolation) _penalty = Math.Min(_penalty * 10, 1e12);
            double next = Objective(out _);
            bool small = Math.Abs(objective - next) <= _s.RelativeObjectiveTolerance * Math.Max(Math.Abs(next), 1e-300);
            objective = next; previousViolation = violation;
            // The final projection removes what is left below HandOver (Newton converges quadratically there).
            if (violation <= HandOver && (small || stalled))
            {
                optimal = true;
                stop = small ? "relative objective decrease below tolerance" : "no further descent";
                break;
            }
        }

        // Final projection onto the constraints (Gauss-Newton on the violation, tiny damping).
        Minimise(Projection, budget - _solves, () => MaxViolation() <= 0.1 * tolerance, out _, initialDamping: 1e-10);
        Evaluate(_x);
        var residuals = Residuals();
        bool converged = optimal && residuals.MaxConstraintViolation <= tolerance;
        if (optimal && !converged) stop = "constraints not within tolerance after projection";
        double total = Objective(out double fairness);
        var mesh = _pattern.Mesh.WithPositions((double[])_x.Clone());
        return new FitResult(mesh, _s.EpsilonDeg, converged, converged ? "converged: " + stop : stop, total, fairness, Shape(),
            residuals, _history, new SolverStatistics(_method, _solves, _linearIterations, _system.Unknowns, _system.Matrix.NonZeroCount, _solveSeconds, _clock.Elapsed.TotalSeconds),
            new StartSpread(0, [total], [converged]));
    }

    /// <summary>Levenberg-Marquardt on the phase's merit function until <paramref name="done"/> holds,
    /// the budget is spent or steps stop helping (<paramref name="stalled"/>).</summary>
    private void Minimise(string phase, int maxSolves, Func<bool> done, out bool stalled, double initialDamping = 1e-4, double stallDecrease = 1e-12)
    {
        stalled = false;
        double damping = phase == Optimality ? _damping : initialDamping;
        int used = 0, rejectedInRow = 0;
        var rhs = new double[_system.Unknowns];
        var step = new double[_system.Unknowns];
        var trial = new double[_x.Length];
        var trialValue = new double[_rows.RowCount];
        var trialGrad = new double[_grad.Length];
        Evaluate(_x);
        double merit = Merit(phase);
        if (done()) return;
        double[]? undamped = null;
        bool assembled = false;
        while (used < maxSolves)
        {
            if (!assembled)
            {
                Merit(phase);
                _system.Assemble(_weight, _residual, _grad, rhs);
                undamped = (double[])_system.Matrix.Values.Clone();
                assembled = true;
            }
            else Array.Copy(undamped!, _system.Matrix.Values, undamped!.Length);
            double maxDiag = 0;
            foreach (var v in undamped!) maxDiag = Math.Max(maxDiag, Math.Abs(v));
            _system.Damp(damping, 1e-9 * maxDiag + 1e-300);
            Array.Clear(step);
            long t0 = System.Diagnostics.Stopwatch.GetTimestamp();
            var stats = _solver.Solve(_system.Matrix, rhs, step);
            _solveSeconds += System.Diagnostics.Stopwatch.GetElapsedTime(t0).TotalSeconds;
            _solves++; used++; _linearIterations += stats.Iterations; _method = stats.Method;
            _system.Apply(_x, step, trial);
            double trialMerit = double.PositiveInfinity;
            if (AllFinite(step))
            {
                (_value.AsSpan()).CopyTo(trialValue); _grad.AsSpan().CopyTo(trialGrad);
                Evaluate(trial);
                trialMerit = Merit(phase);
            }
            bool accept = trialMerit < merit;
            if (accept)
            {
                (_x, trial) = (trial, _x);
                double decrease = (merit - trialMerit) / Math.Max(merit, 1e-300);
                merit = trialMerit;
                damping = Math.Max(damping / 3, 1e-12);
                rejectedInRow = 0;
                assembled = false;
                Record(phase, true);
                if (phase == Optimality) _damping = damping;
                if (done()) return;
                if (decrease < stallDecrease) { stalled = true; return; }
            }
            else
            {
                // Restore the values and gradients of the current point.
                trialValue.AsSpan().CopyTo(_value); trialGrad.AsSpan().CopyTo(_grad);
                Merit(phase);
                damping *= 4;
                if (phase == Optimality) _damping = damping;
                Record(phase, false);
                if (++rejectedInRow >= 12 || damping > 1e12) { stalled = true; return; }
            }
        }
    }

    private static bool AllFinite(double[] v)
    {
        foreach (var d in v) if (!double.IsFinite(d)) return false;
        return true;
    }

    private void Evaluate(double[] x) => _rows.Evaluate(x, _value, _grad);

    /// <summary>Fills weights and residuals for the phase from the current values and returns
    /// half the sum of squared residuals.</summary>
    private double Merit(string phase)
    {
        bool optimality = phase == Optimality;
        double sum = 0;
        double root = Math.Sqrt(_penalty);
        for (int r = 0; r < _rows.RowCount; r++)
        {
            double res, w;
            if (!_rows.IsConstraint(r))
            {
                // Phase 1 keeps a faint pull toward the surfaces: it gives the many directions the
                // constraints leave free some curvature, so the steps stay well conditioned.
                w = phase == Feasibility ? FeasibilityPull : optimality ? 1 : 0;
                if (w == 0) { _weight[r] = 0; _residual[r] = 0; continue; }
                res = w * _value[r];
            }
            else if (optimality)
            {
                double z = _value[r] + _multiplier[r] / _penalty;
                double excess = Excess(z, r);
                res = root * excess;
                w = excess != 0 || _rows.Lo[r] == _rows.Hi[r] ? root : 0;
            }
            else
            {
                double excess = Excess(_value[r], r);
                res = excess;
                w = excess != 0 || _rows.Lo[r] == _rows.Hi[r] ? 1 : 0;
            }
            _weight[r] = w; _residual[r] = w == 0 ? 0 : res;
            sum += res * res;
        }
        return 0.5 * sum;
    }

    private double Excess(double g, int r) => g < _rows.Lo[r] ? g - _rows.Lo[r] : g > _rows.Hi[r] ? g - _rows.Hi[r] : 0;

    /// <summary>Powell-Hestenes-Rockafellar update for interval constraints: lambda = mu * (z - clamp(z)).</summary>
    private void UpdateMultipliers()
    {
        for (int r = _rows.FirstConstraint; r < _rows.RowCount; r++)
            _multiplier[r] = _penalty * Excess(_value[r] + _multiplier[r] / _penalty, r);
    }

    private double MaxViolation()
    {
        double m = 0;
        for (int r = _rows.FirstConstraint; r < _rows.RowCount; r++) m = Math.Max(m, Math.Abs(Excess(_value[r], r)));
        return m;
    }

    private double Objective(out double fairness)
    {
        double total = 0; fairness = 0;
        for (int r = 0; r < _rows.FirstConstraint; r++)
        {
            double q = _value[r] * _value[r];
            total += q;
            if (_rows.Kind[r] == ResidualKind.Fairness) fairness += q;
        }
        return total;
    }

    private ShapeError Shape()
    {
        double sum = 0, max = 0; int count = 0;
        for (int r = 0; r < _rows.FirstConstraint; r++)
        {
            if (_rows.Kind[r] != ResidualKind.TopDistance && _rows.Kind[r] != ResidualKind.BottomDistance) continue;
            double d = _value[r] * _rows.Scale;
            sum += d * d; max = Math.Max(max, Math.Abs(d)); count++;
        }
        return new ShapeError(count > 0 ? Math.Sqrt(sum / count) : 0, max);
    }

    private FitResiduals Residuals()
    {
        double dev = 0, devExcess = 0, kaw = 0, plan = 0, bound = 0;
        for (int r = _rows.FirstConstraint; r < _rows.RowCount; r++)
        {
            double v = Math.Abs(_value[r]), e = Math.Abs(Excess(_value[r], r));
            switch (_rows.Kind[r])
            {
                case ResidualKind.Planarity: plan = Math.Max(plan, v); break;
                case ResidualKind.Kawasaki: kaw = Math.Max(kaw, v); break;
                case ResidualKind.Developability: dev = Math.Max(dev, v); devExcess = Math.Max(devExcess, e); break;
                default: bound = Math.Max(bound, e); break;
            }
        }
        return new FitResiduals(dev, devExcess, kaw, plan, bound);
    }

    private void Record(string phase, bool accepted)
    {
        var res = Residuals();
        double total = Objective(out double fairness);
        _history.Add(new FitIteration(_history.Count, phase, total, fairness, Shape().Rms, res.MaxPlanarity, res.MaxKawasaki,
            res.MaxDevelopabilityExcess, res.MaxBoundViolation, accepted, _clock.Elapsed.TotalSeconds));
    }
}
