using Tessel.Core.Checks;
using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Pipeline;
using Tessel.Core.Sheets;
using Tessel.Core.LinearAlgebra;
using Tessel.Core.Targets;
using Tessel.Core.Unfolding;
using Tessel.Output.IO;
using Tessel.Output.Previews;
using Tessel.Output.Report;
using Tessel.Output.Sheets;
using Tessel.Output.Writers;

namespace Tessel.Output.Build;

/// <summary>What a finished build wrote.</summary>
/// <param name="Folder">Absolute output folder.</param>
/// <param name="Files">Relative path and size of every file written, summary.json last.</param>
/// <param name="Problem">Null when the build is complete; otherwise the one-line reason it stopped
/// short (the fit did not converge and the job does not accept that), with the files written so far.</param>
public sealed record BuildResult(string Folder, IReadOnlyList<(string Path, long Bytes)> Files, string? Problem = null);

/// <summary>Runs the pipeline for one job and writes its files into one output folder.</summary>
/// <remarks>Every stage adds files and figures to a <see cref="BuildOutput"/>; nothing touches the disk
/// until all stages have succeeded. Then <see cref="OutputFolder"/> writes them into a staging folder
/// and swaps it for the output folder whole, never writing outside it.
/// To add a stage: compute it after the ones it needs inside <see cref="Collect"/> and add its files
/// and figures to the <see cref="BuildOutput"/>.</remarks>
public static class BuildRunner
{
    /// <summary>Name of the summary file, always written.</summary>
    public const string SummaryFile = "summary.json";

    /// <summary>Builds <paramref name="job"/> and writes its files into <paramref name="outputFolder"/>
    /// (created if missing).</summary>
    /// <exception cref="JobError">Bad input; nothing was written.</exception>
    /// <exception cref="OutputNotWritableError">The folder cannot be created or written.</exception>
    public static BuildResult Run(Job job, string outputFolder, ProgressReporter progress)
    {
        var output = Collect(job, progress);
        return Write(output, job, outputFolder, progress) with { Problem = output.Problem };
    }

    /// <summary>Runs every stage and gathers the files and figures, without writing anything.</summary>
    public static BuildOutput Collect(Job job, ProgressReporter progress)
    {
        var output = new BuildOutput();
        output.AddFigure("job", "seed", (long)job.Seed);
        output.AddFigure("job", "family", job.Tessellation.Family);
        if (job.Fabrication.AutoScale) output.AddFigure("job", "scale", "auto");
        else output.AddFigure("job", "scale", job.Fabrication.Scale);

        var targetStage = TargetStage.Run(job, HeightMapImage.Decode, progress);
        AddTarget(output, job, targetStage, progress);
        AddModel(output, job, targetStage.Target, progress);
        return output;
    }

