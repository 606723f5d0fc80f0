using Tessel.Core.Tessellation;

namespace Tessel.Core.Fitting;

/// <summary>Settings of the epsilon-constraint fit. Angles in degrees; defaults suit architectural
/// Miura sheets of tens to tens of thousands of cells.</summary>
public sealed record FitSettings
{
    /// <summary>Allowed |sum of sector angles - 2 pi| at interior vertices, degrees (0 = developable).</summary>
    public double EpsilonDeg { get; init; }
    /// <summary>Weight of the fairness term relative to the squared normalised distances.</summary>
    public double FairnessWeight { get; init; } = 1e-4;
    public double MinSectorAngleDeg { get; init; } = 5;
    public double MaxSectorAngleDeg { get; init; } = 175;
    /// <summary>Fold angles stay at least this far from flat (0 deg), degrees.</summary>
    public double MinFoldAngleDeg { get; init; } = 1;
    /// <summary>Fold angles stay at most this (180 deg = folded shut), degrees.</summary>
    public double MaxFoldAngleDeg { get; init; } = 175;
    /// <summary>Creases folded less than this are drawn flat by the sheets, degrees (the pipeline sets the
    /// checks' tolerance). A crease held flat (<see cref="FamilyConstraints.FlatCreases"/>) stays within
    /// <see cref="HeldFlatShare"/> of it, so round-off cannot turn it into a fold.</summary>
    public double DrawnFlatBelowDeg { get; init; } = 0.5;
    public const double HeldFlatShare = 0.9;
    /// <summary>Every edge stays at least this fraction of its draped length.</summary>
    public double MinEdgeLengthFraction { get; init; } = 0.25;
    /// <summary>Shortest crease allowed, metres at full scale (the job's minimum crease on the model times the
    /// scale); an edge already shorter in the drape may not shrink below its draped length. The fit holds it on
    /// outline edges too; only creases (interior edges) count as short for the checks and the refits.</summary>
    public double MinEdgeLengthM { get; init; }
    /// <summary>Largest allowed constraint residual at the end (radians, or scaled planarity): the
    /// converged flag needs every constraint within it.</summary>
    public double ConstraintTolerance { get; init; } = 1e-10;
    /// <summary>Phase 2 stops when one augmented-Lagrangian round lowers the objective by less than
    /// this fraction (stops the slow creep along in-plane motions).</summary>
    public double RelativeObjectiveTolerance { get; init; } = 1e-2;
    /// <summary>Cap on linear solves (Levenberg-Marquardt steps) over all phases.</summary>
    public int MaxIterations { get; init; } = 300;
    /// <summary>Number of starts (multi-start); each start perturbs interior vertices along the normal.</summary>
    public int Starts { get; init; } = 1;
    /// <summary>Job seed; start k uses a generator seeded from (Seed, k).</summary>
    public int Seed { get; init; }
    /// <summary>Standard deviation of the start perturbation along the target normal, as a fraction of
    /// the mean edge length (0 = start from the plain drape).</summary>
    public double StartPerturbation { get; init; } = 0.02;
    /// <summary>Phase 1 starts with a few steps on the constraints plus a faint pull toward the target (a
    /// well-conditioned approach to the constraint set); false goes straight to the projection, for a
    /// start whose sheet-wide shape already suits the constraints (a coarse start) and which the pull
    /// would take back toward the target.</summary>
    public bool PullTowardTargetFirst { get; init; } = true;
    /// <summary>Only restore the constraints from the start (phase 1), with no shape phase: for a refit that
    /// adds a bound to a fitted result whose shape is already what the fit could reach.</summary>
    public bool ConstraintsOnly { get; init; }
    /// <summary>Initial augmented-Lagrangian penalty (dimensionless: constraints are in radians).</summary>
    public double InitialPenalty { get; init; } = 1e6;

    /// <summary>Called after every recorded step (from the fitting thread; starts run in parallel), for
    /// progress display only: it must not change the fit.</summary>
    public Action<FitIteration>? OnStep { get; init; }

    /// <summary>These settings with the pattern's own <see cref="GeneratedPattern.InitialPenalty"/>
    /// when its family sets one.</summary>
    public FitSettings For(GeneratedPattern pattern) =>
        pattern.InitialPenalty is double penalty ? this with { InitialPenalty = penalty } : this;
}
