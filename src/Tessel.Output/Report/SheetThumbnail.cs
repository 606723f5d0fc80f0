using SkiaSharp;
using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Output.Report;

/// <summary>A small picture of one fabrication sheet: the paper, and its lines coloured by class, so the
/// report shows what will be cut without opening the sheet files.</summary>
public static class SheetThumbnail
{
    /// <summary>Renders the sheet so its longer side spans <paramref name="longSidePx"/> pixels.
    /// Sheet coordinates are millimetres with y down, as in <see cref="SheetLine"/>.</summary>
    public static PreviewImage Render(Sheet sheet, int longSidePx = 360)
    {
        if (!(sheet.WidthMm > 0 && sheet.HeightMm > 0)) throw new ArgumentException("sheet must have a positive size");
        const int margin = 12, caption = 26;
        double scale = (longSidePx - 2 * margin) / Math.Max(sheet.WidthMm, sheet.HeightMm);
        int w = (int)Math.Ceiling(sheet.WidthMm * scale) + 2 * margin;
        int h = (int)Math.Ceiling(sheet.HeightMm * scale) + 2 * margin + caption;
        using var pc = new PreviewCanvas(w, h);
        var c = pc.Canvas;
        var paper = new SKRect(margin, margin, (float)(margin + sheet.WidthMm * scale), (float)(margin + sheet.HeightMm * scale));
        using (var shadow = PreviewCanvas.Fill(new SKColor(210, 206, 198), false))
            c.DrawRect(new SKRect(paper.Left + 3, paper.Top + 3, paper.Right + 3, paper.Bottom + 3), shadow);
        using (var white = PreviewCanvas.Fill(SKColors.White, false))
            c.DrawRect(paper, white);

        foreach (var line in sheet.Lines)
        {
            if (line.Points.Length < 2) continue;
            using var paint = PaintFor(line.Class);
            var pts = line.Points.Select(p => new SKPoint((float)(margin + p.X * scale), (float)(margin + p.Y * scale))).ToList();
            if (line.Closed) pts.Add(pts[0]);
            c.DrawPoints(SKPointMode.Polygon, pts.ToArray(), paint);
        }
        string size = $"{sheet.WidthMm.ToString("0.#", System.Globalization.CultureInfo.InvariantCulture)} x {sheet.HeightMm.ToString("0.#", System.Globalization.CultureInfo.InvariantCulture)} mm";
        pc.Text($"sheet {sheet.Number} ({sheet.Side}), {size}", margin, h - 9, 12, PreviewCanvas.Ink);
        return new PreviewImage(pc.ToPng(), w, h);
    }

    // Shared, never disposed: a paint does not own its path effect, and these live for the process.
    private static readonly SKPathEffect ValleyDash = SKPathEffect.CreateDash([5, 3], 0);
    private static readonly SKPathEffect TabDots = SKPathEffect.CreateDash([2, 2], 0);

    private static SKPaint PaintFor(LineClass cls)
    {
        var p = cls switch
        {
            LineClass.CutOutline => PreviewCanvas.Stroke(new SKColor(20, 20, 24), 1.2f),
            LineClass.CutInner => PreviewCanvas.Stroke(new SKColor(90, 90, 96), 1f),
            LineClass.Mountain => PreviewCanvas.Stroke(CreaseStyle.Mountain, 1f),
            LineClass.Valley => PreviewCanvas.Stroke(CreaseStyle.Valley, 1f),
            LineClass.TabFold => PreviewCanvas.Stroke(new SKColor(60, 130, 70), 1f),
            LineClass.Label => PreviewCanvas.Stroke(new SKColor(130, 100, 160), 0.8f),
            _ => PreviewCanvas.Stroke(new SKColor(175, 175, 175), 0.8f),
        };
        if (cls == LineClass.Valley) p.PathEffect = ValleyDash;
        if (cls == LineClass.TabFold) p.PathEffect = TabDots;
        p.StrokeJoin = SKStrokeJoin.Round;
        return p;
    }
}
