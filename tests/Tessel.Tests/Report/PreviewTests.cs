using SkiaSharp;
using Tessel.Core.Fitting;
using Tessel.Output.Report;

namespace Tessel.Tests.Report;

public class PreviewTests
{
    [Fact]
    public void EveryPreviewDrawsAGoodShareOfItsArea()
    {
        var m = ReportDemoData.Build();
        var model = FoldedModelPreview.Render(m).Image;
        // The shaded sheet fills much of the 960 x 620 frame; plots and the pattern are mostly lines.
        Assert.True(PreviewPixels.NonBackground(model.Png) > model.Width * model.Height / 5);
        foreach (var img in new[] { CreasePatternPreview.Render(m), ParetoPlot.Render(m.ParetoFront), ConvergencePlot.Render(m.Convergence), SheetThumbnail.Render(m.Sheets[0]) })
        {
            int painted = PreviewPixels.NonBackground(img.Png);
            Assert.True(painted > img.Width * img.Height / 50, $"{img.Width}x{img.Height}: only {painted} pixels drawn");
            using var bmp = PreviewPixels.Decode(img.Png);
            Assert.Equal(img.Width, bmp.Width);
            Assert.Equal(img.Height, bmp.Height);
        }
    }

    [Fact]
    public void SameInputGivesIdenticalBytes()
    {
        var a = ReportDemoData.Build();
        var b = ReportDemoData.Build();
        Assert.Equal(FoldedModelPreview.Render(a).Image.Png, FoldedModelPreview.Render(b).Image.Png);
        Assert.Equal(CreasePatternPreview.Render(a).Png, CreasePatternPreview.Render(b).Png);
        Assert.Equal(ParetoPlot.Render(a.ParetoFront).Png, ParetoPlot.Render(b.ParetoFront).Png);
        Assert.Equal(ConvergencePlot.Render(a.Convergence).Png, ConvergencePlot.Render(b.Convergence).Png);
        Assert.Equal(SheetThumbnail.Render(a.Sheets[0]).Png, SheetThumbnail.Render(b.Sheets[0]).Png);
        // And a different fold is a different picture.
        Assert.NotEqual(FoldedModelPreview.Render(a).Image.Png, FoldedModelPreview.Render(ReportDemoData.Build(40)).Image.Png);
    }

    [Fact]
    public void ColourBarLimitsAreTheReportedMinimumAndMaximumDeviation()
    {
        var m = ReportDemoData.Build();
        var preview = FoldedModelPreview.Render(m);
        var bar = preview.Bar;
        double min = m.VertexDeviationM.Min(), max = m.VertexDeviationM.Max();
        Assert.Equal(min, bar.MinM);
        Assert.Equal(max, bar.MaxM);
        // The demo bump is 2.5 mm + 11.5 mm * sin * cos at full scale, so it spans about -9 .. +14 mm.
        Assert.InRange(bar.MaxFullMm, 12.0, 14.0 + 1e-9);
        Assert.InRange(bar.MinFullMm, -9.0 - 1e-9, -7.0);
        Assert.Equal(max * 1000 / 50, bar.MaxModelMm, 12);
        Assert.Equal(min * 1000 / 50, bar.MinModelMm, 12);

        using var bmp = PreviewPixels.Decode(preview.Image.Png);
        int cx = (bar.Left + bar.Right) / 2;
        Assert.Equal(DeviationPalette.Colour(max, min, max), bmp.GetPixel(cx, bar.Top));
        Assert.Equal(DeviationPalette.Colour(min, min, max), bmp.GetPixel(cx, bar.Bottom - 1));
        // Warm at the top (above target), cool at the bottom (below).
        var top = bmp.GetPixel(cx, bar.Top); var bottom = bmp.GetPixel(cx, bar.Bottom - 1);
        Assert.True(top.Red > top.Blue + 60, top.ToString());
        Assert.True(bottom.Blue > bottom.Red + 40, bottom.ToString());
    }

