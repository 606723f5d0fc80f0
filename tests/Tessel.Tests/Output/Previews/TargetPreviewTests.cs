using SkiaSharp;
using Tessel.Core.Pipeline;
using Tessel.Core.Targets;
using Tessel.Output.Previews;

namespace Tessel.Tests.Output.Previews;

public class TargetPreviewTests
{
    [Fact]
    public void DomeApexIsDrawnInTheHighColourAndCornersInTheLowColour()
    {
        var dome = new SphericalCapSurface(Footprint.Rectangle(10, 5), 12, 3);
        var png = TargetPreview.Render(dome, TargetFigures.Measure("spherical-cap", dome), "dome");
        using var bmp = SKBitmap.Decode(png);
        Assert.NotNull(bmp);
        // Map is 760 px on the longer side (10 m), so 380 px for 5 m; it starts at (28, 54).
        const int left = 28, top = 54, mapW = 760, mapH = 380;
        Assert.Equal(left + mapW + 150, bmp.Width);
        Assert.Equal(top + mapH + 70, bmp.Height);
        var apex = bmp.GetPixel(left + mapW / 2 + 3, top + mapH / 2 + 3);
        var corner = bmp.GetPixel(left + 4, top + mapH - 5);
        // Our palette runs from slate blue (low) to coral (high): red dominates at the top, blue at the bottom.
        Assert.True(apex.Red > apex.Blue + 60, $"apex {apex}");
        Assert.True(corner.Blue > corner.Red + 20, $"corner {corner}");
    }

    [Fact]
    public void PaletteEndsAreTheDocumentedStops()
    {
        Assert.Equal(new SKColor(0x23, 0x39, 0x5b), HeightPalette.At(0));
        Assert.Equal(new SKColor(0xd1, 0x60, 0x3d), HeightPalette.At(1));
        Assert.Equal(HeightPalette.At(1), HeightPalette.At(7)); // clamped
    }

    [Theory]
    [InlineData(3.0, 2.0)]
    [InlineData(0.7, 0.5)]
    [InlineData(12.0, 10.0)]
    [InlineData(1.0, 1.0)]
    public void ScaleBarStepsAreOneTwoOrFiveTimesAPowerOfTen(double x, double expected)
    {
        Assert.Equal(expected, TargetPreview.NiceStep(x), 12);
    }
}
