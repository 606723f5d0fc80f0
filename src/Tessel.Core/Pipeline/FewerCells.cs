using Tessel.Core.Jobs;

namespace Tessel.Core.Pipeline;

/// <summary>The job, tessellation and fit the build goes on with, and every change made to the job's cells.</summary>
public sealed record FewerCellsOutcome(Job Job, TessellationStageResult Tessellation, FitStageResult Fit, IReadOnlyList<string> Changes);

/// <summary>What a buildable fit still lacks that fewer cells, whose creases start longer and whose facets are
/// larger, can give.</summary>
/// <param name="What">Says what is wrong, after "the fit with 12 x 12 cells" ("left 4 crease(s) under ...").</param>
/// <param name="ForMoreCells">What the user can change to keep more cells.</param>
public sealed record CellsShortfall(string What, string ForMoreCells);

/// <summary>The last repair of a buildable fit that still misses the minimum crease
/// (<c>fitting.bounds.minEdgeLengthMm</c>, after the refits of <see cref="FitStageResult.ShortCreases"/>) or whose
/// flat layout overlaps itself: the tessellation and the fit run again with fewer cells.</summary>
public static class FewerCells
{
    /// <summary>Rounds at most (each a whole tessellation and fit), and the share of the cells each keeps
    /// (at least one fewer each way).</summary>
    public const int MaxRounds = 3;
    public const double Share = 0.85;

    /// <summary>The shortfall of creases under the minimum that no refit lengthened, or null.</summary>
    public static CellsShortfall? ShortCreases(FitStageResult fit) => fit.ShortCreases > 0
        ? new($"left {fit.ShortCreases} crease(s) under fitting.bounds.minEdgeLengthMm and no refit lengthened them", "choose a larger model (a smaller fabrication.scale)")
        : null;

    /// <param name="shortfall">What the fit still lacks, or null when it lacks nothing.</param>
    /// <param name="rebuild">Runs the tessellation and fit stages for a job with other cells; returns the job
    /// as built (the tessellation stage may lower the cells further), its tessellation and its fit.</param>
    /// <param name="changes">The cell changes so far (the tessellation stage's own), kept first.</param>
    public static FewerCellsOutcome UntilItHolds(Job job, TessellationStageResult tessellation, FitStageResult fit,
        IEnumerable<string> changes, Func<FitStageResult, CellsShortfall?> shortfall,
        Func<Job, (Job Job, TessellationStageResult Tessellation, FitStageResult Fit)> rebuild, ProgressReporter progress)
    {
        var said = new List<string>(changes);
        for (int round = 0; round < MaxRounds && fit.Fit.Buildable && shortfall(fit) is { } lacks; round++)
        {
            var spec = job.Tessellation;
            var coarser = job with { Tessellation = spec with { CellsX = Fewer(spec.CellsX), CellsY = Fewer(spec.CellsY), CellSize = spec.CellSize / Share } };
            string before = CellsOf(spec), after = CellsOf(coarser.Tessellation);
            if (after == before) break;
            progress.Step($"the fit {lacks.What}; rebuilding with {after} instead of {before}");
            var built = rebuild(coarser);
            // A rebuild that is not buildable is no improvement: the result before it is kept, shortfall and all.
            if (!built.Fit.Fit.Buildable) break;
            said.Add($"the fit with {before} {lacks.What}: rebuilt with {CellsOf(built.Job.Tessellation)}; for more cells {lacks.ForMoreCells}");
            if (built.Tessellation.LengthRepair is { } further) said.Add(further.Message);
            (job, tessellation, fit) = built;
        }
        return new FewerCellsOutcome(job, tessellation, fit, said);
    }

    /// <summary>The count a round keeps, or null where the job gives a cell size.</summary>
    public static int? Fewer(int? count) => count is int n ? Math.Max(2, Math.Min(n - 1, (int)Math.Floor(n * Share))) : null;

    private static string CellsOf(TessellationSpec s) => s.CellsX is int x && s.CellsY is int y
        ? $"{x} x {y} cells" : FormattableString.Invariant($"cells of {s.CellSize:0.###} (tessellation.cellSize)");
}
