using Tessel.Core.Jobs;
using Tessel.Core.Pipeline;
using Tessel.Core.Targets;
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
/// short (<see cref="PipelineResult.Problem"/>), with the files written so far.</param>
public sealed record BuildResult(string Folder, IReadOnlyList<(string Path, long Bytes)> Files, string? Problem = null);

/// <summary>Runs the pipeline for one job and writes its files into one output folder.</summary>
/// <remarks><see cref="BuildPipeline"/> computes every stage; this class only turns its result into
/// files and figures in a <see cref="BuildOutput"/>, in the order the summary lists them. Nothing touches
/// the disk until the whole result is mapped. Then <see cref="OutputFolder"/> writes the files into a
/// staging folder and swaps it for the output folder whole, never writing outside it.</remarks>
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

    /// <summary>Runs the pipeline and gathers its files and figures, without writing anything.</summary>
    public static BuildOutput Collect(Job job, ProgressReporter progress) =>
        Map(BuildPipeline.Run(job, HeightMapImage.Decode, progress), progress);

    /// <summary>Files and figures of a pipeline result, in the order the summary lists them.</summary>
    public static BuildOutput Map(PipelineResult result, ProgressReporter progress)
    {
        var job = result.Job;
        progress.Stage("files", "drawing the target, model and sheet files");
        var output = new BuildOutput();
        output.AddFigure("job", "seed", (long)job.Seed);
        output.AddFigure("job", "family", job.Tessellation.Family);
        if (job.Fabrication.AutoScale) output.AddFigure("job", "scale", "auto");
        else output.AddFigure("job", "scale", job.Fabrication.Scale);
        AddTarget(output, job, result.Target, progress);
        AddModel(output, result, progress);
        return output;
    }

    /// <summary>Tessellation, fit, checks, sheets and report. A build stopped after the fit has no
    /// checks, sheets, warnings or report: its problem says why.</summary>
    private static void AddModel(BuildOutput output, PipelineResult result, ProgressReporter progress)
    {
        var (job, tessellation, fit) = (result.Job, result.Tessellation, result.Fit);
        // Always true (every family the loader accepts has a generator); kept so summary.json keeps its fields.
        output.AddFigure("tessellation", "available", true);
        output.AddFigure("tessellation", "familySuitsTarget", tessellation.Advice.Suits);
        output.AddFigure("tessellation", "advice", tessellation.Advice.Message);
        if (tessellation.Follow is { CanFollow: false, Message: { } cannotFollow }) output.AddFigure("tessellation", "cannotFollow", cannotFollow);
        if (job.Fabrication.AutoScale)
        {
            output.AddFigure("sheets", "chosenScale", job.Fabrication.Scale);
            output.AddFigure("sheets", "chosenScaleReason", job.Fabrication.ScaleReason!);
        }
        ModelOutputs.AddFit(output, job, tessellation, fit);
        if (result.Checks is not { } checks)
        {
            output.Problem = result.Problem;
            return;
        }
        ModelOutputs.AddChecks(output, job, checks, checks.Strain.StrainLimit);
        if (result.Sheets is { } sheets)
        {
            ModelOutputs.AddSheets(output, job, sheets);
            if (job.Outputs.Png)
                output.AddFigure("sheets", "pngDpi", (long)(SheetLimits.PngDpi(job.Fabrication.Sheet.WidthMm, job.Fabrication.Sheet.HeightMm) ?? SheetLimits.PreferredPngDpi));
        }
        if (result.SheetsRefused is { } refused) output.AddFigure("sheets", "refused", refused);
        output.Problem = result.Problem;
        var warnings = result.Warnings;
        for (int i = 0; i < warnings.Count; i++) output.AddFigure("warnings", $"warning[{i}]", warnings[i]);

        if (job.Outputs.Report)
        {
            progress.Stage("report", "previews, report.html and summary.md");
            var model = ReportAssembly.Build(job, result.Target.Target, tessellation, fit, checks, result.Sheets, warnings);
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
