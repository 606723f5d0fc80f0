using Tessel.Core.Checks;
using Tessel.Core.LinearAlgebra;
using Tessel.Core.Jobs;
using Tessel.Core.Model;

namespace Tessel.Core.Pipeline;

/// <summary>What the checks of the folded model found: how it moves, whether it folds flat without
/// collisions, and how its folds and creases meet the job's bounds.</summary>
public sealed record FoldedModelChecks(
    RigidityResult Rigidity,
    FoldingPathResult Path,
    CollisionResult FittedCollisions,
    IReadOnlyList<PathCollisionFrame> PathCollisions,
    IReadOnlyList<FoldAngleRow> FoldAngles,
    int ShortCreaseCount,
    double ShortestCreaseMm,
    EnvelopeCurvature? Envelope,
    FoldBoundCount FoldBounds);

/// <summary>Everything that says whether the fitted pattern can be built, with the flat layout whose
/// strain was measured.</summary>
public sealed record ChecksStageResult(
    FlatPattern Flat,
    RigidityResult Rigidity,
    FoldingPathResult Path,
    CollisionResult FittedCollisions,
    IReadOnlyList<PathCollisionFrame> PathCollisions,
    IReadOnlyList<FoldAngleRow> FoldAngles,
    FlatStrainResult Strain,
    int ShortCreaseCount,
    double ShortestCreaseMm,
    EnvelopeCurvature? Envelope,
    FoldBoundCount FoldBounds)
{
    /// <summary>Panel pairs that collide at the fitted state or at any kept state of the path.</summary>
    public int CollisionCount => FittedCollisions.Count + PathCollisions.Sum(f => f.Collisions.Count);
}

/// <summary>Fourth stage: proves the fitted pattern folds, in two steps around the unfolding: <see cref="FoldedModel"/>
/// (degrees of freedom, rigid folding path, collisions, fold-angle table, fold and crease bounds,
/// envelope curvature) needs only the folded mesh; <see cref="FlatLayout"/> (strain of every facet when
/// laid flat) needs the unfolded pattern.</summary>
public static class ChecksStage
{
    private static bool IsFlat(CreaseMesh mesh)
    {
        for (int e = 0; e < mesh.EdgeCount; e++)
            if (mesh.IsInterior(e) && Math.Abs(mesh.FoldAngle(e)) > 1e-9) return false;
        return true;
    }

    private static FoldingPathResult FlatPath(CreaseMesh mesh, int degreesOfFreedom)
    {
        const string why = "the fitted model has no fold: it is flat already";
        return new FoldingPathResult(degreesOfFreedom, true, 0, 1, 0, 0, 0, 0, why, why,
            [new FoldingKeyframe(0, 0, (double[])mesh.Positions.Clone(), 0), new FoldingKeyframe(1, 0, (double[])mesh.Positions.Clone(), 0)],
            TimeSpan.Zero);
    }

    /// <summary>Runs one check, turning a numerical breakdown inside it into a one-line error naming the check.</summary>
    private static T Guard<T>(string step, Func<T> run)
    {
        try { return run(); }
        catch (Exception e) when (e is NotPositiveDefiniteException or ArithmeticException)
        {
            throw new StageBreakdownError("checks",
                $"{step} broke down on the fitted model: {e.Message}; the fit left a degenerate or singular model, try other cell counts or cellSize", e);
        }
    }

