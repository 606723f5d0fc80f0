using Tessel.Core.Geometry;
using Tessel.Core.Jobs;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Pipeline;

/// <summary>The crease pattern a family generated on the target, and whether the family suits the
/// target's curvature.</summary>
/// <param name="Pattern">Draped initial state with the family's constraints.</param>
/// <param name="Advice">Plain-words verdict on pairing this family with this target.</param>
public sealed record TessellationStageResult(GeneratedPattern Pattern, FamilyAdvice Advice)
{
    /// <summary>Drapes the same family with the same parameters on another surface (the fit's continuation
    /// starts from the target's best-fit plane).</summary>
    public Func<ITargetSurface, GeneratedPattern>? DrapeOn { get; init; }
    /// <summary>Whether the family can bend as tightly as the target at the job's cells (judged before
    /// the fit), and the change that would let it; null where no estimate was made.</summary>
    public FollowEstimate? Follow { get; init; }
    /// <summary>A change the family made to its parameters before the fit so that its creases fold at least
    /// the job's minimum (<see cref="TessellationFamily.DeepenShallowFolds"/>), or why it could not; null
    /// when none was needed.</summary>
    public ShallowFoldRepair? FoldRepair { get; init; }
    /// <summary>The same sheet with fewer cells, for the fit's coarse start on large sheets; null where the
    /// family has none.</summary>
    public CoarserSheets? Coarser { get; init; }
}

/// <summary>Second stage: job tessellation section + target -> draped crease pattern.</summary>
public static class TessellationStage
{
    /// <exception cref="JobError">The family's parameters cannot make a pattern on this target.</exception>
    public static TessellationStageResult Run(Job job, ITargetSurface target, ProgressReporter progress)
    {
        var spec = job.Tessellation;
        progress.Stage("tessellation", $"generating the {spec.Family} pattern");
        var curvature = CurvatureFigures.Sample(target);
        var advice = FamilyAdvice.For(spec.Family, target, curvature);
        if (!advice.Suits) progress.Step(advice.Message);
        // The job loader accepts exactly the registered families; a job built in code may name another.
        var family = TessellationFamilies.Find(spec.Family)
            ?? throw new JobError("tessellation.family", $"unknown family '{spec.Family}'; known families: {string.Join(", ", TessellationFamilies.Names)}");
        Units.TryMetresPer(job.Target.Units, out double metres);
        var p = new FamilyParameters(spec.CellsX, spec.CellsY, spec.CellSize * metres, spec.SectorAngleDeg,
            spec.FoldDepth is double d ? d * metres : DefaultFoldDepth(family, target.Footprint, spec, metres),
            spec.OrientationDeg, spec.FlatDiagonalShare);
        var repair = ShallowFolds(family, target, p, job.Fitting.Bounds.MinFoldAngleDeg);
        if (repair is not null)
        {
            progress.Step(repair.Message);
            p = repair.Parameters ?? p;
        }
        var follow = advice.Suits ? FollowEstimate.Check(spec.Family, target, p, curvature, depthScalesWithCells: spec.FoldDepth is null) : null;
        if (follow is { CanFollow: false, Message: { } warning }) progress.Step(warning);
        try
        {
            var pattern = family.Generate(target, p);
            progress.Step($"{pattern.Mesh.VertexCount} vertices, {pattern.Mesh.FaceCount} facets, {pattern.Mesh.EdgeCount} edges");
            // Facets joined only at corners cannot be laid flat as one sheet (nor folded as one): say so here,
            // where the cells meet the footprint, rather than as a singular system in the unfolding.
            int pieces = Unfolding.MeshUnfolder.Pieces(pattern.Mesh);
            if (pieces > 1)
                throw new JobError(spec.CellsX is null && spec.CellSize is not null ? "tessellation.cellSize" : "tessellation.cellsX",
                    $"the {spec.Family} pattern falls into {pieces} pieces on this footprint (facets meet only at corners where the footprint narrows); use smaller cells (more cellsX and cellsY) or a wider footprint");
            return new TessellationStageResult(pattern, advice) { Follow = follow, FoldRepair = repair, Coarser = family.Coarser(target, p), DrapeOn = surface => family.Generate(surface, p with { BuildableStart = true }) };
        }
        catch (ArgumentException e)
        {
            throw new JobError("tessellation." + FieldOf(e.ParamName), FirstLine(e.Message));
        }
    }

    /// <summary>The family's repair of folds shallower than the job's minimum, before any fitting; null when
    /// none is needed or the parameters make no pattern (the generator reports that next).</summary>
    private static ShallowFoldRepair? ShallowFolds(TessellationFamily family, ITargetSurface target, FamilyParameters p, double minFoldAngleDeg)
    {
        if (!(minFoldAngleDeg > 0)) return null;
        try { return family.DeepenShallowFolds(target, p, minFoldAngleDeg * Math.PI / 180); }
        catch (ArgumentException) { return null; }
    }

    /// <summary>The family's fold depth for the job's plan cell size (cells given, or the cell size,
    /// or an eighth of the footprint).</summary>
    private static double DefaultFoldDepth(TessellationFamily family, Footprint fp, TessellationSpec spec, double metres)
    {
        double cx = spec.CellsX is int nx ? fp.Width / nx : (spec.CellSize ?? fp.Width / 8) * metres;
        double cy = spec.CellsY is int ny ? fp.Depth / ny : (spec.CellSize ?? fp.Depth / 8) * metres;
        return family.DefaultFoldDepth(cx, cy, spec.SectorAngleDeg);
    }

    private static string FieldOf(string? parameter) => parameter switch
    {
        "CellsX" or "Bases" => "cellsX",
        "CellsY" or "Rows" => "cellsY",
        "CellSize" => "cellSize",
        "SectorAngleDeg" => "sectorAngleDeg",
        "FoldDepth" => "foldDepth",
        "OrientationDeg" => "orientationDeg",
        "FlatDiagonalShare" => "flatDiagonalShare",
        _ => "family",
    };

    private static string FirstLine(string message)
    {
        int paren = message.IndexOf(" (Parameter '", StringComparison.Ordinal);
        return paren >= 0 ? message[..paren] : message;
    }
}
