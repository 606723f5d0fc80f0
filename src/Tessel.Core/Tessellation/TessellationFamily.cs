using Tessel.Core.Jobs;
using Tessel.Core.Targets;

namespace Tessel.Core.Tessellation;

/// <summary>The descriptor of one tessellation family: what the job loader, catalog and memory
/// estimate read (<see cref="FamilyInfo"/>), its generator, its verdict on a target's curvature and
/// its starting fold depth. Each family registers one in its own folder, by one line in
/// <see cref="TessellationFamilies.All"/>.</summary>
public abstract class TessellationFamily : FamilyInfo
{
    /// <summary>Builds the family on the target. Throws <see cref="ArgumentException"/> (ParamName = the
    /// <see cref="FamilyParameters"/> property) for parameters the family cannot use.</summary>
    public abstract GeneratedPattern Generate(ITargetSurface target, FamilyParameters p);

    /// <summary>Judges the pairing with a target of the given curvature (<see cref="FamilyAdvice.For(string, CurvatureFigures)"/>).</summary>
    public abstract FamilyAdvice Judge(CurvatureFigures c);

    /// <summary>Why the generator cannot build on this target although its curvature suits, as advice
    /// naming a family that can; null when it can.</summary>
    public virtual FamilyAdvice? CannotBuild(ITargetSurface target) => null;

    /// <summary>Fold depth in metres when the job gives none, from the plan cell size (metres) and the
    /// sector angle. A quarter of the smaller cell half-size keeps a Miura-type sheet well away from
    /// folded shut at any acute sector angle (depth below L tan(gamma)).</summary>
    public virtual double DefaultFoldDepth(double cellX, double cellY, double sectorAngleDeg) =>
        0.25 * Math.Min(cellX, cellY) * Math.Tan(sectorAngleDeg * Math.PI / 180) / 2;

    /// <summary>How far one cell can turn (radians) with these parameters before a crease goes flat
    /// (<see cref="FollowEstimate"/>); null where the family is not judged this way. May throw
    /// <see cref="ArgumentException"/> where the parameters make no cell.</summary>
    public abstract double? TurnLimit(Footprint footprint, FamilyParameters p);

    /// <summary>For a family whose generated state is already its folded answer (built in closed form, so the
    /// fit cannot deepen a fold without leaving the target), other parameters whose every crease folds at
    /// least <paramref name="minFoldAngle"/> radians when the job's do not; null when the job's do, or
    /// when the family leaves its fold angles to the fit. May throw <see cref="ArgumentException"/> where
    /// the parameters make no pattern (the generator then says so).</summary>
    public virtual ShallowFoldRepair? DeepenShallowFolds(ITargetSurface target, FamilyParameters p, double minFoldAngle) => null;

    /// <summary>The same sheet with other cell counts, for the fit's coarse start on large sheets
    /// (<see cref="Fitting.CoarseStart"/>): the job's counts as generated and a generator for other counts,
    /// the fold depth scaled with the cells so that the cells keep their shape; null where the family has
    /// none (its fit starts from the drape at every size).</summary>
    public virtual CoarserSheets? Coarser(ITargetSurface target, FamilyParameters p) => null;

    /// <summary>False for a family with one vertex layer, where the fold depth means nothing.</summary>
    public virtual bool HasFoldDepth => true;

    /// <summary>Degree-4 families place a 2 x 2 block of vertices per cell.</summary>
    public override double Vertices(double cellsX, double cellsY) => (2 * cellsX + 1) * (2 * cellsY + 1);
}
