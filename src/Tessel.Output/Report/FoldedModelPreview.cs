using SkiaSharp;
using Tessel.Core.Geometry;

namespace Tessel.Output.Report;

/// <summary>Draws the folded model from a fixed oblique direction, faces shaded by their angle to a
/// light and coloured by distance to the target, with a colour bar labelled in millimetres at model
/// scale (left) and at full scale (right).</summary>
/// <remarks>Hidden surfaces are handled by the painter's algorithm: faces are filled far to near by
/// the mean depth of their corners, each followed by its outline so nearer faces hide farther lines.
/// This is exact for the gently folded sheets Tessel makes and can misorder faces that interpenetrate
/// in depth, which a preview can live with.</remarks>
public static class FoldedModelPreview
{
    /// <summary>Renders the preview. The colour bar runs from the smallest to the largest reported
    /// vertex deviation (<see cref="ReportModel.VertexDeviationM"/>).</summary>
    public static ModelPreview Render(ReportModel model, int width = 960, int height = 620)
    {
        model.Validate();
        var (min, max) = DeviationRange.Of(model);

        using var pc = new PreviewCanvas(width, height);
        var c = pc.Canvas;
        int barAreaWidth = 230;
        var modelRect = new SKRect(20, 56, width - barAreaWidth, height - 40);

        pc.Text(model.JobName, 20, 30, 20, PreviewCanvas.Ink);
        pc.Text($"distance to target, coloured; scale 1:{Format(model.ScaleDenominator)}; oblique orthographic view",
            20, 50, 13, new SKColor(95, 95, 100));

        DrawModel(c, model, modelRect, min, max);

        var bar = DrawColourBar(pc, min, max, model.ScaleDenominator, width - barAreaWidth + 70, 90, 28, height - 190);
        pc.Text("cool: below target", width - barAreaWidth + 20, height - 60, 12, new SKColor(60, 60, 66));
        pc.Text("warm: above target", width - barAreaWidth + 20, height - 42, 12, new SKColor(60, 60, 66));
        return new ModelPreview(new PreviewImage(pc.ToPng(), width, height), bar);
    }

    private static void DrawModel(SKCanvas c, ReportModel model, SKRect rect, double min, double max)
    {
        var view = new ObliqueView();
        int n = model.VertexCount;
        var sx = new double[n]; var sy = new double[n]; var depth = new double[n];
        for (int i = 0; i < n; i++)
            (sx[i], sy[i], depth[i]) = view.Project(Vec3.Read(model.FoldedPositions, i));
        if (n == 0) return;

        double x0 = sx.Min(), x1 = sx.Max(), y0 = sy.Min(), y1 = sy.Max();
        // A little air around the model so corners never touch the titles or the colour bar.
        double scale = 0.94 * Math.Min(rect.Width / Math.Max(x1 - x0, 1e-12), rect.Height / Math.Max(y1 - y0, 1e-12));
        double cx = (x0 + x1) / 2, cy = (y0 + y1) / 2;
        var screen = new SKPoint[n];
        for (int i = 0; i < n; i++)
            screen[i] = new SKPoint((float)(rect.MidX + (sx[i] - cx) * scale), (float)(rect.MidY - (sy[i] - cy) * scale));

        var faces = model.Faces;
        var order = new int[faces.Length];
        var faceDepth = new double[faces.Length];
        for (int f = 0; f < faces.Length; f++)
        {
            order[f] = f;
            faceDepth[f] = faces[f].Length == 0 ? 0 : faces[f].Average(v => depth[v]);
        }
        // Far to near; ties broken by face index so the order never depends on the sort's internals.
        Array.Sort(order, (a, b) => faceDepth[a] != faceDepth[b] ? faceDepth[a].CompareTo(faceDepth[b]) : a.CompareTo(b));

        // Light from the upper left, a little toward the camera; both sides of the sheet are lit alike.
        var light = (0.45 * view.Toward + 0.6 * view.Up - 0.45 * view.Right).Normalized();
        // Vertex colours are modulated by the paint colour, so the paint must be white to leave them as they are.
        using var fill = new SKPaint { IsAntialias = false, Color = SKColors.White };
        using var outline = PreviewCanvas.Stroke(new SKColor(50, 50, 56, 200), 0.8f);
        outline.StrokeCap = SKStrokeCap.Round;
        foreach (int f in order)
        {
            var face = faces[f];
            if (face.Length < 3) continue;
            double shade = 0.42 + 0.58 * Math.Abs(Vec3.Dot(FaceNormal(model.FoldedPositions, face), light));
            int triangles = face.Length - 2;
            var pts = new SKPoint[3 * triangles];
            var cols = new SKColor[3 * triangles];
            for (int t = 0; t < triangles; t++)
            {
                // Fan from the first corner, the same split the mesh writers use.
                int[] corners = [face[0], face[t + 1], face[t + 2]];
                for (int k = 0; k < 3; k++)
                {
                    pts[3 * t + k] = screen[corners[k]];
                    cols[3 * t + k] = Shaded(DeviationPalette.Colour(model.VertexDeviationM[corners[k]], min, max), shade);
                }
            }
            c.DrawVertices(SKVertexMode.Triangles, pts, null, cols, fill);
            for (int k = 0; k < face.Length; k++)
                c.DrawLine(screen[face[k]], screen[face[(k + 1) % face.Length]], outline);
        }
    }

