using Tessel.Core.Fitting;
using Tessel.Core.Geometry;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Tests.Fitting;

public class CoarseStartTests
{
    /// <summary>A footbridge canopy (invented): the saddle z = x y / 6 over 2.4 x 1.8 m.</summary>
    private static readonly HyperbolicParaboloidSurface Canopy = new(Footprint.Rectangle(2.4, 1.8), c: 6);

    private static GeneratedPattern Sheet(int cells, double depth) =>
        MiuraGenerator.Generate(Canopy, new MiuraParameters(CellsX: cells, CellsY: cells, SectorAngleDeg: 60, FoldDepth: depth));

    [Fact]
    public void ARigidTranslationOfTheCoarseSheetCarriesOverExactly()
    {
        // A kernel average of equal displacements is that displacement (weights sum to one), so the fine
        // drape moves by it at every vertex.
        var coarse = Sheet(6, 0.04).Mesh;
        var fine = Sheet(12, 0.02).Mesh;
        var shift = new Vec3(0.013, -0.021, 0.007);
        var moved = (double[])coarse.Positions.Clone();
        for (int v = 0; v < coarse.VertexCount; v++) (coarse.Vertex(v) + shift).Write(moved, v);

        var start = CoarseStart.Prolong(coarse, moved, fine);

        for (int v = 0; v < fine.VertexCount; v++)
        {
            var d = Vec3.Read(start, v) - fine.Vertex(v);
            Assert.True((d - shift).Length < 1e-12, $"vertex {v}: {d}");
        }
        // No displacement leaves the drape as it is.
        Assert.Equal(fine.Positions, CoarseStart.Prolong(coarse, coarse.Positions, fine));
    }

    [Fact]
    public void SheetsUnderTheThresholdStartFromTheirDrape()
    {
        // Up to 40 x 40 the fit lands from the drape (fit benchmark): no coarse fit is run below MinCells.
        var pattern = Sheet(8, 0.02);
        bool generated = false;
        var coarser = new CoarserSheets(CoarseStart.MinCells - 1, 60, (nx, ny) => { generated = true; return Sheet(nx, 0.04); });
        Assert.Null(CoarseStart.For(pattern, Canopy, new FitSettings(), coarser, EpsilonConstraintFitter.DefaultSolver));
        Assert.False(generated);
        Assert.Null(CoarseStart.For(pattern, Canopy, new FitSettings(), null, EpsilonConstraintFitter.DefaultSolver));
    }

    [Fact]
    public void TheMiuraFamilyOffersItsSheetWithOtherCountsAndScaledFoldDepth()
    {
        var family = TessellationFamilies.Find("miura")!;
        var coarser = family.Coarser(Canopy, new FamilyParameters(CellsX: 10, CellsY: 8, FoldDepth: 0.03))!;
        Assert.Equal((10, 8), (coarser.CellsX, coarser.CellsY));
        var half = coarser.Generate(5, 4);
        // (2 x 5 + 1) x (2 x 4 + 1) vertices; cells twice the size in both directions, so the fold depth doubles.
        Assert.Equal(11 * 9, half.Mesh.VertexCount);
        Assert.Equal(0.06, half.LayerOffset, 12);
    }
}
