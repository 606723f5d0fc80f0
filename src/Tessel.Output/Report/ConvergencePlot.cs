using System.Globalization;
using SkiaSharp;

namespace Tessel.Output.Report;

/// <summary>Solver history on a logarithmic axis: the largest constraint residual (solid) and the
/// objective (dashed) against the step number over the whole fit, with a thin grey line where a
/// further solver run (continuation stage, refit, restart) starts. Values that are not positive cannot sit on a log axis and
/// are left out of the lines.</summary>
public static class ConvergencePlot
{
    /// <summary>Colour of the residual line.</summary>
    public static readonly SKColor ResidualColour = new(170, 60, 40);
    /// <summary>Colour of the objective line.</summary>
    public static readonly SKColor ObjectiveColour = new(40, 100, 140);
    /// <summary>Colour of the thin vertical line where a further solver run of the fit starts.</summary>
    public static readonly SKColor RunStartColour = new(120, 120, 120);

    /// <summary>The axes a plot of this history uses: whole decades on y, round iteration ticks on x.</summary>
    public static PlotAxes AxesFor(ConvergenceStep[] steps, int width = 640, int height = 420)
    {
        var (xl, xh, _) = XTicks(steps);
        var (dl, dh) = Decades(steps);
        return new PlotAxes(84, 44, width - 24, height - 60, xl, xh, Math.Pow(10, dl), Math.Pow(10, dh), YLog: true);
    }

    /// <summary>Renders the plot; with no history it draws the axes and says so.</summary>
    public static PreviewImage Render(ConvergenceStep[] steps, int width = 640, int height = 420)
    {
        using var pc = new PreviewCanvas(width, height);
        var axes = AxesFor(steps, width, height);
        var (_, _, xt) = XTicks(steps);
        var (dl, dh) = Decades(steps);
        int every = Math.Max(1, (dh - dl + 7) / 8); // at most about eight labelled decades
        // Count the labelled decades down from the top so the top edge always carries a label.
        var yt = Enumerable.Range(dl, dh - dl + 1).Where(d => (dh - d) % every == 0).Select(d => Math.Pow(10, d)).ToArray();
        axes.Draw(pc, xt, xt.Length > 1 ? xt[1] - xt[0] : 1, yt,
            y => "1e" + ((int)Math.Round(Math.Log10(y))).ToString(CultureInfo.InvariantCulture),
            "solver step", "rad / no unit (log scale)");
        pc.Text("solver convergence", axes.Left, 28, 15, PreviewCanvas.Ink);
        if (steps.Length == 0)
        {
            pc.Text("no solver history in this build", (axes.Left + axes.Right) / 2, (axes.Top + axes.Bottom) / 2, 13, PreviewCanvas.Ink, SKTextAlign.Center);
            return new PreviewImage(pc.ToPng(), width, height);
        }

        var ordered = steps.OrderBy(s => s.Iteration).ToArray();
        using var runStart = PreviewCanvas.Stroke(RunStartColour, 1, antialias: false);
        foreach (var s in ordered.Where(s => s.StartsRun))
        {
            float x = (float)axes.MapX(s.Iteration);
            pc.Canvas.DrawLine(x, (float)axes.Top, x, (float)axes.Bottom, runStart);
        }
        using var residual = PreviewCanvas.Stroke(ResidualColour, 2);
        using var objective = PreviewCanvas.Stroke(ObjectiveColour, 2);
        using var dashes = SKPathEffect.CreateDash([7, 5], 0);
        objective.PathEffect = dashes;
        Series(pc.Canvas, axes, ordered, s => s.MaxResidual, residual);
        Series(pc.Canvas, axes, ordered, s => s.Objective, objective);

        // Legend in the upper right corner of the plot area.
        float lx = axes.Right - 230, ly = axes.Top + 16;
        using var box = PreviewCanvas.Fill(new SKColor(255, 255, 255, 230));
        bool runs = ordered.Any(s => s.StartsRun);
        pc.Canvas.DrawRect(new SKRect(lx - 8, ly - 12, axes.Right - 6, ly + (runs ? 50 : 30)), box);
        if (runs)
        {
            pc.Canvas.DrawLine(lx + 14, ly + 32, lx + 14, ly + 46, runStart);
            pc.Text("a further solver run starts", lx + 36, ly + 44, 12, PreviewCanvas.Ink);
        }
        pc.Canvas.DrawLine(lx, ly, lx + 28, ly, residual);
        pc.Text("largest constraint residual, rad", lx + 36, ly + 4, 12, PreviewCanvas.Ink);
        pc.Canvas.DrawLine(lx, ly + 20, lx + 28, ly + 20, objective);
        pc.Text("objective, no unit", lx + 36, ly + 24, 12, PreviewCanvas.Ink);
        return new PreviewImage(pc.ToPng(), width, height);
    }

    private static void Series(SKCanvas c, PlotAxes axes, ConvergenceStep[] steps, Func<ConvergenceStep, double> value, SKPaint paint)
    {
        var pts = steps.Where(s => value(s) > 0 && double.IsFinite(value(s)))
            .Select(s => new SKPoint(axes.MapX(s.Iteration), axes.MapY(value(s)))).ToArray();
        if (pts.Length == 1) c.DrawCircle(pts[0], 3, paint);
        if (pts.Length > 1) c.DrawPoints(SKPointMode.Polygon, pts, paint);
    }

    private static (double, double, double[]) XTicks(ConvergenceStep[] s)
    {
        if (s.Length == 0) return NiceTicks.For(0, 10);
        var r = NiceTicks.For(Math.Min(0, s.Min(t => t.Iteration)), Math.Max(1, s.Max(t => t.Iteration)));
        return r;
    }

    /// <summary>Whole decades that hold every positive value of both series.</summary>
    private static (int Low, int High) Decades(ConvergenceStep[] steps)
    {
        var values = steps.SelectMany(s => new[] { s.MaxResidual, s.Objective }).Where(v => v > 0 && double.IsFinite(v)).ToArray();
        if (values.Length == 0) return (-6, 0);
        int lo = (int)Math.Floor(Math.Log10(values.Min()) + 1e-12);
        int hi = (int)Math.Ceiling(Math.Log10(values.Max()) - 1e-12);
        if (hi <= lo) hi = lo + 1;
        return (lo, hi);
    }
}
