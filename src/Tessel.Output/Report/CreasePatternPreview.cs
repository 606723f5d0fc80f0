using SkiaSharp;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Output.Report;

/// <summary>Draws the flat crease pattern with mountain, valley, outline and flat edges in distinct
/// styles, a legend and a scale bar in model millimetres.</summary>
public static class CreasePatternPreview
{
    /// <summary>Renders the pattern of <see cref="ReportModel.FlatPositions"/> (y up, drawn up).</summary>
    public static PreviewImage Render(ReportModel model, int width = 760, int height = 620)
    {
        model.Validate();
        using var pc = new PreviewCanvas(width, height);
        var c = pc.Canvas;
        pc.Text("flat crease pattern", 20, 28, 15, PreviewCanvas.Ink);
        var area = new SKRect(24, 44, width - 24, height - 84);
        int n = model.VertexCount;
        var flat = model.FlatPositions;
        if (n > 0)
        {
            double x0 = double.MaxValue, x1 = double.MinValue, y0 = double.MaxValue, y1 = double.MinValue;
            for (int i = 0; i < n; i++)
            {
                x0 = Math.Min(x0, flat[2 * i]); x1 = Math.Max(x1, flat[2 * i]);
                y0 = Math.Min(y0, flat[2 * i + 1]); y1 = Math.Max(y1, flat[2 * i + 1]);
            }
            double scale = Math.Min(area.Width / Math.Max(x1 - x0, 1e-12), area.Height / Math.Max(y1 - y0, 1e-12));
            double ox = area.MidX - (x0 + x1) / 2 * scale, oy = area.MidY + (y0 + y1) / 2 * scale;
            SKPoint P(int v) => new((float)(ox + flat[2 * v] * scale), (float)(oy - flat[2 * v + 1] * scale));

            // Quiet lines first so folds and the outline stay on top where they meet.
            CreaseRole[] drawOrder = [CreaseRole.Flat, CreaseRole.Valley, CreaseRole.Mountain, CreaseRole.Boundary];
            foreach (var role in drawOrder)
            {
                using var paint = CreaseStyle.Paint(role);
                for (int e = 0; e < model.EdgeRoles.Length; e++)
                    if (model.EdgeRoles[e] == role)
                        c.DrawLine(P(model.EdgeVertices[2 * e]), P(model.EdgeVertices[2 * e + 1]), paint);
            }
            DrawScaleBar(pc, scale, model.ScaleDenominator, area.Left, height - 22);
        }
        DrawLegend(pc, model.EdgeRoles, width - 24, height - 52);
        return new PreviewImage(pc.ToPng(), width, height);
    }

    private static void DrawLegend(PreviewCanvas pc, CreaseRole[] roles, float right, float y)
    {
        (CreaseRole Role, string Name)[] entries =
            [(CreaseRole.Mountain, "mountain"), (CreaseRole.Valley, "valley"), (CreaseRole.Boundary, "outline"), (CreaseRole.Flat, "flat edge")];
        float x = right;
        foreach (var (role, name) in entries.Reverse())
        {
            int count = roles.Count(r => r == role);
            string text = $"{name} ({count})";
            float w = PreviewCanvas.MeasureText(text, 12);
            x -= w;
            pc.Text(text, x, y + 4, 12, PreviewCanvas.Ink);
            x -= 40;
            using var paint = CreaseStyle.Paint(role);
            pc.Canvas.DrawLine(x, y, x + 32, y, paint);
            x -= 22;
        }
    }

    /// <summary>A bar of a round model length, labelled in model mm and full-scale metres.</summary>
    private static void DrawScaleBar(PreviewCanvas pc, double pixelsPerMetre, double n, float left, float y)
    {
        // Aim for a bar about 120 px long, rounded to a 1-2-5 model length.
        double modelMm = NiceTicks.Step(120 / pixelsPerMetre * 1000 / n);
        float len = (float)(modelMm / 1000 * n * pixelsPerMetre);
        using var bar = PreviewCanvas.Stroke(PreviewCanvas.Ink, 2, false);
        pc.Canvas.DrawLine(left, y, left + len, y, bar);
        pc.Canvas.DrawLine(left, y - 5, left, y + 5, bar);
        pc.Canvas.DrawLine(left + len, y - 5, left + len, y + 5, bar);
        string full = (modelMm * n / 1000).ToString("0.###", System.Globalization.CultureInfo.InvariantCulture);
        pc.Text($"{NiceTicks.Label(modelMm, modelMm)} mm at 1:{n.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture)} = {full} m full scale",
            left + len + 10, y + 4, 12, PreviewCanvas.Ink);
    }
}
