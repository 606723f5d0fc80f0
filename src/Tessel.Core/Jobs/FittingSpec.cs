namespace Tessel.Core.Jobs;

/// <summary>The job's <c>fitting</c> section: the constrained least-squares solve.</summary>
/// <param name="EpsilonDeg">Allowed developability residual per vertex, degrees (0 = exact).</param>
/// <param name="EpsilonSweepDeg">Residual limits to sweep for a shape-error/developability trade-off; empty = no sweep.</param>
/// <param name="Seed">Seed of the multi-start; null = the job's seed.</param>
/// <param name="Starts">Number of starting points tried.</param>
/// <param name="MaxIterations">Iteration limit per start.</param>
/// <param name="Tolerance">Constraint residual at which a solve counts as converged.</param>
/// <param name="AcceptUnconverged">Write outputs even when the fit did not converge.</param>
/// <param name="Anchors">none, corners or edge: which vertices are pinned to the target.</param>
/// <param name="Bounds">Inequality limits on the fitted pattern.</param>
public sealed record FittingSpec(
    double EpsilonDeg,
    double[] EpsilonSweepDeg,
    int? Seed,
    int Starts,
    int MaxIterations,
    double Tolerance,
    bool AcceptUnconverged,
    string Anchors,
    FittingBounds Bounds);

/// <summary>Limits the fitted pattern must respect; edge length is at model scale, in millimetres.</summary>
public sealed record FittingBounds(
    double MinSectorAngleDeg,
    double MaxSectorAngleDeg,
    double MinFoldAngleDeg,
    double MaxFoldAngleDeg,
    double MinEdgeLengthMm);
