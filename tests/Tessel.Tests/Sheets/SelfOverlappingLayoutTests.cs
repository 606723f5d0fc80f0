using NetTopologySuite.Geometries;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Pipeline;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;

namespace Tessel.Tests.Sheets;

/// <summary>Layouts a non-converged fit can produce (facets folded over each other, self-crossing facets) are
/// refused with a reason, never a topology crash; the polygon operations repair their inputs.</summary>
public class SelfOverlappingLayoutTests
{
    /// <summary>Six triangles around a centre (radius 0.5 m), flat positions as given by <paramref name="angleDeg"/>
    /// of each outer vertex; the folded mesh is the regular fan.</summary>
    private static FlatPattern Fan(double[] angleDeg, double strain = 0)
    {
        var pos = new double[7 * 3];
        var xy = new double[7 * 2];
        for (int k = 0; k < 6; k++)
        {
            var p = new Vec2(0.5, 0).Rotated(k * Math.PI / 3);
            pos[3 * (k + 1)] = p.X; pos[3 * (k + 1) + 1] = p.Y;
            var q = new Vec2(0.5 * (1 + strain), 0).Rotated(angleDeg[k] * Math.PI / 180);
            xy[2 * (k + 1)] = q.X; xy[2 * (k + 1) + 1] = q.Y;
        }
        var faces = Enumerable.Range(0, 6).Select(k => new[] { 0, k + 1, (k + 1) % 6 + 1 }).ToArray();
        var mesh = new CreaseMesh("fan", pos, faces, new VertexLayer[7], (a, b) => a == 0 ? CreaseRole.Mountain : CreaseRole.Flat);
        var edgeStrain = Enumerable.Repeat(strain, mesh.EdgeCount).ToArray();
        return new FlatPattern(mesh, xy, edgeStrain);
    }

    private static readonly double[] Regular = [0, 60, 120, 180, 240, 300];
    private static readonly FabricationSettings Settings = new() { ScaleDenominator = 20, Material = Materials.Card, KerfMm = 0 };

    [Fact]
    public void RegularFanLaysOut()
    {
        var layout = SheetLayout.Lay(Fan(Regular), Settings);
        Assert.Single(layout.Parts);
        // Six 60 deg triangles of 25 mm side (0.5 m at 1:20): 6 * sqrt(3)/4 * 25^2 mm2 (equilateral triangle area).
        Assert.Equal(6 * Math.Sqrt(3) / 4 * 625, layout.Parts[0].AreaMm2, 6);
    }

    [Fact]
    public void FacetFoldedOverItsNeighbourIsRefusedWithTheReason()
    {
        // Vertex 2 swung from 60 to 150 deg: triangle (0, 2, 3) turns over and lies on its neighbours.
        var e = Assert.Throws<UncuttableLayoutException>(() => SheetLayout.Lay(Fan([0, 150, 120, 180, 240, 300]), Settings));
        Assert.Contains("overlaps itself (1 facet(s) turned over", e.Message);
        Assert.Contains("fitting.maxIterations", e.Message);
    }

    [Fact]
    public void TheOverlapIsMeasuredBeforeTheSheetsSoTheBuildCanRebuildWithFewerCells()
    {
        // The pipeline asks this of every buildable fit (Pipeline/FewerCells): null for a sound layout, else how.
        Assert.Null(LayoutOverlap.Overlaps(ModelScalePattern.Of(Fan(Regular), 50).Faces));
        string? how = LayoutOverlap.Overlaps(ModelScalePattern.Of(Fan([0, 150, 120, 180, 240, 300]), 1000).Faces, "at full scale");
        Assert.NotNull(how);
        Assert.StartsWith("1 facet(s) turned over, ", how);
        Assert.EndsWith(" mm2 of facets lying on others at full scale", how);
    }

    [Fact]
    public void SelfCrossingFacetIsRefusedNotCrashed()
    {
        // Vertices 1 and 2 swapped: triangles (0,1,2) and (0,2,3), (0,6,1) cross one another.
        var e = Assert.Throws<UncuttableLayoutException>(() => SheetLayout.Lay(Fan([60, 0, 120, 180, 240, 300]), Settings));
        Assert.Contains("overlaps itself", e.Message);
    }

    [Fact]
    public void StrainedButUntangledLayoutIsWrittenWithTheStrainMarked()
    {
        // 3 % longer edges (beyond card's strain limit) but no facet on another: the sheets are made, and the
        // strain is reported.
        var layout = SheetLayout.Lay(Fan(Regular, strain: 0.03), Settings);
        Assert.Single(layout.Parts);
        Assert.True(layout.Figures.StrainedEdgeCount > 0);
        Assert.Contains(layout.Figures.Warnings, w => w.Contains("stretched or shrunk beyond"));
    }

    [Fact]
    public void UnionRepairsABowTieAndOverlapsWithoutThrowing()
    {
        var f = new GeometryFactory();
        Polygon Ring(params double[] c) => f.CreatePolygon(Enumerable.Range(0, c.Length / 2 + 1)
            .Select(i => new Coordinate(c[2 * (i % (c.Length / 2))], c[2 * (i % (c.Length / 2)) + 1])).ToArray());
        var bowTie = Ring(0, 0, 2, 2, 2, 0, 0, 2);
        Assert.False(bowTie.IsValid);
        var square = Ring(0, 0, 1, 0, 1, 1, 0, 1);
        var union = NtsGeometry.Union([bowTie, square]);
        Assert.True(union.IsValid);
        // Bow-tie = two triangles of area 1 meeting at (1, 1); the unit square adds 1 and shares 0.5 with the left one.
        Assert.Equal(2.5, union.Area, 9);
        Assert.True(NtsGeometry.Intersects(bowTie, square));
    }

    [Fact]
    public void UnfoldingRefusesAPatternInPiecesAndNamesTheCause()
    {
        // Two triangles that share only vertex 0: no crease joins them, so there is no one flat layout.
        double[] pos = [0, 0, 0, 1, 0, 0, 0, 1, 0, -1, 0, 0.3, 0, -1, 0.2];
        var mesh = new CreaseMesh("pieces", pos, [[0, 1, 2], [0, 3, 4]], new VertexLayer[5], (_, _) => CreaseRole.Flat);
        var e = Assert.Throws<ArithmeticException>(() => MeshUnfolder.Unfold(mesh));
        Assert.Contains("2 pieces", e.Message);
        Assert.Equal(2, MeshUnfolder.Pieces(mesh));
    }

    [Fact]
    public void UnfoldingRefusesCoincidentVertices()
    {
        double[] pos = [0, 0, 0, 1, 0, 0, 1, 0, 0, 0, 1, 0];
        var mesh = new CreaseMesh("collapsed", pos, [[0, 1, 3], [1, 2, 3]], new VertexLayer[4], (_, _) => CreaseRole.Flat);
        var e = Assert.Throws<ArithmeticException>(() => MeshUnfolder.Unfold(mesh));
        Assert.Contains("coincide", e.Message);
    }
}