    /// <summary>Tessellation, fit, checks, unfolding, sheets and report. Stops after the fit, without
    /// sheets, when the fit did not converge and the job does not accept that.</summary>
    private static void AddModel(BuildOutput output, Job job, ITargetSurface target, ProgressReporter progress)
    {
        var tessellation = TessellationStage.Run(job, target, progress);
        output.AddFigure("tessellation", "available", tessellation.Pattern is not null);
        output.AddFigure("tessellation", "familySuitsTarget", tessellation.Advice.Suits);
        output.AddFigure("tessellation", "advice", tessellation.Advice.Message);
        if (tessellation.Follow is { CanFollow: false, Message: { } cannotFollow }) output.AddFigure("tessellation", "cannotFollow", cannotFollow);
        if (tessellation.Pattern is null)
        {
            output.AddFigure("tessellation", "note", tessellation.Unavailable!);
            return;
        }
        // The size is known exactly now (a mesh target without a footprint gets its cell counts only here).
        double raster = job.Outputs.Png ? SheetLimits.PngRasterBytes(job.Fabrication.Sheet.WidthMm, job.Fabrication.Sheet.HeightMm) : 0;
        if (MemoryEstimate.ProblemForPattern(job.Tessellation.Family, tessellation.Pattern.Mesh.VertexCount, raster) is { } tooBig)
            throw new JobError(job.Tessellation.CellSize is null ? "tessellation.cellsX" : "tessellation.cellSize",
                tooBig + "; use fewer cells (tessellation.cellsX and tessellation.cellsY) or a larger tessellation.cellSize");
        var sheetSettings = SheetStage.SettingsFor(job);
        var fit = FitStage.Run(job, tessellation.Pattern, target, progress, tessellation.DrapeOn);
        FlatPattern? unfolded = null;
        if (job.Fabrication.AutoScale)
        {
            unfolded = MeshUnfolder.Unfold(fit.Fit.Mesh, new AutoSolver());
            job = SheetStage.ResolveScale(job, unfolded, progress);
            output.AddFigure("sheets", "chosenScale", job.Fabrication.Scale);
            output.AddFigure("sheets", "chosenScaleReason", job.Fabrication.ScaleReason!);
        }
        ModelOutputs.AddFit(output, job, tessellation, fit);
        var warnings = new List<string>();
        if (!tessellation.Advice.Suits) warnings.Add(tessellation.Advice.Message);
        if (tessellation.Follow is { CanFollow: false, Message: { } followWarning }) warnings.Add(followWarning);
        warnings.AddRange(fit.Fit.Adjustments);
        if (fit.Fit.Buildable && !fit.Fit.Converged)
            warnings.Add($"the fit is buildable but not finished: {FitStage.Verdict(fit.Fit)}; raise fitting.maxIterations for a closer shape");
        if (!fit.Fit.Buildable)
        {
            string why = $"the fit is not buildable ({fit.Fit.StopReason}; largest constraint residual {fit.Fit.Residuals.MaxConstraintViolation:0.##E+0})";
            if (!job.Fitting.AcceptUnconverged)
            {
                output.Problem = why + "; no sheets were written. Try more cells, a smaller tessellation.foldDepth, another family (tessel catalog families), or pass --accept-unconverged";
                return;
            }
            warnings.Add(why + "; outputs written because the job accepts an unconverged fit");
        }

        double strainLimit = sheetSettings.Material.StrainLimit;
        var checks = ChecksStage.Run(job, fit.Fit.Mesh, strainLimit, progress, tessellation.Pattern.Envelope, unfolded);
        ModelOutputs.AddChecks(output, job, checks, strainLimit);
        if (checks.CollisionCount > 0) warnings.Add($"{checks.CollisionCount} panel collision(s) at the fitted state or along the folding path");
        if (checks.Strain.FacetsOverLimit.Length > 0)
            warnings.Add($"{checks.Strain.FacetsOverLimit.Length} facet(s) need more than the material's {strainLimit * 100:0.##} % strain to lie flat (largest {checks.Strain.MaxStrain * 100:0.###} %)");
        if (checks.FoldBounds is { Violations: > 0 } fb)
            warnings.Add($"{fb.Violations} fold(s) outside fitting.bounds fold angles {Math.Max(job.Fitting.Bounds.MinFoldAngleDeg, 0):0.###} to {job.Fitting.Bounds.MaxFoldAngleDeg:0.###} deg ({fb.BelowMinimum} below, {fb.AboveMaximum} above; worst by {fb.MaxViolationRad * 180 / Math.PI:0.###} deg); creases under {FoldRoles.FlatToleranceDeg} deg are drawn flat");
        if (checks.ShortEdgeCount > 0)
            warnings.Add($"{checks.ShortEdgeCount} crease(s) shorter than fitting.bounds.minEdgeLengthMm = {job.Fitting.Bounds.MinEdgeLengthMm} mm at model scale (shortest {checks.ShortestEdgeMm:0.##} mm)");
        if (tessellation.Pattern.PromisesSynclasticEnvelope && checks.Envelope is { Synclastic: false } env)
            warnings.Add($"the envelope is not synclastic: angle defect <= 0 at {env.Interior - env.Positive} of {env.Interior} interior envelope vertices (smallest {env.MinDefect:0.##E+0} rad); try another foldDepth or sectorAngleDeg");
        if (!checks.Path.ReachedNearFlat)
            warnings.Add($"the rigid folding path did not reach the flat sheet ({checks.Path.StopTowardFlat})");

        SheetStageResult? sheets = null;
        if (SheetFormats.All.Any(f => f.IsWanted(job.Outputs)))
        {
            try
            {
                sheets = SheetStage.Run(job, checks.Flat, progress);
                ModelOutputs.AddSheets(output, job, sheets);
                warnings.AddRange(sheets.Layout.Figures.Warnings);
                if (job.Outputs.Png && SheetLimits.PngNote(job.Fabrication.Sheet.WidthMm, job.Fabrication.Sheet.HeightMm) is { } note)
                    warnings.Add(note);
                if (job.Outputs.Png)
                    output.AddFigure("sheets", "pngDpi", (long)(SheetLimits.PngDpi(job.Fabrication.Sheet.WidthMm, job.Fabrication.Sheet.HeightMm) ?? SheetLimits.PreferredPngDpi));
            }
            catch (UncuttableLayoutException e)
            {
                // The model, checks and report are still worth writing; only the sheets would be wrong.
                string why = $"no sheets were written: {e.Message}";
                output.Problem = output.Problem is null ? why : output.Problem + "; " + why;
                output.AddFigure("sheets", "refused", e.Message);
                warnings.Add(why);
                progress.Step(why);
            }
        }
        for (int i = 0; i < warnings.Count; i++) output.AddFigure("warnings", $"warning[{i}]", warnings[i]);

        if (job.Outputs.Report)
        {
            progress.Stage("report", "previews, report.html and summary.md");
            var model = ReportAssembly.Build(job, target, tessellation, fit, checks, sheets, warnings);
            // The report links every file of the build: those made so far, its own, and summary.json.
            var own = ReportFiles.Contents(model).Select(c => c.Name);
            model = model with { Files = [.. output.Files.Select(f => f.Path), .. own, "summary.json"] };
            foreach (var (name, bytes) in ReportFiles.Contents(model)) output.AddFile(name, bytes);
            output.Terminal = TerminalSummary.Format(model);
        }
    }

