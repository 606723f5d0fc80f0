using Tessel.Core.Fitting;
using Tessel.Core.Fitting.Sparse;
using Tessel.Core.Jobs;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Pipeline;

/// <summary>The chosen fit and, when a sweep ran, the shape-error / developability trade-off.</summary>
/// <param name="Fit">Fit at the job's epsilon (best of the starts).</param>
/// <param name="Front">Pareto points of the sweep in epsilon order; empty without a sweep.</param>
public sealed record FitStageResult(FitResult Fit, IReadOnlyList<ParetoPoint> Front);

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
    };

    public static FitStageResult Run(Job job, GeneratedPattern pattern, ITargetSurface target, ProgressReporter progress)
    {
        var settings = SettingsFor(job);
        progress.Stage("fit", $"{settings.Starts} start(s), epsilon {settings.EpsilonDeg:0.###} deg, {pattern.Mesh.VertexCount * 3} unknowns");
        FitResult fit;
        try
        {
            fit = MultiStartFitter.Fit(pattern, target, progress.Observe(settings), EpsilonConstraintFitter.DefaultSolver);
        }
        catch (Exception e) when (Breakdown(e) is { } cause)
        {
            throw new FitBreakdownError($"the fit broke down numerically ({cause.Message}); check the target's size and units and the tessellation's cell size", e);
        }
        if (!fit.Mesh.Positions.All(double.IsFinite))
            throw new FitBreakdownError("the fit produced non-finite vertex positions; check the target's size and units and the tessellation's cell size", new ArithmeticException());
        progress.Step($"{(fit.Converged ? "converged" : "NOT converged")} ({Wording.StopDetail(fit.StopReason)}) after {fit.History.Count} steps; shape RMS {fit.Shape.Rms * 1000:0.###} mm, max constraint residual {fit.Residuals.MaxConstraintViolation:0.###E+0}");

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
        return new FitStageResult(fit, front);
    }

    /// <summary>The numerical failure inside <paramref name="e"/> (parallel starts wrap it), or null.</summary>
    private static Exception? Breakdown(Exception e) => e switch
    {
        AggregateException a => a.InnerExceptions.Select(Breakdown).FirstOrDefault(x => x is not null),
        NotPositiveDefiniteException or ArithmeticException => e,
        _ => null,
    };
}
