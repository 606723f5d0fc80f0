using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Pipeline;
using Tessel.Core.Tessellation;
using Xunit;

namespace Tessel.Tests.Tessellation;

/// <summary>Crease lengths of a draped pattern against the job's minimum crease at model scale, and the
/// coarsening the tessellation stage makes before the fit.</summary>
public class CreaseLengthTests
{
    /// <summary>A unit square split along one diagonal: four outline edges of 1, one crease of sqrt 2.</summary>
    private static CreaseMesh SplitSquare() =>
        new("test", [0, 0, 0, 1, 0, 0, 1, 1, 0, 0, 1, 0], [[0, 1, 2], [0, 2, 3]], new VertexLayer[4], (_, _) => CreaseRole.Valley);

    [Fact]
    public void OnlyInteriorEdgesAreCreases()
    {
        // Pythagoras: the diagonal of a unit square is sqrt 2; the shorter outline edges are cut, not folded.
        var square = SplitSquare();
        Assert.Equal(Math.Sqrt(2), CreaseLengths.Shortest(square), 12);
        Assert.Equal(0, CreaseLengths.ShorterThan(square, 1.4));
        Assert.Equal(1, CreaseLengths.ShorterThan(square, 1.5));
    }

    [Fact]
    public void CoarseningTakesTheLargestCountWhoseCreasesReachTheMinimum()
    {
        // Creases proportional to the cell size (0.06 m at 20 cells): the estimate 20 * 0.06 / 0.099 = 12.1 holds.
        CreaseMesh Linear(int? nx, int? ny, double? size) => Strip(0.06 * 20 / nx!.Value);
        var exact = CreaseLengths.Coarsen(20, 20, null, 0.06, 0.099, Linear)!.Value;
        Assert.Equal((12, 12), (exact.CellsX!.Value, exact.CellsY!.Value));
        // Creases growing only as the square root of the cell size: the estimate (12) is short, and the count
        // falls one at a time to the largest n with 0.06 sqrt(20 / n) >= 0.1, n <= 7.2.
        CreaseMesh Slow(int? nx, int? ny, double? size) => Strip(0.06 * Math.Sqrt(20.0 / nx!.Value));
        var stepped = CreaseLengths.Coarsen(20, 14, null, 0.06, 0.1, Slow)!.Value;
        Assert.Equal(7, stepped.CellsX);
        Assert.True(stepped.CellsY < 14);
        Assert.True(stepped.Shortest >= 0.1);
        // A cell size grows instead of a count.
        CreaseMesh BySize(int? nx, int? ny, double? size) => Strip(0.3 * size!.Value);
        var sized = CreaseLengths.Coarsen(null, null, 0.2, 0.06, 0.1, BySize)!.Value;
        Assert.True(sized.CellSize >= 0.1 / 0.3 && sized.CellSize < 0.1 / 0.3 * 1.06, $"cell size {sized.CellSize}");
        // Creases that never lengthen: no coarsening, and the counts stop at 2.
        Assert.Null(CreaseLengths.Coarsen(20, 20, null, 0.06, 0.1, (_, _, _) => Strip(0.06)));
    }

    [Fact]
    public void TheStageLowersTheCellsUntilEveryDrapedCreaseReachesTheMinimumAtModelScale()
    {
        // An invented canopy: saddle 4.5 x 3.2 m, 18 x 18 Miura cells, at 1:60 with a 3 mm minimum crease.
        var job = Job(18, 60, 3);
        var target = TargetStage.Run(job, null, ProgressReporter.Silent).Target;
        var stage = TessellationStage.Run(job, target, ProgressReporter.Silent);
        var repair = Assert.IsType<CreaseLengthRepair>(stage.LengthRepair);
        Assert.Contains("tessellation.cellsX", repair.Message);
        Assert.Contains("fabrication.scale", repair.Message);
        Assert.True(repair.CellsX < 18 && repair.CellsY < 18);
        // Measured here, not by the stage: every interior edge of the drape, in mm on the model.
        Assert.True(ShortestMm(stage.Pattern.Mesh, 60) >= 3, $"shortest {ShortestMm(stage.Pattern.Mesh, 60)} mm");
        // The largest such count: one more cell each way and some crease is short again.
        // (Drawn with no minimum, so that the stage leaves the count as given.)
        var denser = TessellationStage.Run(Job(repair.CellsX!.Value + 1, 60, 0), target, ProgressReporter.Silent);
        Assert.True(ShortestMm(denser.Pattern.Mesh, 60) < 3);
        // At 1:20 the same cells are long enough and nothing changes.
        Assert.Null(TessellationStage.Run(Job(18, 20, 3), target, ProgressReporter.Silent).LengthRepair);
    }

    [Fact]
    public void AScaleNoCellCountCanMeetIsRefusedNamingTheFieldAndTheScaleThatWorks()
    {
        var job = Job(6, 5000, 3);
        var target = TargetStage.Run(job, null, ProgressReporter.Silent).Target;
        var e = Assert.Throws<JobError>(() => TessellationStage.Run(job, target, ProgressReporter.Silent));
        Assert.Equal("tessellation.cellsX", e.Where);
        Assert.Contains("fabrication.scale", e.Message);
    }

    private static Job Job(int cells, double scale, double minCreaseMm) => JobLoader.Parse(
        """{"name":"canopy","target":{"kind":"hyperbolic-paraboloid","c":8,"footprint":{"width":4.5,"depth":3.2}},"tessellation":{"family":"miura","cellsX":"""
        + cells + ",\"cellsY\":" + cells + "},\"fitting\":{\"bounds\":{\"minEdgeLengthMm\":" + minCreaseMm.ToString(System.Globalization.CultureInfo.InvariantCulture)
        + "}},\"fabrication\":{\"scale\":" + scale.ToString(System.Globalization.CultureInfo.InvariantCulture) + "}}",
        "test job", Path.GetTempPath());

    private static double ShortestMm(CreaseMesh m, double scale)
    {
        double shortest = double.PositiveInfinity;
        for (int e = 0; e < m.EdgeCount; e++)
            if (m.EdgeFaceLeft[e] >= 0 && m.EdgeFaceRight[e] >= 0)
                shortest = Math.Min(shortest, (m.Vertex(m.EdgeVertices[2 * e + 1]) - m.Vertex(m.EdgeVertices[2 * e])).Length * 1000 / scale);
        return shortest;
    }

    /// <summary>Two triangles sharing one crease of the given length (its outline edges are longer).</summary>
    private static CreaseMesh Strip(double crease) =>
        new("test", [0, 0, 0, crease, 0, 0, crease / 2, 5, 0, crease / 2, -5, 0], [[0, 1, 2], [1, 0, 3]], new VertexLayer[4], (_, _) => CreaseRole.Valley);
}
