using System.Diagnostics;
using Tessel.Core.LinearAlgebra;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Fitting;

/// <summary>Fits a generated crease pattern to its target by the epsilon-constraint method (Haimes,
/// Lasdon &amp; Wismer, IEEE Trans. SMC-1, 1971): phase 1 minimises constraint violation from the start;
/// phase 2 minimises shape error + fairness subject to |developability| &lt;= epsilon and every other
/// constraint, by an augmented Lagrangian (Powell-Hestenes-Rockafellar multipliers for interval
/// constraints). Its inner steps are damped Newton steps on the sparse system: Gauss-Newton for the
/// objective plus the constraints' curvature sum_r lambda_r grad^2 g_r, each followed by a second-order
/// correction with the same factor (Nocedal &amp; Wright, Numerical Optimization, 2nd ed., 2006, sections
/// 17.3 and 15.6). A final Gauss-Newton projection lands the constraints at round-off level.</summary>
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

    /// <summary>Residuals and shape error of <paramref name="positions"/> (#V*3) against
    /// <paramref name="target"/>, without any step: a fit result that moved nothing.</summary>
    public static FitResult Measure(GeneratedPattern pattern, ITargetSurface target, FitSettings settings, double[] positions)
    {
        var rows = new FitRows(pattern, target, pattern.LayerOffset, settings);
        return new FitRun(pattern, rows, settings, DefaultSolver(), (double[])positions.Clone()).Measure();
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
    /// <summary>Weight of the shape rows in phase 1a: faint, so the constraints dominate, but enough to
    /// give the directions the constraints leave free some curvature (a well-conditioned step).</summary>
    private const double FeasibilityPull = 1e-3;
    /// <summary>Phase 2 hands over to the final projection once the violation is below this (rad): Newton
    /// on the constraints converges quadratically from there.</summary>
    private const double HandOver = 1e-6;
    /// <summary>Linear solves kept back from phase 1 and 2 for the final projection.</summary>
    private const int ProjectionReserve = 15;
    /// <summary>Step cap of phase 1a: it only needs to come near the constraint set.</summary>
    private const int PulledFeasibilitySteps = 15;
    /// <summary>Step cap of phase 1b: sheet-wide modes of the developability residual are weakly determined,
    /// so landing from the pulled point can take tens of steps on large sheets.</summary>
    private const int FeasibilityProjectionSteps = 60;
    /// <summary>Phase 1a stops when a step lowers the merit by less than this share: it is a warm start.</summary>
    private const double PulledFeasibilityStall = 1e-3;
    /// <summary>Default stall share of a step's merit decrease (below it, steps no longer help).</summary>
    private const double DefaultStall = 1e-12;
    /// <summary>Linear solves per augmented-Lagrangian round between multiplier updates.</summary>
    private const int RoundSteps = 10;
    /// <summary>The penalty grows when a round does not cut the violation to this share of the last
    /// (the usual rule of method-of-multiplier codes, e.g. Nocedal &amp; Wright 2006, Framework 17.3).</summary>
    private const double SufficientViolationCut = 0.25;
    /// <summary>Factor by which the penalty grows, and its ceiling (beyond it the normal matrix loses the
    /// objective's digits in double precision).</summary>
    private const double PenaltyGrowth = 10, MaxPenalty = 1e12;
    /// <summary>Levenberg-Marquardt damping at the start of phase 1a and phase 2 (relative to the
    /// diagonal), of phase 1b, and of the final projection: smaller where the step should be pure
    /// Gauss-Newton on the constraints.</summary>
    private const double StartDamping = 1e-4, FeasibilityProjectionDamping = 1e-8, FinalProjectionDamping = 1e-10;
    /// <summary>Damping shrinks by this factor after an accepted step and grows by the other after a rejected
    /// one (Madsen, Nielsen &amp; Tingleff 2004, Methods for non-linear least squares problems, sec. 3.2).</summary>
    private const double DampingShrink = 3, DampingGrowth = 4;
    /// <summary>Damping floor and ceiling; above the ceiling steps are negligible and the phase has stalled.</summary>
    private const double MinDamping = 1e-12, MaxDamping = 1e12;
    /// <summary>Absolute damping floor as a share of the largest matrix entry, so that rows with no
    /// curvature still get a positive diagonal.</summary>
    private const double RelativeDampingFloor = 1e-9;
    /// <summary>Rejected steps in a row after which a phase counts as stalled.</summary>
    private const int MaxRejectionsInRow = 12;
    /// <summary>The final projection aims a decade below the tolerance, so that the result holds it with margin.</summary>
    private const double FinalProjectionMargin = 0.1;

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
    private double _damping = StartDamping;

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
        string stop;
        bool optimal = false;

        // Phase 1: constraint violation only, from the start.
        double tolerance = _s.ConstraintTolerance;
        // Phase 1a with a faint pull to the surfaces (well conditioned, lands near the constraint set),
        // phase 1b pure Gauss-Newton on the violation (lands on it). On large sheets the pulled point can
        // sit away from the constraints along slow, sheet-wide modes: 1b then needs tens of steps (measured:
        // 28 at 40 x 40 cells, 2-5 up to 24 x 24) and stops as soon as it lands.
        if (_s.PullTowardTargetFirst)
            Minimise(Feasibility, Math.Max(1, Math.Min(PulledFeasibilitySteps, budget - ProjectionReserve)), () => MaxViolation() <= tolerance, out _, stallDecrease: PulledFeasibilityStall);
        Minimise(Projection, Math.Max(1, Math.Min(FeasibilityProjectionSteps, budget - ProjectionReserve - _solves)), () => MaxViolation() <= tolerance, out _, initialDamping: FeasibilityProjectionDamping);

        // Phase 2: epsilon-constraint problem by augmented Lagrangian rounds.
        Evaluate(_x);
        double objective = Objective(out _), previousViolation = MaxViolation();
        stop = "iteration limit reached in phase 2";
        double lastDecrease = double.NaN;
        while (!_s.ConstraintsOnly && _solves < budget - ProjectionReserve)
        {
            int roundBudget = Math.Min(RoundSteps, budget - ProjectionReserve - _solves);
            Minimise(Optimality, roundBudget, () => false, out bool stalled);
            Evaluate(_x);
            double violation = MaxViolation();
            UpdateMultipliers();
            if (violation > SufficientViolationCut * previousViolation) _penalty = Math.Min(_penalty * PenaltyGrowth, MaxPenalty);
            double next = Objective(out _);
            lastDecrease = Math.Abs(objective - next) / Math.Max(Math.Abs(next), 1e-300);
            bool small = lastDecrease <= _s.RelativeObjectiveTolerance;
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
        Minimise(Projection, budget - _solves, () => MaxViolation() <= FinalProjectionMargin * tolerance, out _, initialDamping: FinalProjectionDamping);
        Evaluate(_x);
        var residuals = Residuals();
        bool buildable = residuals.MaxConstraintViolation <= tolerance;
        bool converged = optimal && buildable;
        if (optimal && !converged) stop = "constraints not within tolerance after projection";
        double total = Objective(out double fairness);
        var mesh = _pattern.Mesh.WithPositions((double[])_x.Clone());
        return new FitResult(mesh, _s.EpsilonDeg, converged, converged ? "converged: " + stop : stop, total, fairness, Shape(),
            residuals, _history, new SolverStatistics(_method, _solves, _linearIterations, _system.Unknowns, _system.Matrix.NonZeroCount, _solveSeconds, _clock.Elapsed.TotalSeconds),
            new StartSpread(0, [total], [converged])) { Buildable = buildable, LastRelativeDecrease = lastDecrease };
    }

    /// <summary>The result at the start positions, with no step taken.</summary>
    public FitResult Measure()
    {
        Evaluate(_x);
        var residuals = Residuals();
        bool buildable = residuals.MaxConstraintViolation <= _s.ConstraintTolerance;
        double total = Objective(out double fairness);
        return new FitResult(_pattern.Mesh.WithPositions((double[])_x.Clone()), _s.EpsilonDeg, false, "measured only", total, fairness, Shape(),
            residuals, _history, new SolverStatistics(_method, 0, 0, _system.Unknowns, _system.Matrix.NonZeroCount, 0, 0),
            new StartSpread(0, [total], [false])) { Buildable = buildable };
    }

    /// <summary>Levenberg-Marquardt on the phase's merit function until <paramref name="done"/> holds,
    /// the budget is spent or steps stop helping (<paramref name="stalled"/>). Each step is followed by a
    /// second-order correction with the same factor when that lowers the merit further.</summary>
    private void Minimise(string phase, int maxSolves, Func<bool> done, out bool stalled, double initialDamping = StartDamping, double stallDecrease = DefaultStall)
    {
        stalled = false;
        double damping = phase == Optimality ? _damping : initialDamping;
        int used = 0, rejectedInRow = 0;
        int n = _system.Unknowns;
        // Scratch owned by the run: large sheets would otherwise allocate (and collect) hundreds of MB per step.
        var s = _scratch ??= new Scratch(n, _x.Length, _rows.RowCount, EqualityGradientLength());
        double[] rhs = s.Rhs, step = s.Step, correction = s.Correction, soc = s.Soc;
        double[] trial = s.Trial, corrected = s.Corrected;
        double[] savedValue = s.SavedValue, savedWeight = s.SavedWeight;
        Evaluate(_x);
        double merit = Merit(phase);
        if (done()) return;
        double[] undampedDiagonal = s.UndampedDiagonal;
        double maxEntry = 0;
        bool assembled = false;
        while (used < maxSolves)
        {
            if (!assembled)
            {
                Merit(phase);
                _system.Assemble(_weight, _residual, _grad, rhs);
                if (phase == Optimality) AddConstraintCurvature();
                // Damping touches only the diagonal, so only the diagonal is kept to undo it (a copy of
                // the whole matrix would take 55 MB at 100 x 100 cells).
                _system.CopyDiagonal(undampedDiagonal);
                maxEntry = _system.MaxAbsEntry();
                assembled = true;
            }
            else _system.SetDiagonal(undampedDiagonal);
            _system.Damp(damping, RelativeDampingFloor * maxEntry + 1e-300);
            Array.Clear(step);
            var stats = TimedSolve(rhs, step, again: false);
            used++;
            _system.Apply(_x, step, trial);
            _value.AsSpan().CopyTo(savedValue); _weight.AsSpan().CopyTo(savedWeight); SaveWeightedConstraintGradients(s);
            double trialMerit = double.PositiveInfinity;
            // An indefinite system (the constraint curvature outweighs the damping) is a rejected step.
            bool evaluated = stats.Converged && AllFinite(step);
            if (evaluated)
            {
                Evaluate(trial);
                trialMerit = Merit(phase);
                // Second-order correction: the constraints' change along the step beyond their linear
                // prediction, removed with the same factor (the remedy for the Maratos effect of a penalty merit).
                Array.Clear(soc);
                bool any = false;
                for (int r = _rows.FirstConstraint; r < _rows.RowCount; r++)
                {
                    double w = savedWeight[r];
                    if (w == 0) continue;
                    var rowGradient = s.SavedGradient.AsSpan(s.SavedAt[r], 3 * (_rows.Start[r + 1] - _rows.Start[r]));
                    double predicted = savedValue[r] + _system.RowDirectional(r, rowGradient, step);
                    double error = _value[r] - predicted;
                    if (error == 0 || !double.IsFinite(error)) continue;
                    _system.SubtractRowGradient(r, w * w * error, rowGradient, soc);
                    any = true;
                }
                if (any)
                {
                    Array.Clear(correction);
                    var again = TimedSolve(soc, correction, again: true);
                    if (again.Converged && AllFinite(correction))
                    {
                        _system.Apply(trial, correction, corrected);
                        Evaluate(corrected);
                        double correctedMerit = Merit(phase);
                        if (correctedMerit < trialMerit) { (trial, corrected) = (corrected, trial); (s.Trial, s.Corrected) = (trial, corrected); trialMerit = correctedMerit; }
                        else { Evaluate(trial); Merit(phase); } // re-evaluated rather than kept: a copy of all row gradients is 55 MB at 100 x 100
                    }
                }
            }
            bool accept = trialMerit < merit;
            if (accept)
            {
                (_x, trial) = (trial, _x);
                s.Trial = trial;
                double decrease = (merit - trialMerit) / Math.Max(merit, 1e-300);
                merit = trialMerit;
                damping = Math.Max(damping / DampingShrink, MinDamping);
                rejectedInRow = 0;
                assembled = false;
                Record(phase, true);
                if (phase == Optimality) _damping = damping;
                if (done()) return;
                if (decrease < stallDecrease) { stalled = true; return; }
            }
            else
            {
                Evaluate(_x); // re-evaluated rather than restored from a copy of every row gradient (55 MB at 100 x 100)
                Merit(phase);
                damping *= DampingGrowth;
                if (phase == Optimality) _damping = damping;
                Record(phase, false);
                if (++rejectedInRow >= MaxRejectionsInRow || damping > MaxDamping) { stalled = true; return; }
            }
        }
    }

    private SolveStats TimedSolve(double[] rhs, double[] x, bool again)
    {
        long t0 = Stopwatch.GetTimestamp();
        SolveStats stats;
        try { stats = again ? _solver.SolveAgain(_system.Matrix, rhs, x) : _solver.Solve(_system.Matrix, rhs, x); }
        catch (NotPositiveDefiniteException) { stats = new SolveStats(_method, 0, double.PositiveInfinity, false); }
        _solveSeconds += Stopwatch.GetElapsedTime(t0).TotalSeconds;
        if (!again) _solves++;
        _linearIterations += stats.Iterations;
        if (stats.Converged) _method = stats.Method;
        return stats;
    }

    /// <summary>Adds sum_r lambda_r grad^2 g_r over the active constraint rows, lambda_r = w_r * res_r being
    /// the first-order multiplier estimate of the augmented Lagrangian (W * excess). Without it the steps
    /// are Gauss-Newton on the merit and converge only linearly once the constraints push back.</summary>
    private void AddConstraintCurvature()
    {
        int maxCoords = 0;
        for (int r = _rows.FirstConstraint; r < _rows.RowCount; r++) maxCoords = Math.Max(maxCoords, 3 * (_rows.Start[r + 1] - _rows.Start[r]));
        if (_hessian.Length < maxCoords * maxCoords) { _hessian = new double[maxCoords * maxCoords]; _g0 = new double[maxCoords]; _g1 = new double[maxCoords]; }
        for (int r = _rows.FirstConstraint; r < _rows.RowCount; r++)
        {
            double lambda = _weight[r] * _residual[r];
            if (lambda == 0) continue;
            _rows.RowHessian(r, _x, _hessian, _g0, _g1);
            _system.AddRowHessian(r, lambda, _hessian);
        }
    }

    private double[] _hessian = [], _g0 = [], _g1 = [];
    private Scratch? _scratch;

    /// <summary>Work arrays of the steps, allocated once per run.</summary>
    private sealed class Scratch(int unknowns, int coordinates, int rows, int savedGradients)
    {
        public readonly double[] Rhs = new double[unknowns], Step = new double[unknowns], Correction = new double[unknowns], Soc = new double[unknowns];
        public double[] Trial = new double[coordinates], Corrected = new double[coordinates];
        public readonly double[] SavedValue = new double[rows], SavedWeight = new double[rows];
        /// <summary>Gradients at x of the constraint rows with nonzero weight, packed; SavedAt gives each
        /// row's offset. The second-order correction needs J(x) after x + d has been evaluated.</summary>
        public double[] SavedGradient = new double[savedGradients];
        public readonly int[] SavedAt = new int[rows];
        public readonly double[] UndampedDiagonal = new double[unknowns];
    }

    /// <summary>Gradient entries of the equality rows (planarity, Kawasaki, developability): the usual
    /// size of the packed saved gradients; active bounds grow it when needed.</summary>
    private int EqualityGradientLength()
    {
        int length = 0;
        for (int r = _rows.FirstConstraint; r < _rows.RowCount; r++)
            if (_rows.Kind[r] is ResidualKind.Planarity or ResidualKind.Kawasaki or ResidualKind.Developability)
                length += 3 * (_rows.Start[r + 1] - _rows.Start[r]);
        return length;
    }

    private void SaveWeightedConstraintGradients(Scratch s)
    {
        int at = 0;
        for (int r = _rows.FirstConstraint; r < _rows.RowCount; r++)
        {
            if (_weight[r] == 0) continue;
            int first = 3 * _rows.Start[r], length = 3 * _rows.Start[r + 1] - first;
            if (at + length > s.SavedGradient.Length) Array.Resize(ref s.SavedGradient, at + length + s.SavedGradient.Length / 4);
            Array.Copy(_grad, first, s.SavedGradient, at, length);
            s.SavedAt[r] = at;
            at += length;
        }
    }

    private static bool AllFinite(double[] v)
    {
        foreach (var d in v) if (!double.IsFinite(d)) return false;
        return true;
    }

    /// <summary>Values of every row at <paramref name="x"/>, gradients of all but the bounds; <see cref="Merit"/>
    /// adds the gradients of the bounds it weights (unweighted rows' gradients are never read).</summary>
    private void Evaluate(double[] x)
    {
        _rows.EvaluateWithoutBoundGradients(x, _value, _grad);
        _evaluatedAt = x;
    }

    private double[] _evaluatedAt = [];

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
            if (w != 0 && _rows.IsBound(r)) _rows.FillGradient(r, _evaluatedAt, _grad);
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
        _s.OnStep?.Invoke(_history[^1]);
    }
}
