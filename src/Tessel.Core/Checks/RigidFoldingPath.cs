using System.Diagnostics;
using MathNet.Numerics.LinearAlgebra.Double;
using Tessel.Core.LinearAlgebra;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Checks;

/// <summary>Rigid folding simulation: follows the bar-and-hinge constraint set (bar lengths, panel planarity)
/// from the given folded state toward flat and further toward folded, by predictor-corrector continuation
/// (Tachi, "Simulation of rigid origami", Origami 4, 2009; Allgower &amp; Georg, Numerical Continuation
/// Methods, SIAM 2003).</summary>
/// <remarks>
/// The reference panel nearest the centroid keeps three corners fixed, which removes the six rigid motions.
/// Predictor: a direction in the null space of the constraint Jacobian; with more than one degree of freedom
/// the one whose fold-angle rates best match a uniform scaling of all fold angles (least squares).
/// Corrector: minimum-norm Newton steps dx = (J^T J + eps I)^-1 J^T r (= J^T (J J^T + eps I)^-1 r, eps = 1e-13
/// of the largest eigenvalue) on the constraints plus one dense row pinning the progress and, with k &gt; 1 degrees
/// of freedom, k - 1 dense rows pinning the other reachable fold-angle combinations at their linearised predicted
/// values (so the path depends on fold angles only, not on which panel is held); solved by a sparse envelope
/// Cholesky factor of J^T J + eps I with a Woodbury update for the dense rows, refactored every iteration.
/// The flat state is a branch point, so the flat-ward run stops just short of it (every |fold angle| below
/// <see cref="FoldingSettings.NearFlatFoldAngleDegrees"/>).
/// </remarks>
public static class RigidFoldingPath
{
    /// <summary>RMS fold angle (rad) below which a mesh counts as flat: progress is measured against the given
    /// fold angles, so a flat start gives it no scale.</summary>
    private const double FlatStartRmsRad = 1e-9;

    /// <summary>Damping eps of J^T J + eps I as a share of its largest eigenvalue: small, because near the flat
    /// branch point the folding stiffness drops toward it and Newton slows to the rate eps / (lambda + eps).</summary>
    private const double DampingShare = 1e-13;

    /// <summary>A factor that fails (indefinite in rounding) is retried with the damping this many times larger,
    /// then its square.</summary>
    private const double DampingRetryGrowth = 1e2;

    /// <summary>The corrector can stagnate at a few times its tolerance: residuals up to this multiple of the
    /// tolerance are accepted, and reported as drift.</summary>
    private const double StagnationToleranceFactor = 10;

    /// <summary>Inconsistent (non-planar) input cannot be projected below its own residual: accept twice what
    /// the first projection leaves.</summary>
    private const double InputResidualFactor = 2;

    /// <summary>Two progress values this close are the same (keyframes, the step's target, the end of the run):
    /// a few ulps of progress 1.</summary>
    private const double SameProgress = 1e-12;

    /// <summary>A keyframe this close beyond the next step is landed on exactly, and the corrector's progress
    /// row counts as met at this distance once it has stopped improving.</summary>
    private const double ProgressReach = 1e-9;

    /// <summary>Near flat the fold angles shrink in proportion to progress; the last step aims at this share of
    /// the stop angle so that it lands below it.</summary>
    private const double NearFlatAim = 0.7;

    /// <summary>Step halving gives up below this share of the settings' step: the path has a fold or a branch there.</summary>
    private const double SmallestStepShare = 1e-4;

    /// <summary>After an accepted step the step grows by this factor, up to the settings' step.</summary>
    private const double StepGrowth = 1.5;

    /// <summary>Null-space block size the Ritz iteration starts with (grown while the null space fills it).</summary>
    private const int InitialRitzBlock = 4;

    /// <summary>A tangent whose progress rate is below this share of |t| |grad progress| is a turning point of
    /// progress: it cannot be scaled to unit progress.</summary>
    private const double TurningPointRate = 1e-12;