    [Fact]
    public void PaletteIsNeutralAtZeroAndSymmetricInStrength()
    {
        var zero = DeviationPalette.Colour(0, -3, 5);
        Assert.True(PreviewPixels.Distance(zero, new SKColor(238, 234, 222)) == 0);
        // Equal distances either side get the end stops when they are the largest magnitude.
        Assert.Equal(new SKColor(150, 44, 36), DeviationPalette.Colour(5, -5, 5));
        Assert.Equal(new SKColor(31, 76, 122), DeviationPalette.Colour(-5, -5, 5));
        // With an asymmetric range the smaller side does not reach its end stop.
        Assert.NotEqual(new SKColor(31, 76, 122), DeviationPalette.Colour(-3, -3, 5));
    }

    [Fact]
    public void RoundOffDeviationsReadAsOnTarget()
    {
        // A model on its target (a closed-form vault: deviations of 1e-15 m) is coloured neutral, not
        // stretched to the ends of the scale; a millimetre still gets the full colour.
        var neutral = new SKColor(238, 234, 222);
        Assert.Equal(neutral, DeviationPalette.Colour(2e-15, -1e-15, 2e-15));
        Assert.Equal(neutral, DeviationPalette.Colour(-1e-15, -1e-15, 2e-15));
        Assert.Equal(new SKColor(150, 44, 36), DeviationPalette.Colour(1e-3, -1e-3, 1e-3));
    }

    [Fact]
    public void ParetoPlotPutsKnownPointsAtTheExpectedPixels()
    {
        ParetoPoint[] pts = [ReportDemoData.Front(0, 0.021), ReportDemoData.Front(1, 0.008), ReportDemoData.Front(2, 0.005), ReportDemoData.Front(4, 0.004)];
        var img = ParetoPlot.Render(pts, chosenEpsilonDeg: 1);
        var axes = ParetoPlot.AxesFor(pts);
        // Expected by hand: plot area 84..616 x 44..360 px in a 640 x 420 image; x ticks 0..4 step 1,
        // y ticks 0..25 mm step 5 (largest error 21 mm; 21/5 = 4.2 rounds up to a step of 5).
        Assert.Equal((84f, 44f, 616f, 360f), (axes.Left, axes.Top, axes.Right, axes.Bottom));
        Assert.Equal((0.0, 4.0, 0.0, 25.0), (axes.XLow, axes.XHigh, axes.YLow, axes.YHigh));
        (double X, double Y)[] expected =
        [
            (84, 360 - 21.0 / 25 * 316), (84 + 532 / 4.0, 360 - 8.0 / 25 * 316),
            (84 + 532 / 2.0, 360 - 5.0 / 25 * 316), (616, 360 - 4.0 / 25 * 316),
        ];
        using var bmp = PreviewPixels.Decode(img.Png);
        for (int i = 0; i < pts.Length; i++)
        {
            Assert.Equal(expected[i].X, axes.MapX(pts[i].EpsilonDeg), 3);
            Assert.Equal(expected[i].Y, axes.MapY(pts[i].ShapeRms * 1000), 3);
            var c = bmp.GetPixel((int)Math.Floor(expected[i].X), (int)Math.Floor(expected[i].Y));
            Assert.True(PreviewPixels.Distance(c, ParetoPlot.MarkerColour) <= 12, $"point {i}: {c} at {expected[i]}");
        }
        // No marker where there is no point: (3 deg, 20 mm).
        var empty = bmp.GetPixel(84 + 532 * 3 / 4, (int)(360 - 20.0 / 25 * 316));
        Assert.True(PreviewPixels.Distance(empty, ParetoPlot.MarkerColour) > 60);
        // The chosen fit is ringed 9 px from its centre.
        Assert.True(PreviewPixels.NearestInWindow(bmp, (int)expected[1].X + 9, (int)expected[1].Y, 1, ParetoPlot.ChosenColour) <= 20);
    }

