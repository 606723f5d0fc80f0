using Tessel.Core.Checks;
using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Core.Targets;

namespace Tessel.Core.Pipeline;

/// <summary>Where a build ended.</summary>
public enum PipelineStop
{
    /// <summary>Every stage ran; the sheets exist when the job asks for any sheet format.</summary>
    None,
    /// <summary>The fit is not buildable and the job does not accept that: the pipeline ended after
    /// the fit (and, with an automatic scale, the unfolding and the scale choice).</summary>
    UnbuildableFit,
    /// <summary>Checks ran, but the flat layout cannot be cut into sheets: everything but the sheets exists.</summary>
    UncuttableLayout,
}

/// <summary>Everything one job produced, stage by stage, with the warnings and where the build ended.</summary>
/// <param name="Job">The job as the stages after the fit saw it: with an automatic scale, the chosen
/// scale and its reason (<see cref="FabricationSpec.ScaleReason"/>); otherwise the job as given.</param>
/// <param name="Unfolded">The fitted model developed to the plane; null only when the build stopped
/// after the fit with a fixed scale.</param>
/// <param name="Checks">Null when the build stopped after the fit.</param>
/// <param name="Sheets">Null when the job asks for no sheet format or the build stopped before the sheets.</param>
/// <param name="SheetsRefused">Why the layout cannot be cut (<see cref="PipelineStop.UncuttableLayout"/>), or null.</param>
/// <param name="Warnings">Every warning in the order the stages raised them, as the summary and report list them.</param>
/// <param name="Problem">One line saying why the build stopped short and what to try, or null.</param>
public sealed record PipelineResult(
    Job Job,
    TargetStageResult Target,
    TessellationStageResult Tessellation,
    FitStageResult Fit,
    FlatPattern? Unfolded,
    ChecksStageResult? Checks,
    SheetStageResult? Sheets,
    string? SheetsRefused,
    IReadOnlyList<string> Warnings,
    PipelineStop Stop,
    string? Problem);