    /// <summary>A vector that keeps less than this share of its length after Gram-Schmidt depends on the others.</summary>
    private const double DependentShare = 1e-8;

    /// <summary>Pin rows (fold-angle combinations, radians) count as met within this, like progress.</summary>
    private const double PinMet = 1e-12;

    /// <summary>The corrector counts as stagnating when an iteration removes less than a tenth of the residual.</summary>
    private const double StagnationRatio = 0.9;

    /// <summary>A residual above this (a tenth of the mean edge length, dimensionless) means Newton has left the
    /// path: halve the step instead.</summary>
    private const double DivergedResidual = 0.1;

    /// <summary>Squared-distance ties (m^2) when choosing the reference face: the lowest index wins below this.</summary>
    private const double ReferenceTieSquared = 1e-15;

    public static FoldingPathResult Simulate(CreaseMesh mesh, FoldingSettings? settings = null) =>
        new Tracer(mesh, settings ?? new FoldingSettings()).Run();

    private sealed class Tracer
    {
        private readonly CreaseMesh _mesh;
        private readonly FoldingSettings _settings;
        private readonly BarHingeModel _model;
        private readonly CreaseDihedrals _dihedrals;
        private readonly double[] _rho0;
        private readonly double _rho0Squared;
        private readonly bool[] _fixed;
        private readonly double _unit;
        private double _shift, _threshold;
        private List<double[]> _nullBasis = [];
        private double _acceptResidual;
        private int _newton, _steps, _dof = -1;
        private double _maxStrain, _maxPlanarity;
        private readonly List<FoldingKeyframe> _keyframes = [];

        public Tracer(CreaseMesh mesh, FoldingSettings settings)
        {
            _mesh = mesh; _settings = settings;
            _model = BarHingeModel.FromMesh(mesh);
            _dihedrals = new CreaseDihedrals(mesh);
            _rho0 = _dihedrals.Angles(mesh.Positions);
            _rho0Squared = _rho0.Sum(r => r * r);
            _unit = _model.LengthUnit;
            _fixed = new bool[3 * mesh.VertexCount];
            var reference = mesh.Faces[ReferenceFace(mesh)];
            for (int k = 0; k < 3; k++)
                for (int c = 0; c < 3; c++) _fixed[3 * reference[k] + c] = true;
        }

        public FoldingPathResult Run()
        {
            var clock = Stopwatch.StartNew();
            if (_rho0.Length == 0 || Math.Sqrt(_rho0Squared / _rho0.Length) < FlatStartRmsRad)
                throw new ArgumentException("the mesh must be folded (some non-zero fold angle) to define the path");
            var x0 = (double[])_mesh.Positions.Clone();
            var j0 = _model.Jacobian(x0);
            double lambdaMax = ShiftInvertSubspace.LargestEigenvalue(j0);
            _shift = DampingShare * lambdaMax;
            _threshold = _settings.RankTolerance * _settings.RankTolerance * lambdaMax;
            // Project the given state onto the constraint set; what remains (inconsistent input) sets the floor.
            _acceptResidual = double.PositiveInfinity;
            _pinTargets = [];
            Correct(x0, 1.0, out _);
            _acceptResidual = Math.Max(StagnationToleranceFactor * _settings.ConstraintTolerance, InputResidualFactor * MaxAbs(Residuals(x0)));
            Accept(x0);
            var keys = _settings.EffectiveKeyframes.Where(k => k > 0).Distinct().OrderBy(k => k).ToArray();
            if (keys.Any(k => Math.Abs(k - 1) < SameProgress)) Keep(1.0, x0);

            var (flatEnd, flatStop, reached) = Trace(x0, -1, keys);
            var (foldEnd, foldStop, _) = Trace(x0, +1, keys);
            var frames = _keyframes.OrderBy(k => k.Progress).ToList();
            return new FoldingPathResult(_dof, reached, flatEnd, foldEnd, _maxStrain, _maxPlanarity, _steps, _newton,
                flatStop, foldStop, frames, clock.Elapsed);
        }

