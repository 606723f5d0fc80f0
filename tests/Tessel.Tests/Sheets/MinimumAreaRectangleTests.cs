using Tessel.Core.Geometry;
using Tessel.Core.Sheets;

namespace Tessel.Tests.Sheets;

public class MinimumAreaRectangleTests
{
    private static Vec2[] Rectangle(double w, double h, double angle, Vec2 at) =>
        new[] { new Vec2(0, 0), new Vec2(w, 0), new Vec2(w, h), new Vec2(0, h) }.Select(p => p.Rotated(angle) + at).ToArray();

    [Fact]
    public void TurnedRectangleIsFoundExactly()
    {
        var pts = Rectangle(30, 10, 0.3, new Vec2(5, -2)).Append(new Vec2(5, -2) + new Vec2(15, 5).Rotated(0.3)).ToArray();
        var box = MinimumAreaRectangle.Of(MinimumAreaRectangle.ConvexHull(pts));
        Assert.Equal(30, box.Width, 9);
        Assert.Equal(10, box.Height, 9);
        // Axis-aligned box of the same points is larger, so the calipers did turn it.
        Assert.True(MinimumAreaRectangle.BoxAt(pts, 0).Area > 300 + 50);
    }

    [Fact]
    public void RightTriangleBoxHasTheLegsAsSides()
    {
        // Right triangle with legs 3, 4: legs on the sides give 4 x 3 = 12, the hypotenuse on a side 5 x 2.4 = 12;
        // the axis-free optimum is 12 (half the box always), so anything larger is a caliper error.
        var tri = new[] { new Vec2(0, 0), new Vec2(4, 0), new Vec2(0, 3) }.Select(p => p.Rotated(0.7)).ToArray();
        Assert.True(MinimumAreaRectangle.BoxAt(tri, 0).Area > 12.5);
        var box = MinimumAreaRectangle.Of(MinimumAreaRectangle.ConvexHull(tri));
        Assert.Equal(12, box.Area, 9);
    }

    [Fact]
    public void FittingBoxFindsATurningOnlyWhenOneExists()
    {
        var bar = Rectangle(100, 10, Math.PI / 4, Vec2.Zero);
        var fit = MinimumAreaRectangle.FittingBox(MinimumAreaRectangle.ConvexHull(bar), 101, 20);
        Assert.NotNull(fit);
        Assert.InRange(fit!.Value.Width, 0, 101);
        Assert.InRange(fit.Value.Height, 0, 20);
        // Diagonal of a 90 x 20 box is 92.2 mm: a 100 mm bar fits in no turning.
        Assert.Null(MinimumAreaRectangle.FittingBox(MinimumAreaRectangle.ConvexHull(bar), 90, 20));
    }
}
