using System.Globalization;
using Tessel.Core.Checks;
using Tessel.Core.Geometry;
using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Pipeline;
using Tessel.Core.Sheets;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;
using Tessel.Output.Report;
using Tessel.Output.Sheets;
using Tessel.Output.Writers;

namespace Tessel.Output.Build;

/// <summary>Turns the results of the model stages (fit, checks, sheets) into figures, and hands them to
/// the writers (<c>Writers/</c>, <see cref="SheetFormats"/>) for files; it lays nothing out itself.</summary>
public static class ModelOutputs
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static void AddFit(BuildOutput output, Job job, TessellationStageResult tessellation, FitStageResult stage)
    {
        var fit = stage.Fit;
        var mesh = fit.Mesh;
        output.AddFigure("tessellation", "family", mesh.Family);
        output.AddFigure("tessellation", "vertices", (long)mesh.VertexCount);
        output.AddFigure("tessellation", "facets", (long)mesh.FaceCount);
        output.AddFigure("tessellation", "edges", (long)mesh.EdgeCount);
        output.AddFigure("tessellation", "foldDepthM", tessellation.Pattern!.LayerOffset);
        output.AddFigure("fit", "converged", fit.Converged);
        output.AddFigure("fit", "buildable", fit.Buildable);
        output.AddFigure("fit", "finished", fit.Converged);
        if (double.IsFinite(fit.LastRelativeDecrease)) output.AddFigure("fit", "lastRelativeDecrease", fit.LastRelativeDecrease);
        for (int i = 0; i < fit.Adjustments.Count; i++) output.AddFigure("fit", $"adjustment[{i}]", fit.Adjustments[i]);
        output.AddFigure("fit", "stopReason", fit.StopReason);
        output.AddFigure("fit", "epsilonDeg", fit.EpsilonDeg);
        output.AddFigure("fit", "steps", (long)fit.History.Count);
        output.AddFigure("fit", "objective", fit.Objective);
        output.AddFigure("fit", "fairness", fit.Fairness);
        output.AddFigure("fit", "shapeRmsM", fit.Shape.Rms);
        output.AddFigure("fit", "shapeMaxM", fit.Shape.Max);
        output.AddFigure("fit", "maxDevelopabilityRad", fit.Residuals.MaxDevelopability);
        output.AddFigure("fit", "maxDevelopabilityExcessRad", fit.Residuals.MaxDevelopabilityExcess);
        output.AddFigure("fit", "maxKawasakiRad", fit.Residuals.MaxKawasaki);
        output.AddFigure("fit", "maxPlanarityScaled", fit.Residuals.MaxPlanarity);
        // The fitter only sees the fold-angle bounds of families that constrain fold signs; the figure also
        // takes the folds of the fitted geometry that miss the bounds, so it never reads 0 while one does.
        var folds = FoldRoles.Bounds(mesh, Math.Max(job.Fitting.Bounds.MinFoldAngleDeg, 0), job.Fitting.Bounds.MaxFoldAngleDeg, job.Fitting.Tolerance);
        output.AddFigure("fit", "maxBoundViolation", Math.Max(fit.Residuals.MaxBoundViolation, folds.MaxViolationRad));
        output.AddFigure("fit", "rolesFromFittedGeometry", (long)stage.RolesChanged);
        output.AddFigure("fit", "linearSolver", fit.Solver.Method);
        output.AddFigure("fit", "linearSolves", (long)fit.Solver.LinearSolves);
        output.AddFigure("fit", "linearIterations", fit.Solver.LinearIterations);
        output.AddFigure("fit", "unknowns", (long)fit.Solver.Unknowns);
        output.AddFigure("fit", "normalMatrixNonZeros", (long)fit.Solver.NonZeros);
        output.AddFigure("fit", "starts", (long)fit.Spread.Objectives.Length);
        output.AddFigure("fit", "bestStart", (long)fit.Spread.BestStart);
        output.AddFigure("fit", "startObjectiveRange", fit.Spread.Range);
        if (stage.Front.Count > 0)
        {
            output.AddFigure("pareto", "points", (long)stage.Front.Count);
            for (int i = 0; i < stage.Front.Count; i++)
            {
                var p = stage.Front[i];
                output.AddFigure("pareto", $"epsilonDeg[{i}]", p.EpsilonDeg);
                output.AddFigure("pareto", $"shapeRmsM[{i}]", p.ShapeRms);
                output.AddFigure("pareto", $"converged[{i}]", p.Converged);
            }
            output.AddFile("pareto.csv", ParetoCsvWriter.Write(stage.Front));
        }
        if (job.Outputs.Obj)
            output.AddFile("folded.obj", FoldedModelObjWriter.Write(mesh, $"Tessel folded model for job {job.Name}: {mesh.Family}, metres, z up"));
        if (job.Outputs.Stl)
            output.AddFile("folded.stl", StlWriter.ToBytes(mesh, job.Fabrication.Scale));
    }

    public static void AddChecks(BuildOutput output, Job job, ChecksStageResult checks, double strainLimit)
    {
        var r = checks.Rigidity;
        output.AddFigure("checks", "degreesOfFreedom", (long)r.DegreesOfFreedom);
        output.AddFigure("checks", "rank", (long)r.Rank);
        output.AddFigure("checks", "rankTolerance", r.RankTolerance);
        output.AddFigure("checks", "rankGapRatio", r.GapRatio);
        output.AddFigure("checks", "rankMethod", r.Method);
        var p = checks.Path;
        output.AddFigure("checks", "pathReachedNearFlat", p.ReachedNearFlat);
        output.AddFigure("checks", "pathLowestProgress", p.LowestProgress);
        output.AddFigure("checks", "pathHighestProgress", p.HighestProgress);
        output.AddFigure("checks", "pathMaxBarStrain", p.MaxBarStrain);
        output.AddFigure("checks", "pathMaxPlanarity", p.MaxPlanarityResidual);
        output.AddFigure("checks", "pathStopTowardFlat", p.StopTowardFlat);
        output.AddFigure("checks", "pathStopTowardFolded", p.StopTowardFolded);
        output.AddFigure("checks", "pathKeyframes", (long)p.Keyframes.Count);
        output.AddFigure("checks", "collisions", (long)checks.CollisionCount);
        output.AddFigure("checks", "flatMaxEdgeStrain", checks.Flat.EdgeStrain.Length == 0 ? 0 : checks.Flat.EdgeStrain.Max(Math.Abs));
        output.AddFigure("checks", "flatMaxFacetStrain", checks.Strain.MaxStrain);
        output.AddFigure("checks", "strainLimit", strainLimit);
        output.AddFigure("checks", "facetsOverStrainLimit", (long)checks.Strain.FacetsOverLimit.Length);
        output.AddFigure("checks", "shortestCreaseMm", checks.ShortestCreaseMm);
        output.AddFigure("checks", "creasesBelowMinimumLength", (long)checks.ShortCreaseCount);
        if (checks.FoldBounds is { } fb)
        {
            output.AddFigure("checks", "folds", (long)fb.Folds);
            output.AddFigure("checks", "flatCreases", (long)fb.FlatCreases);
            output.AddFigure("checks", "foldsBelowMinFoldAngle", (long)fb.BelowMinimum);
            output.AddFigure("checks", "foldsAboveMaxFoldAngle", (long)fb.AboveMaximum);
            output.AddFigure("checks", "maxFoldAngleBoundViolationDeg", fb.MaxViolationRad * 180 / Math.PI);
        }
        if (checks.Envelope is { } envelope)
        {
            output.AddFigure("checks", "envelopeMinDefectRad", envelope.MinDefect);
            output.AddFigure("checks", "envelopeMaxDefectRad", envelope.MaxDefect);
            output.AddFigure("checks", "envelopeTotalDefectRad", envelope.TotalDefect);
            output.AddFigure("checks", "envelopePositiveVertices", (long)envelope.Positive);
            output.AddFigure("checks", "envelopeInteriorVertices", (long)envelope.Interior);
        }
        output.AddFile("fold-angles.csv", FoldAngleCsvWriter.Write(checks.FoldAngles));
        if (job.Outputs.Svg)
            output.AddFile("crease-pattern.svg", CreasePatternSvgWriter.Write(checks.Flat, job.Fabrication.Scale, job.Name, SheetStage.StylesFor(job)));
    }

    public static void AddSheets(BuildOutput output, Job job, SheetStageResult sheets)
    {
        var fig = sheets.Layout.Figures;
        output.AddFigure("sheets", "material", sheets.Settings.Material.Name);
        output.AddFigure("sheets", "sheetSize", $"{sheets.Settings.Sheet.Name} {sheets.Settings.Sheet.WidthMm.ToString("0.#", Inv)} x {sheets.Settings.Sheet.HeightMm.ToString("0.#", Inv)} mm");
        output.AddFigure("sheets", "sheets", (long)fig.SheetCount);
        output.AddFigure("sheets", "parts", (long)fig.PartCount);
        output.AddFigure("sheets", "seams", (long)sheets.Layout.Seams.Length);
        for (int i = 0; i < fig.Utilisation.Length; i++) output.AddFigure("sheets", $"utilisation[{i + 1}]", fig.Utilisation[i]);
        output.AddFigure("sheets", "totalCutLengthMm", fig.TotalCutLengthMm);
        output.AddFigure("sheets", "outlineCutLengthMm", fig.OutlineCutLengthMm);
        output.AddFigure("sheets", "scoreLengthMm", fig.ScoreLengthMm);
        output.AddFigure("sheets", "backScoreLengthMm", fig.BackScoreLengthMm);
        output.AddFigure("sheets", "perforationCutLengthMm", fig.PerforationCutLengthMm);
        output.AddFigure("sheets", "travelLengthMm", fig.TravelLengthMm);
        output.AddFigure("sheets", "estimatedLaserSeconds", fig.EstimatedLaserSeconds);
        output.AddFigure("sheets", "narrowFacets", (long)fig.NarrowFacetCount);
        output.AddFigure("sheets", "shortPerforations", (long)fig.ShortPerforationCount);
        output.AddFigure("sheets", "overlappingTabs", (long)fig.OverlappingTabCount);
        for (int i = 0; i < fig.Warnings.Length; i++) output.AddFigure("sheets", $"warning[{i}]", fig.Warnings[i]);

        // A sheet too large for a 300 dpi raster is written at a lower resolution (the job loader has
        // refused sheets that no resolution fits).
        var options = new SheetWriterOptions(job.Name, SheetLimits.PngDpi(job.Fabrication.Sheet.WidthMm, job.Fabrication.Sheet.HeightMm) ?? SheetLimits.PreferredPngDpi);
        foreach (var format in SheetFormats.All)
        {
            if (!format.IsWanted(job.Outputs)) continue;
            var writer = format.CreateWriter(options);
            var styles = format.ForPrinting ? sheets.PrintStyles : sheets.Styles;
            foreach (var (path, onFile) in format.Files(sheets.Cover, sheets.Sheets))
                output.AddFile(path, SheetWriterBytes.Of(writer, onFile, styles));
        }
    }

    /// <summary>Signed distance of each vertex from the surface its layer belongs on (metres).</summary>
    public static double[] VertexDeviations(CreaseMesh mesh, ITargetSurface target, double layerOffset)
    {
        var d = new double[mesh.VertexCount];
        for (int v = 0; v < d.Length; v++)
        {
            if (mesh.Layers[v] == VertexLayer.Free) continue;
            double sd = target.ClosestPoint(mesh.Vertex(v)).SignedDistance;
            d[v] = mesh.Layers[v] == VertexLayer.Top ? sd : sd + layerOffset;
        }
        return d;
    }
}