        private (double End, string Stop, bool NearFlat) Trace(double[] start, int direction, double[] keys)
        {
            var x = (double[])start.Clone();
            _lastFactor = null; // taken at the other run's end
            double s = 1.0, h = _settings.StepProgress, nearFlat = _settings.NearFlatFoldAngleDegrees * Math.PI / 180;
            while (true)
            {
                double maxRho = MaxAbs(_dihedrals.Angles(x));
                if (direction < 0 && maxRho < nearFlat)
                {
                    if (!_keyframes.Any(k => k.Progress == s)) Keep(s, x);
                    return (s, "near flat", true);
                }
                if (direction > 0 && s >= _settings.MaxProgress - SameProgress) return (s, "max progress", false);
                if (direction > 0 && maxRho > _settings.MaxFoldAngleDegrees * Math.PI / 180) return (s, "fold angle limit", false);
                double target;
                if (direction < 0)
                {
                    // Near flat the fold angles shrink in proportion to progress: aim just under the stop angle.
                    double sNear = s * NearFlatAim * nearFlat / maxRho;
                    target = s - h;
                    foreach (double k in keys) if (k < s - SameProgress && k >= target - ProgressReach) target = k; // land on keyframes exactly
                    if (target <= sNear) target = sNear;
                }
                else
                {
                    target = Math.Min(s + h, _settings.MaxProgress);
                    foreach (double k in keys) if (k > s + SameProgress && k <= target + ProgressReach) target = k;
                }
                var tangent = Tangent(x, s);
                if (tangent == null) return (s, _nullBasis.Count == 0 ? "rigid: no folding motion" : "turning point of progress", false);
                var trial = new double[x.Length];
                for (int i = 0; i < x.Length; i++) trial[i] = x[i] + (target - s) * tangent[i];
                // Pin targets from the linearised fold angles: intrinsic, unlike the angles at the Cartesian
                // predictor, whose second-order error depends on which panel is held still.
                var predicted = _dihedrals.Angles(x);
                for (int i = 0; i < predicted.Length; i++) predicted[i] += (target - s) * _rhoRate[i];
                _pinTargets = _pins.Select(p => Weighted(p, predicted)).ToArray();
                if (!Correct(trial, target, out _))
                {
                    _lastFactor = null;
                    h /= 2;
                    if (h < SmallestStepShare * _settings.StepProgress) return (s, "corrector failed", false);
                    continue;
                }
                x = trial; s = target; _steps++;
                Accept(x);
                if (keys.Any(k => Math.Abs(k - s) < SameProgress)) Keep(s, x);
                h = Math.Min(_settings.StepProgress, StepGrowth * h);
            }
        }

        private double Progress(double[] x)
        {
            double s = 0;
            for (int i = 0; i < _rho0.Length; i++) s += _rho0[i] * _dihedrals.Angle(x, i);
            return s / _rho0Squared;
        }

        /// <summary>d progress / dx per metre, zero on fixed columns.</summary>
        private double[] ProgressGradient(double[] x) => AngleCombinationGradient(x, _rho0.Select(r => r / _rho0Squared).ToArray());

        /// <summary>Gradient of sum_i w_i rho_i(x) per metre, zero on fixed columns.</summary>
        private double[] AngleCombinationGradient(double[] x, double[] weights)
        {
            var g = new double[x.Length];
            for (int i = 0; i < weights.Length; i++)
            {
                double w = weights[i];
                if (w == 0) continue;
                var (ga, gb, gc, gd) = _dihedrals.Gradient(x, i);
                AddTo(g, _dihedrals.Wings[4 * i], w * ga); AddTo(g, _dihedrals.Wings[4 * i + 1], w * gb);
                AddTo(g, _dihedrals.Wings[4 * i + 2], w * gc); AddTo(g, _dihedrals.Wings[4 * i + 3], w * gd);
            }
            for (int c = 0; c < g.Length; c++) if (_fixed[c]) g[c] = 0;
            return g;
        }

