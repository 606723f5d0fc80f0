using SkiaSharp;
using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Output.Sheets;

/// <summary>Draws a sheet's lines on a SkiaSharp canvas whose units are millimetres, with the style
/// table's colours, stroke width and display dashes; shared by the PDF and PNG writers so both show
/// the same drawing.</summary>
internal static class SkiaSheetPainter
{
    /// <summary>Paints every line of <paramref name="sheet"/>, layer by layer in fabrication order.</summary>
    /// <param name="minimumStrokeMm">Lower bound on the drawn width, e.g. one device pixel for a raster,
    /// so that a 0.05 mm hairline does not fade to an almost invisible anti-aliased grey.</param>
    public static void Paint(SKCanvas canvas, Sheet sheet, LineStyleTable styles, double minimumStrokeMm)
    {
        foreach (LineClass lineClass in LineStyleTable.FabricationOrder)
        {
            LineStyle style = styles[lineClass];
            var (r, g, b) = style.Rgb;
            double[] dashes = styles.DashLengthsMm(lineClass);
            using SKPathEffect? dash = dashes.Length > 0 ? SKPathEffect.CreateDash(dashes.Select(d => (float)d).ToArray(), 0) : null;
            using var paint = new SKPaint
            {
                Color = new SKColor(r, g, b),
                Style = SKPaintStyle.Stroke,
                StrokeWidth = (float)Math.Max(styles.StrokeWidthMm, minimumStrokeMm),
                StrokeCap = SKStrokeCap.Butt,
                StrokeJoin = SKStrokeJoin.Round,
                IsAntialias = true,
                PathEffect = dash,
            };
            // One path per line so every line starts its dash pattern afresh, as in the SVG.
            foreach (SheetLine line in SheetWriterGuard.LinesOf(sheet, lineClass))
            {
                using var builder = new SKPathBuilder();
                builder.MoveTo((float)line.Points[0].X, (float)line.Points[0].Y);
                for (int i = 1; i < line.Points.Length; i++)
                    builder.LineTo((float)line.Points[i].X, (float)line.Points[i].Y);
                if (line.Closed) builder.Close();
                using SKPath path = builder.Detach();
                canvas.DrawPath(path, paint);
            }
        }
    }
}