    /// <summary>The checks that need only the folded model, at the job's (resolved) scale.</summary>
    /// <param name="envelope">The family's envelope builder (<see cref="Tessellation.GeneratedPattern.Envelope"/>), or null.</param>
    /// <exception cref="StageBreakdownError">A check's linear algebra broke down on the fitted model.</exception>
    public static FoldedModelChecks FoldedModel(Job job, CreaseMesh fitted, ProgressReporter progress,
        Func<CreaseMesh, CreaseMesh>? envelope = null)
    {
        progress.Stage("checks", "degrees of freedom");
        var rigidity = Guard("the degree-of-freedom check", () => RigidityAnalysis.DegreesOfFreedom(fitted));
        progress.Step($"DOF {rigidity.DegreesOfFreedom} (rank {rigidity.Rank} of {rigidity.Unknowns}, gap {rigidity.GapRatio:0.##E+0}, {rigidity.Method})");

        progress.Step("rigid folding path toward flat and further folded");
        // A model with no fold has no folding path to follow: it is its own flat state.
        var path = IsFlat(fitted) ? FlatPath(fitted, rigidity.DegreesOfFreedom)
            : Guard("the folding-path check", () => RigidFoldingPath.Simulate(fitted));
        progress.Step($"progress {path.LowestProgress:0.###} to {path.HighestProgress:0.###}, near-flat {(path.ReachedNearFlat ? "reached" : "not reached")}, drift {path.MaxBarStrain:0.##E+0}");

        progress.Step("panel collisions");
        var fittedCollisions = PanelCollisions.Find(fitted);
        var pathCollisions = PanelCollisions.AlongPath(fitted, path);
        var foldAngles = FoldAngleTable.Build(fitted, job.Fabrication.Scale);
        var foldBounds = FoldRoles.Bounds(fitted, Math.Max(job.Fitting.Bounds.MinFoldAngleDeg, 0), job.Fitting.Bounds.MaxFoldAngleDeg, job.Fitting.Tolerance);

        double minMm = job.Fitting.Bounds.MinEdgeLengthMm, shortest = double.PositiveInfinity;
        int shortCount = 0;
        // A crease is an interior edge: the outline is cut, and a cut may be as short as it likes.
        for (int e = 0; e < fitted.EdgeCount; e++)
        {
            if (!fitted.IsInterior(e)) continue;
            var a = fitted.Vertex(fitted.EdgeVertices[2 * e]);
            var b = fitted.Vertex(fitted.EdgeVertices[2 * e + 1]);
            double mm = (b - a).Length * 1000 / job.Fabrication.Scale;
            shortest = Math.Min(shortest, mm);
            // The fit holds the bound to its constraint tolerance (scaled edge lengths): a crease at the
            // minimum less a part in a billion is at the minimum.
            if (mm < minMm * (1 - 1e-9)) shortCount++;
        }
        progress.Step($"collisions {fittedCollisions.Count + pathCollisions.Sum(f => f.Collisions.Count)}");
        EnvelopeCurvature? curvature = null;
        if (envelope is not null)
        {
            curvature = EnvelopeCurvature.Of(envelope(fitted));
            if (curvature is not null)
                progress.Step($"envelope angle defects {curvature.MinDefect:0.###E+0} to {curvature.MaxDefect:0.###E+0} rad, positive at {curvature.Positive} of {curvature.Interior}");
        }
        return new FoldedModelChecks(rigidity, path, fittedCollisions, pathCollisions, foldAngles, shortCount, shortest, curvature, foldBounds);
    }

    /// <summary>The flat-layout check on the unfolded pattern, joined with the folded-model checks.</summary>
    /// <param name="strainLimit">The material's strain limit (<see cref="Sheets.Material.StrainLimit"/>).</param>
    public static ChecksStageResult FlatLayout(FoldedModelChecks folded, FlatPattern flat, double strainLimit, ProgressReporter progress)
    {
        var strain = FlatLayoutStrain.Measure(flat, strainLimit);
        progress.Step($"max flat strain {strain.MaxStrain * 100:0.####} % (limit {strainLimit * 100:0.##} %)");
        return new ChecksStageResult(flat, folded.Rigidity, folded.Path, folded.FittedCollisions, folded.PathCollisions,
            folded.FoldAngles, strain, folded.ShortCreaseCount, folded.ShortestCreaseMm, folded.Envelope, folded.FoldBounds);
    }
}
