using SkiaSharp;
using Tessel.Output.Report;

namespace Tessel.Tests.Report;

public class StrokeLetteringTests
{
    private static (int Painted, int MinX, int MaxX, int MinY, int MaxY) Ink(string text, float size, SKTextAlign align, float x)
    {
        using var bmp = new SKBitmap(new SKImageInfo(400, 60));
        using (var c = new SKCanvas(bmp))
        {
            c.Clear(SKColors.White);
            StrokeLettering.Draw(c, text, x, 40, size, SKColors.Black, align);
        }
        int painted = 0, minX = int.MaxValue, maxX = -1, minY = int.MaxValue, maxY = -1;
        for (int py = 0; py < bmp.Height; py++)
            for (int px = 0; px < bmp.Width; px++)
                if (bmp.GetPixel(px, py).Red < 128)
                {
                    painted++;
                    minX = Math.Min(minX, px); maxX = Math.Max(maxX, px); minY = Math.Min(minY, py); maxY = Math.Max(maxY, py);
                }
        return (painted, minX, maxX, minY, maxY);
    }

    [Fact]
    public void DigitsAndLettersDrawInsideTheirCellsAboveTheBaseline()
    {
        string text = "+0.279 MM 1:50";
        var ink = Ink(text, 20, SKTextAlign.Left, 10);
        Assert.True(ink.Painted > 200, $"{ink.Painted} pixels");
        // Cap height 6 units of 0.12 * 20 px = 14.4 px above the baseline at y = 40 (stroke adds ~1 px).
        Assert.InRange(ink.MinY, 40 - 14.4 - 2, 40 - 14.4 + 2);
        Assert.InRange(ink.MaxY, 38, 42);
        // 14 characters, 6 units each: 201.6 px, the last character's 2-unit gap left blank.
        Assert.Equal(14 * 6 * 0.12f * 20, StrokeLettering.Measure(text, 20), 3);
        Assert.InRange(ink.MaxX, 10 + 201.6 - 2 * 2.4 - 3, 10 + 201.6 - 2 * 2.4 + 3);
    }

    [Fact]
    public void RightAlignedTextEndsAtItsAnchor()
    {
        var ink = Ink("-8.56", 20, SKTextAlign.Right, 300);
        Assert.InRange(ink.MaxX, 300 - 2.4 - 3, 300 - 2.4 + 3);
    }

    [Fact]
    public void EveryCharacterThePreviewsUseHasAGlyph()
    {
        string used = "0123456789+-.,:;()%/=|!? abcdefghijklmnopqrstuvwxyz\u03b5\u2014";
        Assert.All(used, c => Assert.True(StrokeLettering.HasGlyph(c), $"'{c}'"));
        Assert.False(StrokeLettering.HasGlyph('@'));
    }
}