        private static void AddTo(double[] g, int v, Vec3 d) { g[3 * v] += d.X; g[3 * v + 1] += d.Y; g[3 * v + 2] += d.Z; }

        /// <summary>Predictor direction in metres per unit progress, or null when the mesh cannot move.</summary>
        private double[]? Tangent(double[] x, double s)
        {
            var j = _model.Jacobian(x);
            // The corrector's last factor was taken a converged Newton step (about 1e-9) away: good enough to drive
            // the inverse iteration, while the Rayleigh-Ritz step uses the exact J at x.
            var factor = _lastFactor ?? Factor(j);
            _lastFactor = null;
            var ritz = ShiftInvertSubspace.SmallestWithGrowth(j, factor, _fixed, _threshold, InitialRitzBlock, _nullBasis);
            int k = ritz.Values.Count(v => v <= _threshold);
            if (_dof < 0) _dof = k;
            _nullBasis = ritz.Vectors.Take(k).ToList();
            if (k == 0) return null;
            // Fold-angle rates of each null vector; match the uniform-scaling rates rho / s in least squares.
            int m = _dihedrals.Count;
            var rates = DenseMatrix.Create(m, k, 0);
            for (int b = 0; b < k; b++)
                for (int i = 0; i < m; i++)
                {
                    var (ga, gb, gc, gd) = _dihedrals.Gradient(x, i);
                    rates[i, b] = Dot(ga, _nullBasis[b], _dihedrals.Wings[4 * i]) + Dot(gb, _nullBasis[b], _dihedrals.Wings[4 * i + 1])
                                + Dot(gc, _nullBasis[b], _dihedrals.Wings[4 * i + 2]) + Dot(gd, _nullBasis[b], _dihedrals.Wings[4 * i + 3]);
                }
            var wanted = DenseVector.OfArray(_dihedrals.Angles(x).Select(r => r / s).ToArray());
            var coefficients = (rates.TransposeThisAndMultiply(rates)).Solve(rates.TransposeThisAndMultiply(wanted));
            _pins = PinDirections(rates);
            _rhoRate = (rates * coefficients).ToArray();
            var t = new double[x.Length];
            for (int b = 0; b < k; b++)
                for (int c = 0; c < t.Length; c++) t[c] += coefficients[b] * _nullBasis[b][c];
            var g = ProgressGradient(x);
            double rate = 0;
            for (int c = 0; c < t.Length; c++) rate += g[c] * t[c];
            if (!double.IsFinite(rate) || Math.Abs(rate) < TurningPointRate * Math.Sqrt(t.Sum(v => v * v)) * Math.Sqrt(g.Sum(v => v * v)))
                return null;
            for (int c = 0; c < t.Length; c++) t[c] /= rate;
            for (int i = 0; i < _rhoRate.Length; i++) _rhoRate[i] /= rate;
            return t;
        }

        /// <summary>With k &gt; 1 degrees of freedom, the k - 1 fold-angle combinations (unit vectors of length #I) that
        /// span the reachable fold-angle rates orthogonally to the progress direction rho0. The corrector holds them
        /// at their predicted values, so the path is fixed by fold angles alone (intrinsic) rather than by which
        /// panel is held still.</summary>
        private List<double[]> PinDirections(DenseMatrix rates)
        {
            int k = rates.ColumnCount, m = rates.RowCount;
            if (k < 2) return [];
            // Orthonormal basis of the reachable rates R, then R's complement of the progress direction P_R rho0:
            // a subspace, so the pins do not depend on how the null space happened to be spanned.
            var span = Orthonormal(Enumerable.Range(0, k).Select(b => rates.Column(b).ToArray()), []);
            var q = new double[m];
            foreach (var u in span)
            {
                double d = Weighted(u, _rho0);
                for (int i = 0; i < m; i++) q[i] += d * u[i];
            }
            var progressDirection = Orthonormal([q], []);
            return Orthonormal(span, progressDirection).Take(k - 1).ToList();
        }

