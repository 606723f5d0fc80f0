using SkiaSharp;

namespace Tessel.Output.Report;

/// <summary>Where a 2D plot puts its data: the plot rectangle in pixels and the value ranges of its
/// axes. The y axis may be logarithmic (base 10). Tests use it to predict pixel positions.</summary>
/// <param name="Left">Left pixel of the plot area (value <paramref name="XLow"/>).</param>
/// <param name="Top">Top pixel of the plot area (value <paramref name="YHigh"/>).</param>
/// <param name="Right">Right pixel of the plot area (value <paramref name="XHigh"/>).</param>
/// <param name="Bottom">Bottom pixel of the plot area (value <paramref name="YLow"/>).</param>
/// <param name="XLow">x value at the left edge.</param>
/// <param name="XHigh">x value at the right edge.</param>
/// <param name="YLow">y value at the bottom edge (a power of ten on a log axis).</param>
/// <param name="YHigh">y value at the top edge.</param>
/// <param name="YLog">True when y is drawn on a base-10 logarithmic scale.</param>
public sealed record PlotAxes(float Left, float Top, float Right, float Bottom,
    double XLow, double XHigh, double YLow, double YHigh, bool YLog = false)
{
    /// <summary>Pixel column of an x value.</summary>
    public float MapX(double x) => (float)(Left + (x - XLow) / (XHigh - XLow) * (Right - Left));

    /// <summary>Pixel row of a y value (rows grow downward).</summary>
    public float MapY(double y)
    {
        double lo = YLog ? Math.Log10(YLow) : YLow, hi = YLog ? Math.Log10(YHigh) : YHigh;
        double v = YLog ? Math.Log10(y) : y;
        return (float)(Bottom - (v - lo) / (hi - lo) * (Bottom - Top));
    }

    /// <summary>Draws the grid, the axis lines, tick labels and the axis titles.</summary>
    internal void Draw(PreviewCanvas pc, double[] xTicks, double xStep, double[] yTicks, Func<double, string> yLabel,
        string xTitle, string yTitle)
    {
        var c = pc.Canvas;
        using var grid = PreviewCanvas.Stroke(PreviewCanvas.Faint, 1, false);
        using var axis = PreviewCanvas.Stroke(PreviewCanvas.Ink, 1, false);
        foreach (double x in xTicks)
        {
            float px = Snap(MapX(x));
            c.DrawLine(px, Top, px, Bottom, grid);
            c.DrawLine(px, Bottom, px, Bottom + 5, axis);
            pc.Text(NiceTicks.Label(x, xStep), px, Bottom + 19, 12, PreviewCanvas.Ink, SKTextAlign.Center);
        }
        foreach (double y in yTicks)
        {
            float py = Snap(MapY(y));
            c.DrawLine(Left, py, Right, py, grid);
            c.DrawLine(Left - 5, py, Left, py, axis);
            pc.Text(yLabel(y), Left - 8, py + 4, 12, PreviewCanvas.Ink, SKTextAlign.Right);
        }
        c.DrawLine(Snap(Left), Top, Snap(Left), Bottom, axis);
        c.DrawLine(Left, Snap(Bottom), Right, Snap(Bottom), axis);
        pc.Text(xTitle, (Left + Right) / 2, Bottom + 40, 13, PreviewCanvas.Ink, SKTextAlign.Center);
        pc.VerticalText(yTitle, Left - 62, (Top + Bottom) / 2, 13, PreviewCanvas.Ink);
    }

    // Hairlines on pixel centres stay one pixel wide and crisp.
    private static float Snap(float v) => MathF.Floor(v) + 0.5f;
}