    private static ColourBar DrawColourBar(PreviewCanvas pc, double min, double max, double n, int left, int top, int barWidth, int barHeight)
    {
        var c = pc.Canvas;
        int right = left + barWidth, bottom = top + barHeight;
        using (var row = new SKPaint { IsAntialias = false })
        {
            for (int y = top; y < bottom; y++)
            {
                // Top row shows max, bottom row min, exactly.
                double f = barHeight == 1 ? 0 : (double)(y - top) / (barHeight - 1);
                row.Color = DeviationPalette.Colour(max + (min - max) * f, min, max);
                c.DrawRect(new SKRect(left, y, right, y + 1), row);
            }
        }
        using (var frame = PreviewCanvas.Stroke(PreviewCanvas.Ink, 1, false))
            c.DrawRect(new SKRect(left - 0.5f, top - 0.5f, right + 0.5f, bottom + 0.5f), frame);

        pc.Text("model mm", left - 6, top - 24, 12, PreviewCanvas.Ink, SKTextAlign.Right);
        pc.Text("full-scale mm", right + 6, top - 24, 12, PreviewCanvas.Ink);
        pc.Text("deviation", left + barWidth / 2f, top - 44, 13, PreviewCanvas.Ink, SKTextAlign.Center);

        // Labels: both ends always (they are the reported limits), zero when it lies well inside.
        var marks = new List<double> { max, min };
        double span = max - min;
        if (min < 0 && max > 0 && Math.Min(-min, max) > 0.08 * span) marks.Add(0);
        using var tick = PreviewCanvas.Stroke(PreviewCanvas.Ink, 1, false);
        foreach (double v in marks.Distinct())
        {
            float y = span > 0 ? (float)(top + (max - v) / span * (barHeight - 1)) + 0.5f : top + 0.5f;
            c.DrawLine(left - 5, y, left, y, tick);
            c.DrawLine(right, y, right + 5, y, tick);
            pc.Text(DeviationFormat.SignedMm(v * 1000 / n), left - 8, y + 4, 12, PreviewCanvas.Ink, SKTextAlign.Right);
            pc.Text(DeviationFormat.SignedMm(v * 1000), right + 8, y + 4, 12, PreviewCanvas.Ink);
        }
        return new ColourBar(min, max, n, left, top, right, bottom);
    }

    private static Vec3 FaceNormal(double[] positions, int[] face)
    {
        double nx = 0, ny = 0, nz = 0;
        for (int k = 0; k < face.Length; k++)
        {
            var p = Vec3.Read(positions, face[k]); var q = Vec3.Read(positions, face[(k + 1) % face.Length]);
            nx += (p.Y - q.Y) * (p.Z + q.Z);
            ny += (p.Z - q.Z) * (p.X + q.X);
            nz += (p.X - q.X) * (p.Y + q.Y);
        }
        return new Vec3(nx, ny, nz).Normalized();
    }

    private static SKColor Shaded(SKColor c, double shade) =>
        new((byte)Math.Round(c.Red * shade), (byte)Math.Round(c.Green * shade), (byte)Math.Round(c.Blue * shade));

    private static string Format(double n) => n.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture);
}
