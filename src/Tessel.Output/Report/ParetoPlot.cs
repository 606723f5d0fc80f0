using SkiaSharp;
using Tessel.Core.Fitting;

namespace Tessel.Output.Report;

/// <summary>The accuracy/buildability trade-off: shape error (mm, full scale) against the developability
/// tolerance each fit was run with. Points are joined in tolerance order; the fit the build went on with is ringed.</summary>
public static class ParetoPlot
{
    /// <summary>Colour of the point markers (tests look for it at the predicted pixels).</summary>
    public static readonly SKColor MarkerColour = new(196, 84, 28);
    /// <summary>Colour of the ring around the chosen fit.</summary>
    public static readonly SKColor ChosenColour = new(24, 96, 120);

    /// <summary>The axes a plot of these points uses: x widened to round ticks from 0, y likewise
    /// (shape error plotted in millimetres at full scale).</summary>
    public static PlotAxes AxesFor(ParetoPoint[] points, int width = 640, int height = 420)
    {
        var (xl, xh, _) = XTicks(points);
        var (yl, yh, _) = YTicks(points);
        return new PlotAxes(84, 44, width - 24, height - 60, xl, xh, yl, yh);
    }

    /// <summary>Renders the plot; with no points it draws the axes and says so.</summary>
    public static PreviewImage Render(ParetoPoint[] points, double? chosenEpsilonDeg = null, int width = 640, int height = 420)
    {
        using var pc = new PreviewCanvas(width, height);
        var axes = AxesFor(points, width, height);
        var (_, _, xt) = XTicks(points);
        var (_, _, yt) = YTicks(points);
        double ys = yt.Length > 1 ? yt[1] - yt[0] : 1;
        axes.Draw(pc, xt, xt.Length > 1 ? xt[1] - xt[0] : 1, yt, y => NiceTicks.Label(y, ys),
            "developability tolerance \u03b5 (deg)", "shape error, RMS (mm, full scale)");
        pc.Text("accuracy against buildability", axes.Left, 28, 15, PreviewCanvas.Ink);
        if (points.Length == 0)
        {
            pc.Text("no trade-off study in this build", (axes.Left + axes.Right) / 2, (axes.Top + axes.Bottom) / 2, 13, PreviewCanvas.Ink, SKTextAlign.Center);
            return new PreviewImage(pc.ToPng(), width, height);
        }

        var sorted = points.Select((p, i) => (p, i)).OrderBy(t => t.p.EpsilonDeg).ThenBy(t => t.i).Select(t => t.p).ToArray();
        using var line = PreviewCanvas.Stroke(new SKColor(120, 120, 128), 1.5f);
        for (int i = 1; i < sorted.Length; i++)
            pc.Canvas.DrawLine(axes.MapX(sorted[i - 1].EpsilonDeg), axes.MapY(sorted[i - 1].ShapeRms * 1000),
                axes.MapX(sorted[i].EpsilonDeg), axes.MapY(sorted[i].ShapeRms * 1000), line);
        using var marker = PreviewCanvas.Fill(MarkerColour);
        using var ring = PreviewCanvas.Stroke(ChosenColour, 2.5f);
        foreach (var p in sorted)
        {
            float x = axes.MapX(p.EpsilonDeg), y = axes.MapY(p.ShapeRms * 1000);
            pc.Canvas.DrawCircle(x, y, 4.5f, marker);
            if (chosenEpsilonDeg is double chosen && Math.Abs(p.EpsilonDeg - chosen) < 1e-12)
            {
                pc.Canvas.DrawCircle(x, y, 9, ring);
                pc.Text("chosen", x + 12, y - 10, 12, ChosenColour);
            }
        }
        return new PreviewImage(pc.ToPng(), width, height);
    }

    private static (double, double, double[]) XTicks(ParetoPoint[] p) =>
        NiceTicks.For(p.Length == 0 ? 0 : Math.Min(0, p.Min(q => q.EpsilonDeg)), p.Length == 0 ? 1 : Math.Max(p.Max(q => q.EpsilonDeg), 1e-9));

    private static (double, double, double[]) YTicks(ParetoPoint[] p) =>
        NiceTicks.For(p.Length == 0 ? 0 : Math.Min(0, p.Min(q => q.ShapeRms) * 1000), p.Length == 0 ? 1 : Math.Max(p.Max(q => q.ShapeRms) * 1000, 1e-9));
}
