using Tessel.Core.Checks;
using Tessel.Core.Fitting;
using Tessel.Core.LinearAlgebra;
using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Pipeline;

/// <summary>The chosen fit and, when a sweep ran, the shape-error / developability trade-off.</summary>
/// <param name="Fit">Fit at the job's epsilon (best of the starts).</param>
/// <param name="Front">Pareto points of the sweep in epsilon order; empty without a sweep.</param>
/// <param name="RolesChanged">Creases whose role the fitted geometry changed from the generator's (see <see cref="FoldRoles"/>).</param>
/// <param name="ShortCreases">Creases of the fit shorter than the job's minimum crease at its fixed scale
/// (<see cref="FitSettings.MinEdgeLengthM"/>; 0 with an automatic scale).</param>
public sealed record FitStageResult(FitResult Fit, IReadOnlyList<ParetoPoint> Front, int RolesChanged = 0, int ShortCreases = 0);

/// <summary>Third stage: draped pattern -> fitted pattern by the epsilon-constraint method.</summary>
public static class FitStage
{
    public static FitSettings SettingsFor(Job job) => new()
    {
        EpsilonDeg = job.Fitting.EpsilonDeg,
        Seed = job.Fitting.Seed ?? job.Seed,
        Starts = job.Fitting.Starts,
        MaxIterations = job.Fitting.MaxIterations,
        ConstraintTolerance = job.Fitting.Tolerance,
        MinSectorAngleDeg = job.Fitting.Bounds.MinSectorAngleDeg,
        MaxSectorAngleDeg = job.Fitting.Bounds.MaxSectorAngleDeg,
        MinFoldAngleDeg = Math.Max(job.Fitting.Bounds.MinFoldAngleDeg, 0),
        MaxFoldAngleDeg = job.Fitting.Bounds.MaxFoldAngleDeg,
        DrawnFlatBelowDeg = FoldRoles.FlatToleranceDeg,
        // With an automatic scale the scale is chosen after the fit, from facets at least ten times the
        // material's thickness, so the shortest crease is not a bound of the fit.
        MinEdgeLengthM = job.Fabrication.AutoScale ? 0 : job.Fitting.Bounds.MinEdgeLengthMm / 1000 * job.Fabrication.Scale,
    };

    /// <param name="drapeOn">Drapes the pattern on another surface, for the fit's continuation when the
    /// fit from the drape is not buildable (<see cref="TessellationStageResult.DrapeOn"/>); null: no continuation.</param>
    /// <param name="coarser">The same sheet with fewer cells, for the coarse start of large sheets
    /// (<see cref="TessellationStageResult.Coarser"/>); null: the fit starts from the drape.</param>
    public static FitStageResult Run(Job job, GeneratedPattern pattern, ITargetSurface target, ProgressReporter progress,
        Func<ITargetSurface, GeneratedPattern>? drapeOn = null, CoarserSheets? coarser = null)
    {
        var settings = SettingsFor(job);
        progress.Stage("fit", $"{settings.Starts} start(s), epsilon {settings.EpsilonDeg:0.###} deg, {pattern.Mesh.VertexCount * 3} unknowns");
        int shortInDrape = CreaseLengths.ShorterThan(pattern.Mesh, settings.MinEdgeLengthM);
        if (shortInDrape > 0)
            progress.Step($"{shortInDrape} crease(s) are already shorter than fitting.bounds.minEdgeLengthMm in the drape; they may not shrink further (fewer cells or a larger model scale lengthens them)");
        FitResult fit;
        try
        {
            fit = ContinuationFitter.Fit(pattern, target, progress.Observe(settings), drapeOn, EpsilonConstraintFitter.DefaultSolver, progress.Step, coarser);
        }
        catch (Exception e) when (Breakdown(e) is { } cause)
        {
            throw new FitBreakdownError($"the fit broke down numerically ({cause.Message}); check the target's size and units and the tessellation's cell size", e);
        }
        if (!fit.Mesh.Positions.All(double.IsFinite))
            throw new FitBreakdownError("the fit produced non-finite vertex positions; check the target's size and units and the tessellation's cell size", new ArithmeticException());
        // Roles come from the fitted geometry, whatever the generator assumed: the sheets must fold what the fit made.
        var relabelled = FoldRoles.FromGeometry(fit.Mesh);
        // Against the generator's roles: a refit that held fold bands carries roles of its own.
        int changed = FoldRoles.Changed(pattern.Mesh, relabelled);
        fit = fit with { Mesh = relabelled };
        progress.Step($"{Verdict(fit)} after {fit.History.Count} steps; shape RMS {fit.Shape.Rms * 1000:0.###} mm, largest constraint residual {fit.Residuals.MaxConstraintViolation:0.###E+0}");
        if (changed > 0) progress.Step($"{changed} crease role(s) taken from the fitted fold angles instead of the generator's");

        var front = new List<ParetoPoint>();
        var sweep = job.Fitting.EpsilonSweepDeg;
        if (sweep.Length > 0)
        {
            var order = sweep.Distinct().OrderBy(e => e).ToArray();
            progress.Step($"sweeping epsilon over {order.Length} values");
            try
            {
                front.AddRange(ParetoSweep.Run(pattern, target, progress.Observe(settings with { Starts = 1 }), order, EpsilonConstraintFitter.DefaultSolver()).Front);
            }
            catch (Exception e) when (Breakdown(e) is { } cause)
            {
                throw new FitBreakdownError($"the epsilon sweep broke down numerically ({cause.Message})", e);
            }
            foreach (var p in front)
                progress.Step($"  epsilon {p.EpsilonDeg:0.###} deg: shape RMS {p.ShapeRms * 1000:0.###} mm{(p.Converged ? "" : " (not converged)")}");
        }
        // As the fit holds the bound: to a part in a billion.
        return new FitStageResult(fit, front, changed, CreaseLengths.ShorterThan(fit.Mesh, settings.MinEdgeLengthM * (1 - 1e-9)));
    }

    /// <summary>One phrase: buildable and finished, buildable with room to improve, or not buildable.</summary>
    public static string Verdict(FitResult fit) =>
        !fit.Buildable ? $"NOT buildable ({Wording.StopDetail(fit.StopReason)})"
        : fit.Converged ? "buildable and finished"
        : double.IsNaN(fit.LastRelativeDecrease) ? $"buildable; the shape could still improve (the step limit ended the fit before its shape phase finished a round; {fit.History.Count} steps used)"
        : $"buildable; the shape could still improve (its last round still lowered the objective by {fit.LastRelativeDecrease * 100:0.##} %; {fit.History.Count} steps used)";

    /// <summary>The numerical failure inside <paramref name="e"/> (parallel starts wrap it), or null.</summary>
    private static Exception? Breakdown(Exception e) => e switch
    {
        AggregateException a => a.InnerExceptions.Select(Breakdown).FirstOrDefault(x => x is not null),
        NotPositiveDefiniteException or ArithmeticException => e,
        _ => null,
    };
}
