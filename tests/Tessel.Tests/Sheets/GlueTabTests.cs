using Tessel.Core.Geometry;
using Tessel.Core.Sheets;

namespace Tessel.Tests.Sheets;

public class GlueTabTests
{
    [Fact]
    public void TabIsCappedAtAThirdOfTheMatingFacetAndTaperedAtTheSetAngle()
    {
        // Seam along x from (0,0) to (30,0); mating square facet 30 x 12 below (y < 0).
        var facet = new[] { new Vec2(0, 0), new Vec2(0, -12), new Vec2(30, -12), new Vec2(30, 0) };
        var tab = GlueTab.Build(new Vec2(0, 0), new Vec2(30, 0), facet, 7, 40 * Math.PI / 180, 0);
        // Width capped at 12 / 3 = 4 mm (docs/reference/fabrication.md [CP/M]).
        Assert.Equal(4, tab.WidthMm, 12);
        Assert.All(tab.Polygon.Skip(2), p => Assert.Equal(-4, p.Y, 12));
        // Ends at 40 deg: inset 4 / tan 40 deg at each end.
        double inset = 4 / Math.Tan(40 * Math.PI / 180);
        Assert.Equal(30 - inset, tab.Polygon[2].X, 9);
        Assert.Equal(inset, tab.Polygon[3].X, 9);
        Assert.Equal((new Vec2(0, 0), new Vec2(30, 0)), (tab.FoldFrom, tab.FoldTo));
    }

    [Fact]
    public void TaperNeverExceedsTheMatingFacetCornerAngle()
    {
        // Mating parallelogram with a 25 deg corner at p: the tab end there may lean at most 25 deg.
        double g = 25 * Math.PI / 180;
        var p = new Vec2(0, 0); var q = new Vec2(40, 0);
        var far = new Vec2(30 * Math.Cos(g), 30 * Math.Sin(g));
        var facet = new[] { p, q, q + far, p + far };
        var tab = GlueTab.Build(p, q, facet, 5, 40 * Math.PI / 180, 0);
        var endP = tab.Polygon[3] - p;
        Assert.Equal(25, Math.Atan2(endP.Y, endP.X) * 180 / Math.PI, 9);
        // At q the corner is 155 deg, so the set 40 deg taper applies.
        var endQ = tab.Polygon[2] - q;
        Assert.Equal(180 - 40, Math.Atan2(endQ.Y, endQ.X) * 180 / Math.PI, 9);
    }

    [Fact]
    public void ThickCardMovesTheFoldLineOutByTheThickness()
    {
        var facet = new[] { new Vec2(0, 0), new Vec2(20, 0), new Vec2(20, 20), new Vec2(0, 20) };
        var tab = GlueTab.Build(new Vec2(0, 0), new Vec2(20, 0), facet, 6, Math.PI / 4, 0.8);
        Assert.Equal(new Vec2(0, 0.8), tab.FoldFrom);
        Assert.Equal(new Vec2(20, 0.8), tab.FoldTo);
        Assert.Equal(6, tab.Polygon.Length);
        Assert.Equal(0.8 + 6, tab.Polygon.Max(v => v.Y), 12);
    }
}