    private static void AddTarget(BuildOutput output, Job job, TargetStageResult stage, ProgressReporter progress)
    {
        var t = stage.Figures;
        output.AddFigure("target", "kind", t.Kind);
        output.AddFigure("target", "description", t.Description);
        output.AddFigure("target", "units", job.Target.Units);
        output.AddFigure("target", "minXM", t.MinX);
        output.AddFigure("target", "maxXM", t.MaxX);
        output.AddFigure("target", "minYM", t.MinY);
        output.AddFigure("target", "maxYM", t.MaxY);
        output.AddFigure("target", "extentXM", t.MaxX - t.MinX);
        output.AddFigure("target", "extentYM", t.MaxY - t.MinY);
        output.AddFigure("target", "footprintAreaM2", t.FootprintArea);
        output.AddFigure("target", "minHeightM", t.MinHeight);
        output.AddFigure("target", "maxHeightM", t.MaxHeight);
        output.AddFigure("target", "heightRangeM", t.MaxHeight - t.MinHeight);
        output.AddFigure("target", "minGaussianCurvaturePerM2", t.MinGaussianCurvature);
        output.AddFigure("target", "maxGaussianCurvaturePerM2", t.MaxGaussianCurvature);
        output.AddFigure("target", "minMeanCurvaturePerM", t.MinMeanCurvature);
        output.AddFigure("target", "maxMeanCurvaturePerM", t.MaxMeanCurvature);
        output.AddFigure("target", "curvatureSamples", (long)t.Samples);
        output.AddFigure("target", "curvatureIsEstimate", stage.Target is MeshSurface);

        if (job.Outputs.Obj)
        {
            progress.Step("meshing the target for target.obj");
            var mesh = TargetMesher.Mesh(stage.Target);
            output.AddFigure("target", "objVertices", (long)mesh.VertexCount);
            output.AddFigure("target", "objTriangles", (long)mesh.TriangleCount);
            output.AddFile("target.obj", ObjWriter.Write(mesh, $"Tessel target for job {job.Name}: {t.Description}\nmetres, z up"));
        }
        if (job.Outputs.Png)
        {
            progress.Step("rendering target.png");
            output.AddFile("target.png", TargetPreview.Render(stage.Target, t, job.Name));
        }
    }

    /// <summary>Writes gathered files and the summary into <paramref name="outputFolder"/>, replacing
    /// the files of the previous build there and keeping everything else (<see cref="OutputFolder"/>).</summary>
    /// <param name="cancel">Checked between files; when it fires before the swap, nothing in the
    /// folder has changed and <see cref="OperationCanceledException"/> is thrown.</param>
    public static BuildResult Write(BuildOutput output, Job job, string outputFolder, ProgressReporter progress, CancellationToken cancel = default)
    {
        progress.Stage("write", Path.GetFullPath(outputFolder));
        var files = output.Files.Append((SummaryFile, output.SummaryJson(job.Name, job.Description))).ToList();
        string root = OutputFolder.Replace(outputFolder, files, progress.Step, cancel);
        return new BuildResult(root, files.Select(f => (f.Item1, (long)f.Item2.Length)).ToList());
    }
}