        /// <summary>Gram-Schmidt of <paramref name="vectors"/> against <paramref name="against"/> (orthonormal) and each
        /// other; vectors that vanish are dropped.</summary>
        private static List<double[]> Orthonormal(IEnumerable<double[]> vectors, List<double[]> against)
        {
            var result = new List<double[]>();
            foreach (var source in vectors)
            {
                var v = (double[])source.Clone();
                double scale = Math.Sqrt(v.Sum(t => t * t));
                for (int pass = 0; pass < 2; pass++)
                    foreach (var u in against.Concat(result))
                    {
                        double d = Weighted(u, v);
                        for (int i = 0; i < v.Length; i++) v[i] -= d * u[i];
                    }
                double norm = Math.Sqrt(v.Sum(t => t * t));
                if (norm <= DependentShare * scale || norm == 0) continue;
                for (int i = 0; i < v.Length; i++) v[i] /= norm;
                result.Add(v);
            }
            return result;
        }

        private static double Dot(Vec3 g, double[] v, int vertex) => g.X * v[3 * vertex] + g.Y * v[3 * vertex + 1] + g.Z * v[3 * vertex + 2];

        private EnvelopeCholesky? _pattern, _lastFactor;
        private List<double[]> _pins = [];
        private double[] _pinTargets = [];
        private double[] _rhoRate = [];

        private static double Weighted(double[] w, double[] rho)
        {
            double t = 0;
            for (int i = 0; i < w.Length; i++) t += w[i] * rho[i];
            return t;
        }

        // The Jacobian's pattern never changes along the path: order and size the envelope once.
        private EnvelopeCholesky Factor(CsrMatrix j)
        {
            var f = EnvelopeCholesky.Factor(j, _shift, _fixed, _pattern) ?? EnvelopeCholesky.Factor(j, DampingRetryGrowth * _shift, _fixed, _pattern)
                    ?? EnvelopeCholesky.Factor(j, DampingRetryGrowth * DampingRetryGrowth * _shift, _fixed, _pattern)
                    ?? throw new InvalidOperationException("constraint normal matrix could not be factored");
            _pattern ??= f;
            return f;
        }

        private double[] Residuals(double[] x)
        {
            var r = new double[_model.RowCount];
            _model.Residuals(x, r);
            return r;
        }