    [Fact]
    public void ConvergencePlotUsesWholeDecadesOnALogAxis()
    {
        ConvergenceStep[] steps = [new(0, 2.0, 0.5), new(5, 0.02, 3e-4), new(10, 2e-4, 2e-7)];
        var axes = ConvergencePlot.AxesFor(steps);
        // Values span 2e-7 .. 2 -> decades 1e-7 .. 1e1.
        Assert.Equal(1e-7, axes.YLow, 15);
        Assert.Equal(10, axes.YHigh, 12);
        Assert.True(axes.YLog);
        // 1e-3 lies 4 of 8 decades up: halfway.
        Assert.Equal((axes.Top + axes.Bottom) / 2, axes.MapY(1e-3), 3);
        using var bmp = PreviewPixels.Decode(ConvergencePlot.Render(steps).Png);
        // The residual line passes through its first point.
        Assert.True(PreviewPixels.NearestInWindow(bmp, (int)axes.MapX(0) + 2, (int)axes.MapY(0.5), 2, ConvergencePlot.ResidualColour) <= 40);
        Assert.True(PreviewPixels.NearestInWindow(bmp, (int)axes.MapX(10) - 2, (int)axes.MapY(2e-7), 2, ConvergencePlot.ResidualColour) <= 40);
    }

    [Fact]
    public void ConvergencePlotMarksWhereAFurtherSolverRunStarts()
    {
        ConvergenceStep[] steps = [new(0, 2.0, 0.5), new(10, 0.02, 3e-4), new(25, 1.0, 0.1, StartsRun: true), new(40, 2e-4, 2e-7)];
        var axes = ConvergencePlot.AxesFor(steps);
        using var bmp = PreviewPixels.Decode(ConvergencePlot.Render(steps).Png);
        // A quarter of the way up the plot area, clear of the legend, of both lines and of the grid (every 10 steps).
        int y = (int)(axes.Top + 0.75f * (axes.Bottom - axes.Top));
        Assert.True(PreviewPixels.NearestInWindow(bmp, (int)axes.MapX(25), y, 1, ConvergencePlot.RunStartColour) <= 20);
        Assert.True(PreviewPixels.NearestInWindow(bmp, (int)axes.MapX(35), y, 1, ConvergencePlot.RunStartColour) > 20);
        using var single = PreviewPixels.Decode(ConvergencePlot.Render([.. steps.Select(s => s with { StartsRun = false })]).Png);
        Assert.True(PreviewPixels.NearestInWindow(single, (int)axes.MapX(25), y, 1, ConvergencePlot.RunStartColour) > 20);
    }

    [Fact]
    public void EmptyStudiesStillRenderAxes()
    {
        Assert.True(PreviewPixels.NonBackground(ParetoPlot.Render([]).Png) > 1000);
        Assert.True(PreviewPixels.NonBackground(ConvergencePlot.Render([]).Png) > 1000);
    }

    [Fact]
    public void SheetThumbnailKeepsTheSheetProportions()
    {
        var m = ReportDemoData.Build();
        var img = SheetThumbnail.Render(m.Sheets[0], 360);
        // A4 landscape 297 x 210 mm (ISO 216): 336 px across the paper -> 237.6 px down, + margins and caption.
        Assert.Equal(360, img.Width);
        Assert.Equal((int)Math.Ceiling(210 * (336.0 / 297)) + 24 + 26, img.Height);
    }

    [Fact]
    public void TitlesAreInkedWithATypefaceOrTheStrokeFallback()
    {
        // The trade-off plot's title has its baseline at y = 28 from x = 84; whichever way text is drawn
        // on this machine, the band above that baseline must hold ink.
        using var bmp = PreviewPixels.Decode(ParetoPlot.Render([]).Png);
        int inked = 0;
        for (int y = 14; y <= 30; y++)
            for (int x = 84; x < 300; x++)
                if (PreviewPixels.Distance(bmp.GetPixel(x, y), PreviewCanvas.Background) > 80) inked++;
        Assert.True(inked > 100, $"{inked} inked pixels in the title band (typeface found: {PreviewCanvas.HasFont})");
    }
}
