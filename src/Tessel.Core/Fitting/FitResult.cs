using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Fitting;

/// <summary>One Levenberg-Marquardt step of the fit, as recorded in the history.</summary>
/// <param name="Phase">"feasibility" (phase 1), "epsilon-constraint" (phase 2) or "projection" (final).</param>
/// <param name="Objective">Shape term + fairness term (dimensionless: distances over the mean edge length).</param>
/// <param name="Fairness">The fairness part of <paramref name="Objective"/>.</param>
/// <param name="ShapeRms">RMS distance of layer vertices to their surfaces, metres.</param>
/// <param name="MaxPlanarity">Largest |scaled triple product| over quads.</param>
/// <param name="MaxKawasaki">Largest |alternating sector sum|, radians.</param>
/// <param name="MaxDevelopabilityExcess">Largest amount by which |sum - 2 pi| exceeds epsilon, radians.</param>
/// <param name="MaxBoundViolation">Largest violation of a sector, fold-angle or edge-length bound.</param>
/// <param name="Accepted">Whether the step lowered the merit function and was kept.</param>
/// <param name="ElapsedSeconds">Wall time since the fit started.</param>
public sealed record FitIteration(int Index, string Phase, double Objective, double Fairness, double ShapeRms,
    double MaxPlanarity, double MaxKawasaki, double MaxDevelopabilityExcess, double MaxBoundViolation,
    bool Accepted, double ElapsedSeconds);

/// <summary>Final constraint residuals of a folded mesh (radians; planarity scaled).</summary>
/// <param name="MaxDevelopability">Largest |sum of sector angles - 2 pi| at interior vertices.</param>
/// <param name="MaxDevelopabilityExcess">Largest amount by which that exceeds epsilon.</param>
public sealed record FitResiduals(double MaxDevelopability, double MaxDevelopabilityExcess, double MaxKawasaki,
    double MaxPlanarity, double MaxBoundViolation)
{
    /// <summary>Largest of the residuals the tolerance applies to.</summary>
    public double MaxConstraintViolation =>
        Math.Max(Math.Max(MaxDevelopabilityExcess, MaxKawasaki), Math.Max(MaxPlanarity, MaxBoundViolation));
}

/// <summary>How well the layers sit on their surfaces, metres.</summary>
public sealed record ShapeError(double Rms, double Max);

/// <summary>Linear algebra spent by one fit.</summary>
/// <param name="Method">What the SPD solver reported ("banded-cholesky", "pcg-ic0", ...).</param>
/// <param name="LinearSolves">Number of SPD solves (one per Levenberg-Marquardt step).</param>
/// <param name="LinearIterations">Sum of the solver's iteration counts.</param>
/// <param name="Unknowns">Size of the normal matrix.</param>
/// <param name="NonZeros">Stored entries of the normal matrix.</param>
/// <param name="SolveSeconds">Wall time inside the SPD solver (diagnostic; not deterministic).</param>
/// <param name="TotalSeconds">Wall time of the whole fit (diagnostic; not deterministic).</param>
public sealed record SolverStatistics(string Method, int LinearSolves, long LinearIterations, int Unknowns, int NonZeros,
    double SolveSeconds, double TotalSeconds);

/// <summary>How the starts of a multi-start fit compared (objective values as in <see cref="FitIteration"/>).</summary>
/// <param name="Objectives">Final objective of each start, in start order.</param>
/// <param name="Converged">Converged flag of each start.</param>
public sealed record StartSpread(int BestStart, double[] Objectives, bool[] Converged)
{
    public double Best => Objectives[BestStart];
    public double Worst => Objectives.Max();
    /// <summary>Worst minus best objective.</summary>
    public double Range => Worst - Best;
}

/// <summary>Outcome of a fit. <see cref="Buildable"/> is true when every constraint and bound is within
/// the tolerance: the pattern folds. <see cref="Converged"/> (finished) additionally needs phase 2 to have
/// stopped on its objective criterion, not on the iteration cap: the shape could not improve further.</summary>
public sealed record FitResult(
    CreaseMesh Mesh,
    double EpsilonDeg,
    bool Converged,
    string StopReason,
    double Objective,
    double Fairness,
    ShapeError Shape,
    FitResiduals Residuals,
    IReadOnlyList<FitIteration> History,
    SolverStatistics Solver,
    StartSpread Spread)
{
    /// <summary>Every constraint and bound within the tolerance: the pattern folds from a flat sheet.</summary>
    public bool Buildable { get; init; }

    /// <summary>Relative decrease of the objective over the last round of phase 2 (NaN when no round ran):
    /// how much the shape was still improving when the fit stopped.</summary>
    public double LastRelativeDecrease { get; init; }

    /// <summary>What the fit changed on its way to a buildable result (continuation stages, restarts), in
    /// plain words; empty when the first attempt succeeded.</summary>
    public IReadOnlyList<string> Adjustments { get; init; } = [];
}
