using Tessel.Core.Jobs;
using Tessel.Core.Pipeline;
using Xunit;

namespace Tessel.Tests.Pipeline;

/// <summary>The rebuild with fewer cells when a fit keeps creases under the minimum crease or its flat layout
/// overlaps itself, driven by a stand-in for the tessellation and fit stages that says what is still wrong at
/// each count.</summary>
public class FewerCellsTests
{
    private static readonly Lazy<(Job Job, TessellationStageResult Tessellation, FitStageResult Fit)> Built = new(() =>
    {
        // A small real build (an invented 3 x 3 Miura canopy) gives the records the stand-in hands back.
        var job = JobLoader.Parse("""{"name":"canopy","target":{"kind":"hyperbolic-paraboloid","c":6,"footprint":{"width":2,"depth":2}},"tessellation":{"family":"miura","cellsX":12,"cellsY":10},"fabrication":{"scale":10}}""",
            "canopy.json", Path.GetTempPath());
        var target = TargetStage.Run(job, null, ProgressReporter.Silent).Target;
        var small = job with { Tessellation = job.Tessellation with { CellsX = 3, CellsY = 3 } };
        var tessellation = TessellationStage.Run(small, target, ProgressReporter.Silent);
        return (job, tessellation, FitStage.Run(small, tessellation.Pattern, target, ProgressReporter.Silent));
    });

    /// <summary>Short creases of a fit with <paramref name="cellsX"/> cells along x: none from <paramref name="holdsAt"/> down.</summary>
    private static (Job, TessellationStageResult, FitStageResult) Rebuild(Job coarser, int holdsAt, List<(int?, int?)> asked)
    {
        asked.Add((coarser.Tessellation.CellsX, coarser.Tessellation.CellsY));
        var fit = Built.Value.Fit with { ShortCreases = coarser.Tessellation.CellsX <= holdsAt ? 0 : 4 };
        return (coarser, Built.Value.Tessellation, fit);
    }

    [Fact]
    public void EachRoundKeeps85PercentOfTheCellsUntilTheCreasesHold()
    {
        var (job, tessellation, fit) = Built.Value;
        Assert.True(fit.Fit.Buildable);
        var asked = new List<(int?, int?)>();
        var outcome = FewerCells.UntilItHolds(job, tessellation, fit with { ShortCreases = 7 }, ["the stage's own change"], FewerCells.ShortCreases,
            j => Rebuild(j, holdsAt: 8, asked), ProgressReporter.Silent);
        // 12 x 10 -> floor(0.85 n), at least one fewer: 10 x 8, then 8 x 6, where the stand-in holds.
        Assert.Equal([(10, 8), (8, 6)], asked);
        Assert.Equal((8, 6), (outcome.Job.Tessellation.CellsX!.Value, outcome.Job.Tessellation.CellsY!.Value));
        Assert.Equal(0, outcome.Fit.ShortCreases);
        Assert.Equal(3, outcome.Changes.Count);
        Assert.Equal("the stage's own change", outcome.Changes[0]);
        Assert.Contains("the fit with 12 x 10 cells left 7 crease(s)", outcome.Changes[1]);
        Assert.Contains("rebuilt with 8 x 6 cells", outcome.Changes[2]);
    }

    [Fact]
    public void ItStopsAfterThreeRoundsAndKeepsTheLastBuildableResult()
    {
        var (job, tessellation, fit) = Built.Value;
        var asked = new List<(int?, int?)>();
        var outcome = FewerCells.UntilItHolds(job, tessellation, fit with { ShortCreases = 7 }, [], FewerCells.ShortCreases,
            j => Rebuild(j, holdsAt: 2, asked), ProgressReporter.Silent);
        Assert.Equal([(10, 8), (8, 6), (6, 5)], asked);
        Assert.Equal(4, outcome.Fit.ShortCreases);
        Assert.Equal(6, outcome.Job.Tessellation.CellsX);
        // Counts never go under 2, and a cell size grows instead.
        Assert.Equal(2, FewerCells.Fewer(2));
        Assert.Equal(2, FewerCells.Fewer(3));
        Assert.Null(FewerCells.Fewer(null));
    }

    [Fact]
    public void AnyShortfallDrivesTheRoundsAndNamesItsOwnFix()
    {
        // A stand-in for a flat layout that overlaps itself down to 10 cells along x.
        var (job, tessellation, fit) = Built.Value;
        var asked = new List<(int?, int?)>();
        CellsShortfall? Overlap(FitStageResult f) => asked.Count == 0 || asked[^1].Item1 > 8
            ? new("has a flat layout that overlaps itself", "try another family or tessellation.foldDepth") : null;
        var outcome = FewerCells.UntilItHolds(job, tessellation, fit, [], Overlap, j => Rebuild(j, holdsAt: 99, asked), ProgressReporter.Silent);
        Assert.Equal([(10, 8), (8, 6)], asked);
        Assert.Equal(8, outcome.Job.Tessellation.CellsX);
        Assert.Equal(["the fit with 12 x 10 cells has a flat layout that overlaps itself: rebuilt with 10 x 8 cells; for more cells try another family or tessellation.foldDepth",
            "the fit with 10 x 8 cells has a flat layout that overlaps itself: rebuilt with 8 x 6 cells; for more cells try another family or tessellation.foldDepth"], outcome.Changes);
    }

    [Fact]
    public void AFitThatHoldsOrIsNotBuildableIsLeftAlone()
    {
        var (job, tessellation, fit) = Built.Value;
        var asked = new List<(int?, int?)>();
        Assert.Same(fit, FewerCells.UntilItHolds(job, tessellation, fit, [], FewerCells.ShortCreases, j => Rebuild(j, 8, asked), ProgressReporter.Silent).Fit);
        var unbuildable = fit with { ShortCreases = 3, Fit = fit.Fit with { Buildable = false } };
        Assert.Same(unbuildable, FewerCells.UntilItHolds(job, tessellation, unbuildable, [], FewerCells.ShortCreases, j => Rebuild(j, 8, asked), ProgressReporter.Silent).Fit);
        Assert.Empty(asked);
    }
}
