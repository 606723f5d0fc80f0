using NetTopologySuite.Geometries;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;

namespace Tessel.Tests.Sheets;

public class ThickPanelsTests
{
    /// <summary>Two 10 mm squares (at 1:1, 0.01 m) sharing the edge x = 0.01; the second folded 90 deg down.</summary>
    private static FlatPattern Hinge()
    {
        const double s = 0.01;
        double[] folded =
        [
            0, 0, 0, s, 0, 0, s, 0, -s,
            0, s, 0, s, s, 0, s, s, -s,
        ];
        double[] flat = [0, 0, s, 0, 2 * s, 0, 0, s, s, s, 2 * s, s];
        int[][] faces = [[0, 1, 4, 3], [1, 2, 5, 4]];
        var mesh = new CreaseMesh("hinge", folded, faces, new VertexLayer[6], (_, _) => CreaseRole.Mountain);
        return new FlatPattern(mesh, flat, new double[mesh.EdgeCount]);
    }

    private static double Area(Vec2[] ring) =>
        new GeometryFactory().CreatePolygon(ring.Append(ring[0]).Select(p => new Coordinate(p.X, p.Y)).ToArray()).Area;

    [Fact]
    public void HingeOutsideARightAngleFoldSetsEachBoardBackByTSinRhoHalf()
    {
        var pattern = Hinge();
        int fold = Enumerable.Range(0, pattern.EdgeCount).Single(e => pattern.Folded.IsInterior(e));
        // Dropping the second face makes the shared edge a ridge: a mountain of +90 deg (CreaseMesh convention).
        Assert.Equal(Math.PI / 2, pattern.Folded.FoldAngle(fold), 9);
        var layout = SheetLayout.Lay(pattern, new FabricationSettings { ScaleDenominator = 1 });
        var panels = ThickPanels.Build(pattern, layout, new ThickPanelSettings(2.0, HingeSide.Top));
        // g = 2 t sin(rho/2) = 2 x 2 x sin 45 deg = 2.828 mm (docs/reference/fabrication.md "Thick panels", from the geometry).
        Assert.Equal(4 * Math.Sin(Math.PI / 4), panels.EdgeGapMm[fold], 12);
        // Boundary edges stay; the fold edge moves back g/2 on each board: 10 x (10 - 1.414) mm^2.
        Assert.All(panels.Panels, p => Assert.Equal(10 * (10 - 2 * Math.Sin(Math.PI / 4)), Area(p), 9));
        Assert.Empty(panels.Warnings);
        Assert.Equal(2, panels.Sheets[0].Lines.Count(l => l.Class == LineClass.CutOutline));
    }

    [Fact]
    public void HingeInsideTheFoldNeedsOnlyTheSmallGapAndThickBoardsVanish()
    {
        var pattern = Hinge();
        var layout = SheetLayout.Lay(pattern, new FabricationSettings { ScaleDenominator = 1 });
        var inside = ThickPanels.Build(pattern, layout, new ThickPanelSettings(2.0, HingeSide.Bottom, 0.4));
        Assert.All(inside.Panels, p => Assert.Equal(10 * (10 - 0.2), Area(p), 9));
        // 15 mm boards on a 10 mm facet: the 21.2 mm gap leaves nothing.
        var thick = ThickPanels.Build(pattern, layout, new ThickPanelSettings(15.0, HingeSide.Top));
        Assert.Equal(2, thick.Warnings.Length);
        Assert.All(thick.Panels, p => Assert.Empty(p));
    }
}
