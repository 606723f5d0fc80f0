using System.Globalization;
using System.Text;
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
using FitPareto = Tessel.Core.Fitting.ParetoPoint;

namespace Tessel.Output.Build;

/// <summary>Turns the results of the model stages (fit, checks, sheets) into files and figures.</summary>
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
        var folds = FoldRoles.Bounds(mesh, Math.Max(job.Fitting.Bounds.MinFoldAngleDeg, 0), job.Fitting.Bounds.MaxFoldAngleDeg);
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
            output.AddFile("pareto.csv", ParetoCsv(stage.Front));
        }
        if (job.Outputs.Obj)
            output.AddFile("folded.obj", FoldedObj(mesh, $"Tessel folded model for job {job.Name}: {mesh.Family}, metres, z up"));
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
        output.AddFigure("checks", "shortestEdgeMm", checks.ShortestEdgeMm);
        output.AddFigure("checks", "edgesBelowMinimumLength", (long)checks.ShortEdgeCount);
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
        output.AddFile("fold-angles.csv", Encoding.UTF8.GetBytes(Core.Checks.FoldAngleTable.ToCsv(checks.FoldAngles)));
        if (job.Outputs.Svg)
            output.AddFile("crease-pattern.svg", CreasePatternSvg(checks.Flat, job));
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

        foreach (string format in SheetWriterFormats.Names)
        {
            bool wanted = format switch { "svg" => job.Outputs.Svg, "dxf" => job.Outputs.Dxf, "pdf" => job.Outputs.Pdf, _ => job.Outputs.Png };
            if (!wanted) continue;
            // A sheet too large for a 300 dpi raster is written at a lower resolution (the job loader has
            // refused sheets that no resolution fits).
            var writer = SheetWriterFormats.Create(format, SheetLimits.PngDpi(job.Fabrication.Sheet.WidthMm, job.Fabrication.Sheet.HeightMm) ?? SheetLimits.PreferredPngDpi);
            // Files for a printer get the print weights; files for a cutter keep hairlines.
            var styles = format is "pdf" or "png" ? sheets.PrintStyles : sheets.Styles;
            if (writer.OneFilePerSheet)
            {
                if (format != "dxf") output.AddFile($"sheets/cover{writer.FileExtension}", Bytes(writer, [sheets.Cover], styles));
                foreach (var sheet in sheets.Sheets)
                    output.AddFile($"sheets/{SheetFileName(sheet)}{writer.FileExtension}", Bytes(writer, [sheet], styles));
            }
            else
            {
                var pdf = new PdfSheetWriter { Title = $"Tessel sheets: {job.Name}" };
                output.AddFile("sheets/sheets.pdf", Bytes(pdf, [sheets.Cover, .. sheets.Sheets], styles));
            }
        }
    }

    /// <summary>"sheet-01" for a front job, "sheet-01-back" for the mirrored back job.</summary>
    public static string SheetFileName(Sheet sheet) => SheetFiles.BaseName(sheet);

    private static byte[] Bytes(ISheetWriter writer, IReadOnlyList<Sheet> sheets, LineStyleTable styles)
    {
        using var ms = new MemoryStream();
        writer.Write(sheets, styles, ms);
        return ms.ToArray();
    }

    private static byte[] ParetoCsv(IReadOnlyList<FitPareto> front)
    {
        var sb = new StringBuilder("epsilon_deg,shape_rms_m,shape_max_m,objective,max_developability_rad,max_kawasaki_rad,max_planarity,converged\n");
        foreach (var p in front)
            sb.Append(string.Join(",", new[] { p.EpsilonDeg, p.ShapeRms, p.ShapeMax, p.Objective, p.MaxDevelopability, p.MaxKawasaki, p.MaxPlanarity }
                .Select(v => v.ToString("R", Inv)))).Append(',').Append(p.Converged ? "true" : "false").Append('\n');
        return Encoding.UTF8.GetBytes(sb.ToString());
    }

    /// <summary>OBJ with the panels as faces in one group and the creases as polylines (l) in a group per role.</summary>
    private static byte[] FoldedObj(CreaseMesh mesh, string comment)
    {
        var faces = ObjWriter.Write(mesh.Positions, mesh.Faces, [new ObjWriter.Group("panels", Enumerable.Range(0, mesh.FaceCount).ToArray())], comment);
        var sb = new StringBuilder(Encoding.UTF8.GetString(faces));
        foreach (var role in new[] { CreaseRole.Mountain, CreaseRole.Valley, CreaseRole.Flat, CreaseRole.Boundary })
        {
            var edges = Enumerable.Range(0, mesh.EdgeCount).Where(e => mesh.EdgeRoles[e] == role).ToArray();
            if (edges.Length == 0) continue;
            sb.Append("g ").Append(role.ToString().ToLowerInvariant()).Append('\n');
            foreach (int e in edges)
                sb.Append("l ").Append(mesh.EdgeVertices[2 * e] + 1).Append(' ').Append(mesh.EdgeVertices[2 * e + 1] + 1).Append('\n');
        }
        return Encoding.UTF8.GetBytes(sb.ToString());
    }

    /// <summary>The whole flat crease pattern at model scale on one true-size sheet with a 10 mm border:
    /// boundary as cut, mountain and valley in their own layers.</summary>
    /// <summary>Narrowest legend strip of the crease-pattern drawing (the title, print check and legend
    /// blocks side by side need about this much at the sheets' text height).</summary>
    private const double MinimumLegendWidthMm = 240;

    private static byte[] CreasePatternSvg(FlatPattern flat, Job job)
    {
        double k = 1000.0 / job.Fabrication.Scale, border = 10;
        // Turned onto its minimum-area rectangle, wider than tall, as the sheets turn their parts.
        var points = Enumerable.Range(0, flat.VertexCount).Select(flat.Vertex).ToArray();
        var box = MinimumAreaRectangle.Of(MinimumAreaRectangle.ConvexHull(points));
        double angle = box.Width >= box.Height ? box.Angle : box.Angle + Math.PI / 2;
        var turned = points.Select(p => p.Rotated(angle)).ToArray();
        double minX = turned.Min(p => p.X), maxX = turned.Max(p => p.X), minY = turned.Min(p => p.Y), maxY = turned.Max(p => p.Y);
        Vec2 At(int v) { var p = turned[v]; return new Vec2((p.X - minX) * k + border, (maxY - p.Y) * k + border); }
        var lines = new List<SheetLine>();
        for (int e = 0; e < flat.EdgeCount; e++)
        {
            var cls = flat.Role(e) switch
            {
                CreaseRole.Mountain => LineClass.Mountain,
                CreaseRole.Valley => LineClass.Valley,
                CreaseRole.Boundary => LineClass.CutOutline,
                CreaseRole.Flat => LineClass.FlatCrease,
                _ => (LineClass?)null,
            };
            if (cls is null) continue;
            var (a, b) = flat.Edge(e);
            lines.Add(new SheetLine(cls.Value, [At(a), At(b)]));
        }
        // A legend strip under the pattern (title, print check, line legend), at least wide enough for it.
        var styles = SheetStage.StylesFor(job);
        var content = new AnnotationContent(job.Name, 1, $"1:{job.Fabrication.Scale:0.###}", IncludeCautions: false,
            Heading: "CREASE PATTERN OF THE WHOLE MODEL - A DRAWING, NOT A SHEET TO CUT");
        double width = Math.Max((maxX - minX) * k + 2 * border, MinimumLegendWidthMm + 2 * border);
        var classes = lines.Select(l => l.Class).Distinct().ToArray();
        double strip = SheetAnnotations.RequiredStripHeight(width - 2 * border, content, styles, classes);
        double patternBottom = (maxY - minY) * k + border;
        var sheet = new Sheet(1, width, patternBottom + border + strip + border, lines.ToArray());
        sheet = SheetAnnotations.AddToStrip(sheet, new SheetRegion(border, patternBottom + border, width - 2 * border, strip), content, styles).Sheet;
        return Bytes(new SvgSheetWriter(), [sheet], styles);
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
