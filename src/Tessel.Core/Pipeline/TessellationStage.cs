using Tessel.Core.Geometry;
using Tessel.Core.Jobs;
using Tessel.Core.Model;
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
    /// <summary>Fewer, larger cells chosen before the fit so that every draped crease reaches the job's
    /// minimum crease at model scale (<see cref="CreaseLengths"/>); null when none was needed.</summary>
    public CreaseLengthRepair? LengthRepair { get; init; }
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
        FamilyParameters ParametersOf(TessellationSpec s) => new(s.CellsX, s.CellsY, s.CellSize * metres, s.SectorAngleDeg,
            s.FoldDepth is double d ? d * metres : DefaultFoldDepth(family, target.Footprint, s, metres),
            s.OrientationDeg, s.FlatDiagonalShare);
        // The length check drapes the pattern; the same parameters are not draped twice.
        (FamilyParameters Parameters, GeneratedPattern Pattern)? last = null;
        GeneratedPattern Generate(FamilyParameters q)
        {
            if (last is { } l && l.Parameters == q) return l.Pattern;
            var generated = family.Generate(target, q);
            last = (q, generated);
            return generated;
        }
        var lengthRepair = LongEnoughCreases(job, ParametersOf, Generate);
        if (lengthRepair is not null)
        {
            progress.Step(lengthRepair.Message);
            spec = spec with { CellsX = lengthRepair.CellsX, CellsY = lengthRepair.CellsY, CellSize = lengthRepair.CellSize };
        }
        var p = ParametersOf(spec);
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
            var pattern = Generate(p);
            progress.Step($"{pattern.Mesh.VertexCount} vertices, {pattern.Mesh.FaceCount} facets, {pattern.Mesh.EdgeCount} edges");
            // Facets joined only at corners cannot be laid flat as one sheet (nor folded as one): say so here,
            // where the cells meet the footprint, rather than as a singular system in the unfolding.
            int pieces = Unfolding.MeshUnfolder.Pieces(pattern.Mesh);
            if (pieces > 1)
                throw new JobError(spec.CellsX is null && spec.CellSize is not null ? "tessellation.cellSize" : "tessellation.cellsX",
                    $"the {spec.Family} pattern falls into {pieces} pieces on this footprint (facets meet only at corners where the footprint narrows); use smaller cells (more cellsX and cellsY) or a wider footprint");
            return new TessellationStageResult(pattern, advice) { Follow = follow, FoldRepair = repair, LengthRepair = lengthRepair, Coarser = family.Coarser(target, p), DrapeOn = surface => family.Generate(surface, p with { BuildableStart = true }) };
        }
        catch (ArgumentException e)
        {
            throw new JobError("tessellation." + FieldOf(e.ParamName), FirstLine(e.Message));
        }
    }

    /// <summary>Larger cells when the drape at the job's cells has creases shorter than the minimum crease at
    /// the job's fixed scale (no fit can lengthen every one of them and keep the pattern buildable: measured
    /// on a 20 x 20 Miura wave at 1:50 whose 1952 draped creases under 3 mm the fit left 327 short);
    /// null when none is needed, the scale is automatic, or the parameters make no pattern.</summary>
    private static CreaseLengthRepair? LongEnoughCreases(Job job, Func<TessellationSpec, FamilyParameters> parametersOf,
        Func<FamilyParameters, GeneratedPattern> generate)
    {
        var spec = job.Tessellation;
        if (job.Fabrication.AutoScale || !(job.Fitting.Bounds.MinEdgeLengthMm > 0)) return null;
        double minimum = job.Fitting.Bounds.MinEdgeLengthMm / 1000 * job.Fabrication.Scale;
        CreaseMesh Drape(int? nx, int? ny, double? size) => generate(parametersOf(spec with { CellsX = nx, CellsY = ny, CellSize = size })).Mesh;
        double shortest;
        try { shortest = CreaseLengths.Shortest(Drape(spec.CellsX, spec.CellsY, spec.CellSize)); }
        catch (ArgumentException) { return null; }
        if (!(shortest < minimum)) return null;
        string scale = FormattableString.Invariant($"1:{job.Fabrication.Scale:0.##}");
        string at = FormattableString.Invariant($"at {scale} the shortest crease of the {spec.Family} drape is {shortest * 1000 / job.Fabrication.Scale:0.##} mm on the model, under fitting.bounds.minEdgeLengthMm = {job.Fitting.Bounds.MinEdgeLengthMm:0.##} mm");
        // The scale that keeps the job's cells: the crease lengths are fixed at full scale.
        double largestScale = Math.Floor(job.Fabrication.Scale * shortest / minimum);
        string otherwise = FormattableString.Invariant($"to keep the cells, use fabrication.scale {largestScale:0} or less (a larger model) or a smaller minEdgeLengthMm");
        if (CreaseLengths.Coarsen(spec.CellsX, spec.CellsY, spec.CellSize, shortest, minimum, Drape) is not { } c)
            throw new JobError("tessellation.cellsX", $"{at}, and no count of 2 or more cells lengthens them enough; {otherwise}");
        string change = c.CellsX is null && c.CellsY is null
            ? FormattableString.Invariant($"tessellation.cellSize raised from {spec.CellSize:0.###} to {c.CellSize:0.###}")
            : FormattableString.Invariant($"tessellation.cellsX x cellsY lowered from {Count(spec.CellsX)} x {Count(spec.CellsY)} to {Count(c.CellsX)} x {Count(c.CellsY)}");
        return new CreaseLengthRepair(c.CellsX, c.CellsY, c.CellSize,
            FormattableString.Invariant($"{at}: {change} (shortest crease {c.Shortest * 1000 / job.Fabrication.Scale:0.##} mm); {otherwise}"));
    }

    private static string Count(int? n) => n is int k ? k.ToString(System.Globalization.CultureInfo.InvariantCulture) : "by cell size";

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