/// <summary>Runs the stages of one job in order: target, tessellation, fit and unfolding (rebuilt with fewer
/// cells while creases stay short or the flat layout overlaps itself), checks of the folded model, the
/// flat-layout check, sheets. The only place that knows every stage; it writes nothing.</summary>
/// <remarks>With an automatic scale the scale is chosen from the unfolded pattern before the checks, and the
/// folded-model checks measure creases in millimetres at that scale.</remarks>
public static class BuildPipeline
{
    /// <param name="decodeImage">Decodes the PNG of a height-map target; null when no image decoder is
    /// available (a height-map job then fails with a <see cref="JobError"/>).</param>
    /// <exception cref="JobError">Bad input: nothing of the build is usable.</exception>
    /// <exception cref="StageBreakdownError">A stage's numbers broke down.</exception>
    public static PipelineResult Run(Job job, GrayImageDecoder? decodeImage, ProgressReporter progress)
    {
        var target = TargetStage.Run(job, decodeImage, progress);
        var tessellation = TessellationStage.Run(job, target.Target, progress);
        // Later stages and the report see the cells the pattern was made with.
        if (tessellation.LengthRepair is { } lengthened)
            job = job with { Tessellation = job.Tessellation with { CellsX = lengthened.CellsX, CellsY = lengthened.CellsY, CellSize = lengthened.CellSize } };
        var pattern = tessellation.Pattern;
        // The size is known exactly now (a mesh target without a footprint gets its cell counts only here).
        double raster = job.Outputs.Png ? SheetLimits.PngRasterBytes(job.Fabrication.Sheet.WidthMm, job.Fabrication.Sheet.HeightMm) : 0;
        if (MemoryEstimate.ProblemForPattern(job.Tessellation.Family, pattern.Mesh.VertexCount, raster) is { } tooBig)
            throw new JobError(job.Tessellation.CellSize is null ? "tessellation.cellsX" : "tessellation.cellSize",
                tooBig + "; use fewer cells (tessellation.cellsX and tessellation.cellsY) or a larger tessellation.cellSize");
        // An unknown material is bad input: refuse it before the long fit, not after.
        double strainLimit = SheetStage.SettingsFor(job).Material.StrainLimit;

        var fit = FitStage.Run(job, pattern, target.Target, progress, tessellation.DrapeOn, tessellation.Coarser);
        // The flat layout of each buildable fit is measured here (it is the same for any scale), so that one
        // which overlaps itself is rebuilt with larger facets before the checks; the last one is kept for them.
        (FitStageResult Fit, FlatPattern Flat)? developed = null;
        CellsShortfall? Overlap(FitStageResult f)
        {
            var flat = UnfoldingStage.Run(f.Fit.Mesh, progress);
            developed = (f, flat);
            var faces = ModelScalePattern.Of(flat, job.Fabrication.AutoScale ? 1000 : 1000 / job.Fabrication.Scale).Faces;
            return LayoutOverlap.Overlaps(faces, job.Fabrication.AutoScale ? "at full scale" : "at model scale") is { } how
                ? new($"has a flat layout that overlaps itself ({how})", "try another family or tessellation.foldDepth")
                : null;
        }
        var cells = FewerCells.UntilItHolds(job, tessellation, fit, tessellation.LengthRepair is { } lengthRepair ? [lengthRepair.Message] : [],
            f => FewerCells.ShortCreases(f) ?? Overlap(f),
            coarser =>
            {
                var retried = TessellationStage.Run(coarser, target.Target, progress);
                if (retried.LengthRepair is { } further)
                    coarser = coarser with { Tessellation = coarser.Tessellation with { CellsX = further.CellsX, CellsY = further.CellsY, CellSize = further.CellSize } };
                return (coarser, retried, FitStage.Run(coarser, retried.Pattern, target.Target, progress, retried.DrapeOn, retried.Coarser));
            }, progress);
        (job, tessellation, fit) = (cells.Job, cells.Tessellation, cells.Fit);
        pattern = tessellation.Pattern;
        FlatPattern? unfolded = developed is { } d && ReferenceEquals(d.Fit, fit) ? d.Flat : null;
        if (job.Fabrication.AutoScale)
        {
            unfolded ??= UnfoldingStage.Run(fit.Fit.Mesh, progress);
            job = SheetStage.ResolveScale(job, unfolded, progress);
        }

        var warnings = new List<string>();
        if (!tessellation.Advice.Suits) warnings.Add(tessellation.Advice.Message);
        warnings.AddRange(cells.Changes);
        if (tessellation.FoldRepair is { } repair) warnings.Add(repair.Message);
        if (tessellation.Follow is { CanFollow: false, Message: { } followWarning }) warnings.Add(followWarning);
        warnings.AddRange(fit.Fit.Adjustments);
        if (fit.Fit.Buildable && !fit.Fit.Converged)
            warnings.Add($"the fit is buildable but not finished: {FitStage.Verdict(fit.Fit)}; raise fitting.maxIterations for a closer shape");
        if (!fit.Fit.Buildable)
        {
            string why = $"the fit is not buildable ({fit.Fit.StopReason}; largest constraint residual {fit.Fit.Residuals.MaxConstraintViolation:0.##E+0})";
            if (!job.Fitting.AcceptUnconverged)
            {
                string problem = why + "; no sheets were written. Try more cells, a smaller tessellation.foldDepth, another family (tessel catalog families), or pass --accept-unconverged";
                return new PipelineResult(job, target, tessellation, fit, unfolded, null, null, null, warnings, PipelineStop.UnbuildableFit, problem);
            }
            warnings.Add(why + "; outputs written because the job accepts an unconverged fit");
        }
        // The job's bounds belong to buildable: a result that still misses them after every repair above is
        // refused like an unbuildable fit (its adjustments, among the warnings, say what was tried).
        var folds = FoldRoles.Bounds(fit.Fit.Mesh, Math.Max(job.Fitting.Bounds.MinFoldAngleDeg, 0), job.Fitting.Bounds.MaxFoldAngleDeg, job.Fitting.Tolerance);
        if (fit.Fit.Buildable && (fit.ShortCreases > 0 || folds.Violations > 0))
        {
            var misses = new List<string>();
            var fixes = new List<string>();
            if (fit.ShortCreases > 0)
            {
                misses.Add($"{fit.ShortCreases} crease(s) under fitting.bounds.minEdgeLengthMm");
                fixes.Add("a larger model (a smaller fabrication.scale), fewer cells or a smaller minEdgeLengthMm");
            }
            if (folds.Violations > 0)
            {
                misses.Add($"{folds.Violations} fold(s) outside fitting.bounds fold angles");
                fixes.Add("more cells or wider fitting.bounds.minFoldAngleDeg / maxFoldAngleDeg");
            }
            string why = $"the fit misses the job's bounds after every repair ({string.Join(", ", misses)})";
            if (!job.Fitting.AcceptUnconverged)
            {
                string problem = why + $"; no sheets were written. Try {string.Join("; or ", fixes)}; or pass --accept-unconverged";
                return new PipelineResult(job, target, tessellation, fit, unfolded, null, null, null, warnings, PipelineStop.UnbuildableFit, problem);
            }
            warnings.Add(why + "; outputs written because the job accepts an unconverged fit");
        }

        var folded = ChecksStage.FoldedModel(job, fit.Fit.Mesh, progress, pattern.Envelope);
        unfolded ??= UnfoldingStage.Run(fit.Fit.Mesh, progress);
        var checks = ChecksStage.FlatLayout(folded, unfolded, strainLimit, progress);
        warnings.AddRange(CheckWarnings(job, checks, pattern.PromisesSynclasticEnvelope));

        if (!(job.Outputs.Svg || job.Outputs.Dxf || job.Outputs.Pdf || job.Outputs.Png))
            return new PipelineResult(job, target, tessellation, fit, unfolded, checks, null, null, warnings, PipelineStop.None, null);
        try
        {
            var sheets = SheetStage.Run(job, unfolded, progress);
            warnings.AddRange(sheets.Layout.Figures.Warnings);
            if (job.Outputs.Png && SheetLimits.PngNote(job.Fabrication.Sheet.WidthMm, job.Fabrication.Sheet.HeightMm) is { } note)
                warnings.Add(note);
            return new PipelineResult(job, target, tessellation, fit, unfolded, checks, sheets, null, warnings, PipelineStop.None, null);
        }
        catch (UncuttableLayoutException e)
        {
            // The model, checks and report are still worth having; only the sheets would be wrong.
            string why = $"no sheets were written: {e.Message}";
            warnings.Add(why);
            progress.Step(why);
            return new PipelineResult(job, target, tessellation, fit, unfolded, checks, null, e.Message, warnings, PipelineStop.UncuttableLayout, why);
        }
    }

