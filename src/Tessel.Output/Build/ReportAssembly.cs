using System.Globalization;
using Tessel.Core.Jobs;
using Tessel.Core.Pipeline;
using Tessel.Core.Sheets;
using Tessel.Core.Targets;
using Tessel.Output.Report;

namespace Tessel.Output.Build;

/// <summary>Gathers the stage results into the report's plain-data model.</summary>
public static class ReportAssembly
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static ReportModel Build(Job job, ITargetSurface target, TessellationStageResult tessellation,
        FitStageResult fit, ChecksStageResult checks, SheetStageResult? sheets, IReadOnlyList<string> warnings)
    {
        var mesh = fit.Fit.Mesh;
        var deviation = ModelOutputs.VertexDeviations(mesh, target, tessellation.Pattern!.LayerOffset);
        var model = ReportModel.FromMesh(job.Name, job.Fabrication.Scale, mesh, checks.Flat.Positions, deviation);
        var f = fit.Fit;
        var rows = new List<SummaryRow>
        {
            new("Target", target.Description),
            new("Family", $"{mesh.Family}: {mesh.VertexCount} vertices, {mesh.FaceCount} facets"),
            new("Scale", job.Fabrication.ScaleReason is { } why ? $"auto, {why}" : $"1:{job.Fabrication.Scale.ToString("0.###", Inv)}"),
            new("Fit", $"{FitStage.Verdict(f)} ({Wording.StopDetail(f.StopReason)}), {Wording.Count(f.History.Count, "step")}"),
            new("Shape error RMS / max", $"{Mm(f.Shape.Rms)} / {Mm(f.Shape.Max)} mm full scale"),
            new("Developability residual", $"{f.Residuals.MaxDevelopability.ToString("0.##E+0", Inv)} rad (epsilon {f.EpsilonDeg.ToString("0.###", Inv)} deg)"),
            new("Kawasaki residual", $"{f.Residuals.MaxKawasaki.ToString("0.##E+0", Inv)} rad"),
            new("Planarity residual", f.Residuals.MaxPlanarity.ToString("0.##E+0", Inv)),
            new("Degrees of freedom", $"{checks.Rigidity.DegreesOfFreedom} (rank gap {(double.IsFinite(checks.Rigidity.GapRatio) ? checks.Rigidity.GapRatio.ToString("0.##E+0", Inv) : "unbounded: the dropped singular values are exactly 0")})"),
            new("Folding path", $"{(checks.Path.ReachedNearFlat ? "reaches near-flat" : "does not reach near-flat")}, drift {checks.Path.MaxBarStrain.ToString("0.##E+0", Inv)}"),
            new("Panel collisions", checks.CollisionCount.ToString(Inv)),
            new("Flat-layout strain", $"{(checks.Strain.MaxStrain * 100).ToString("0.####", Inv)} % (limit {(checks.Strain.StrainLimit * 100).ToString("0.##", Inv)} %)"),
        };
        if (checks.Envelope is { } envelope)
            rows.Add(new("Envelope curvature (angle defects)", $"{envelope.MinDefect.ToString("0.##E+0", Inv)} to {envelope.MaxDefect.ToString("0.##E+0", Inv)} rad, positive at {envelope.Positive} of {envelope.Interior} interior vertices"));
        if (sheets is not null)
        {
            var sf = sheets.Layout.Figures;
            rows.Add(new("Sheets", $"{sf.SheetCount} x {sheets.Settings.Sheet.Name}, {Wording.Count(sf.PartCount, "part")}, {Wording.Count(sheets.Layout.Seams.Length, "seam")}"));
            rows.Add(new("Cut / score / perforation", $"{M(sf.TotalCutLengthMm)} / {M(sf.ScoreLengthMm + sf.BackScoreLengthMm)} / {M(sf.PerforationCutLengthMm)} m"));
            rows.Add(new("Laser time (estimate)", $"{(sf.EstimatedLaserSeconds / 60).ToString("0.#", Inv)} min"));
        }
        var keyframes = checks.Path.Keyframes
            .Select(k => new FoldKeyframe(k.Progress, AlignToFitted(k.Positions, mesh.Positions))).ToArray();
        return model with
        {
            Description = job.Description ?? "",
            ParetoFront = [.. fit.Front],
            ChosenEpsilonDeg = fit.Front.Count > 0 ? f.EpsilonDeg : null,
            ParetoNote = ParetoNote(job, fit),
            Convergence = ConvergenceSteps(f.History),
            Keyframes = keyframes,
            Summary = rows.ToArray(),
            Warnings = warnings.ToArray(),
            Cautions = SheetAnnotations.CautionParagraphs.ToArray(),
            Sheets = sheets?.Sheets.ToArray() ?? [],
        };
    }

    /// <summary>The fit's history as the report plots it: steps numbered in the order they ran. A fit that
    /// continued, refitted or restarted joins several solver runs, each numbering its own steps from 0;
    /// plotted by those numbers the runs lay over each other and the highest number is not the last step.</summary>
    internal static ConvergenceStep[] ConvergenceSteps(IReadOnlyList<Tessel.Core.Fitting.FitIteration> history) =>
        history.Select((h, i) => new ConvergenceStep(i, h.Objective,
            Math.Max(Math.Max(h.MaxPlanarity, h.MaxKawasaki), Math.Max(h.MaxDevelopabilityExcess, h.MaxBoundViolation)),
            StartsRun: i > 0 && h.Index <= history[i - 1].Index)).ToArray();

    /// <summary>Why a sweep point can differ from the fit used for the sheets at the same epsilon: the
    /// sweep runs one start from the plain drape and warm-starts each later epsilon from the previous
    /// result, while the fit for the sheets keeps the best of the job's starts from perturbed drapes. The
    /// problem is not convex, so different starts settle in different local optima.</summary>
    private static string ParetoNote(Job job, FitStageResult fit)
    {
        if (fit.Front.Count == 0) return "";
        var f = fit.Fit;
        string note = $"Each point is a separate single-start fit, warm-started from the previous epsilon; the fit used for the sheets is the best of {Wording.Count(job.Fitting.Starts, "start")} from perturbed drapes, so at the same epsilon it can settle in another local optimum.";
        var same = fit.Front.FirstOrDefault(p => Math.Abs(p.EpsilonDeg - f.EpsilonDeg) < 1e-12);
        if (same is not null)
            note += $" At epsilon {f.EpsilonDeg.ToString("0.###", Inv)} deg the sweep reached {Mm(same.ShapeRms)} mm RMS{(same.Converged ? "" : " (not converged)")}, the fit used for the sheets {Mm(f.Shape.Rms)} mm.";
        return note;
    }

    private static string Mm(double metres) => (metres * 1000).ToString("0.##", Inv);
    private static string M(double mm) => (mm / 1000).ToString("0.##", Inv);

    /// <summary>Keyframes come in the frame of the folding simulation's reference panel; move each so its
    /// centroid matches the fitted model's, so the viewer's camera stays on the model.</summary>
    private static double[] AlignToFitted(double[] positions, double[] fitted)
    {
        int n = positions.Length / 3;
        double dx = 0, dy = 0, dz = 0;
        for (int v = 0; v < n; v++)
        {
            dx += fitted[3 * v] - positions[3 * v];
            dy += fitted[3 * v + 1] - positions[3 * v + 1];
            dz += fitted[3 * v + 2] - positions[3 * v + 2];
        }
        dx /= n; dy /= n; dz /= n;
        var moved = new double[positions.Length];
        for (int v = 0; v < n; v++)
        {
            moved[3 * v] = positions[3 * v] + dx;
            moved[3 * v + 1] = positions[3 * v + 1] + dy;
            moved[3 * v + 2] = positions[3 * v + 2] + dz;
        }
        return moved;
    }
}