        /// <summary>Newton-corrects x in place onto the constraints with progress pinned to <paramref name="target"/>.</summary>
        /// <remarks>Each iteration refactors at the current point: the predictor's factor is nearly singular
        /// along the old tangent, so chord steps with it diverge.</remarks>
        private bool Correct(double[] x, double target, out int iterations)
        {
            int n = x.Length;
            double previous = double.PositiveInfinity;
            for (iterations = 0; ; iterations++)
            {
                var r = Residuals(x);
                double s = Progress(x);
                double worst = MaxAbs(r);
                double pinError = 0;
                if (_pinTargets.Length == _pins.Count && _pins.Count > 0)
                {
                    var angles = _dihedrals.Angles(x);
                    for (int b = 0; b < _pins.Count; b++) pinError = Math.Max(pinError, Math.Abs(Weighted(_pins[b], angles) - _pinTargets[b]));
                }
                if (worst <= _settings.ConstraintTolerance && Math.Abs(s - target) <= SameProgress && pinError <= PinMet) return true;
                if (iterations >= _settings.MaxCorrectorIterations) return worst <= _acceptResidual && Math.Abs(s - target) <= ProgressReach;
                // Stagnation at a least-squares point of inconsistent constraints (non-planar input).
                if (worst >= StagnationRatio * previous && worst <= _acceptResidual && Math.Abs(s - target) <= ProgressReach) return true;
                if (!double.IsFinite(worst) || worst > DivergedResidual) return false;
                previous = worst;
                var j = _model.Jacobian(x);
                var factor = Factor(j);
                _lastFactor = factor;
                // Dense rows: progress, then the fold-angle pins (DOF > 1), in the scaled unknowns y = x / unit,
                // each normalised to unit length; added to the sparse factor by the Woodbury identity.
                var rows = new List<double[]> { ProgressGradient(x) };
                var rowResiduals = new List<double> { s - target };
                if (_pinTargets.Length == _pins.Count)
                {
                    var rho = _dihedrals.Angles(x);
                    for (int b = 0; b < _pins.Count; b++)
                    {
                        rows.Add(AngleCombinationGradient(x, _pins[b]));
                        rowResiduals.Add(Weighted(_pins[b], rho) - _pinTargets[b]);
                    }
                }
                int q = rows.Count;
                for (int b = 0; b < q; b++)
                {
                    double norm = 0;
                    for (int c = 0; c < n; c++) { rows[b][c] *= _unit; norm += rows[b][c] * rows[b][c]; }
                    norm = Math.Sqrt(norm);
                    if (norm == 0) norm = 1;
                    for (int c = 0; c < n; c++) rows[b][c] /= norm;
                    rowResiduals[b] /= norm;
                }
                var rhs = new double[n];
                ShiftInvertSubspace.MultiplyTransposed(j, r, rhs);
                for (int c = 0; c < n; c++)
                {
                    double sum = rhs[c];
                    for (int b = 0; b < q; b++) sum += rows[b][c] * rowResiduals[b];
                    rhs[c] = _fixed[c] ? 0 : -sum;
                }
                // (A + U U^T)^-1 rhs = z - Z (I + U^T Z)^-1 U^T z, with A z = rhs and A Z = U.
                var z = new double[n];
                factor.Solve(rhs, z);
                var zs = new double[q][];
                for (int b = 0; b < q; b++) { zs[b] = new double[n]; factor.Solve(rows[b], zs[b]); }
                var small = DenseMatrix.Create(q, q, 0);
                var utz = DenseVector.Create(q, 0);
                for (int a = 0; a < q; a++)
                {
                    utz[a] = ShiftInvertSubspace.Dot(rows[a], z);
                    for (int b = 0; b < q; b++) small[a, b] = (a == b ? 1 : 0) + ShiftInvertSubspace.Dot(rows[a], zs[b]);
                }
                var coefficients = small.Solve(utz);
                for (int c = 0; c < n; c++)
                {
                    if (_fixed[c]) continue;
                    double dy = z[c];
                    for (int b = 0; b < q; b++) dy -= coefficients[b] * zs[b][c];
                    x[c] += _unit * dy;
                }
                _newton++;
            }
        }

        private void Accept(double[] x)
        {
            _maxStrain = Math.Max(_maxStrain, _model.MaxBarStrain(x));
            _maxPlanarity = Math.Max(_maxPlanarity, _model.MaxPlanarity(x));
        }

        private void Keep(double s, double[] x) =>
            _keyframes.Add(new FoldingKeyframe(s, MaxAbs(_dihedrals.Angles(x)) * 180 / Math.PI, (double[])x.Clone(), _model.MaxBarStrain(x)));

        private static double MaxAbs(double[] v) => v.Length == 0 ? 0 : v.Max(Math.Abs);

        /// <summary>The face whose centroid is nearest the mesh centroid (lowest index on ties).</summary>
        private static int ReferenceFace(CreaseMesh mesh)
        {
            var centroid = Vec3.Zero;
            for (int v = 0; v < mesh.VertexCount; v++) centroid += mesh.Vertex(v);
            centroid /= Math.Max(1, mesh.VertexCount);
            int best = 0; double bestDistance = double.PositiveInfinity;
            for (int f = 0; f < mesh.FaceCount; f++)
            {
                var c = Vec3.Zero;
                foreach (int v in mesh.Faces[f]) c += mesh.Vertex(v);
                double d = (c / mesh.Faces[f].Length - centroid).LengthSquared;
                if (d < bestDistance - ReferenceTieSquared) { best = f; bestDistance = d; }
            }
            return best;
        }
    }
}