    /// <summary>One warning per check the fitted model fails, in the order the summary lists them.</summary>
    private static IEnumerable<string> CheckWarnings(Job job, ChecksStageResult checks, bool promisesSynclasticEnvelope)
    {
        double strainLimit = checks.Strain.StrainLimit;
        if (checks.CollisionCount > 0) yield return $"{checks.CollisionCount} panel collision(s) at the fitted state or along the folding path";
        if (checks.Strain.FacetsOverLimit.Length > 0)
            yield return $"{checks.Strain.FacetsOverLimit.Length} facet(s) need more than the material's {strainLimit * 100:0.##} % strain to lie flat (largest {checks.Strain.MaxStrain * 100:0.###} %)";
        if (checks.FoldBounds is { Violations: > 0 } fb)
            yield return $"{fb.Violations} fold(s) outside fitting.bounds fold angles {Math.Max(job.Fitting.Bounds.MinFoldAngleDeg, 0):0.###} to {job.Fitting.Bounds.MaxFoldAngleDeg:0.###} deg ({fb.BelowMinimum} below, {fb.AboveMaximum} above; worst by {fb.MaxViolationRad * 180 / Math.PI:0.###} deg); creases under {FoldRoles.FlatToleranceDeg} deg are drawn flat";
        if (checks.ShortCreaseCount > 0)
            yield return $"{checks.ShortCreaseCount} crease(s) shorter than fitting.bounds.minEdgeLengthMm = {job.Fitting.Bounds.MinEdgeLengthMm} mm at model scale (shortest {checks.ShortestCreaseMm:0.##} mm)";
        if (promisesSynclasticEnvelope && checks.Envelope is { Synclastic: false } env)
            yield return $"the envelope is not synclastic: angle defect <= 0 at {env.Interior - env.Positive} of {env.Interior} interior envelope vertices (smallest {env.MinDefect:0.##E+0} rad); try another foldDepth or sectorAngleDeg";
        if (!checks.Path.ReachedNearFlat)
            yield return $"the rigid folding path did not reach the flat sheet ({checks.Path.StopTowardFlat})";
    }
}
