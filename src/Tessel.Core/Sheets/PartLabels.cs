using Tessel.Core.Geometry;
using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>The labels put on parts: seam codes beside their edges and part numbers with an up arrow.</summary>
internal static class PartLabels
{
    /// <summary>Slack, radians, when turning an angle upright, so a label at exactly a quarter turn keeps one reading.</summary>
    private const double UprightSlack = 1e-12;

    /// <summary>A seam code inside the facet beside its edge, baseline along the edge, shrunk to fit.</summary>
    public static SheetLabel EdgeLabel(string code, Vec2 p, Vec2 q, Vec2[] facet, double height, Func<Vec2, Vec2> place, int sheet)
    {
        var edge = q - p;
        double length = edge.Length;
        var inward = edge.Perp / length;
        var mid = (p + q) / 2;
        if (Vec2.Dot(PatternSplitter.Centroid(facet) - mid, inward) < 0) inward = -inward;
        double depth = facet.Max(v => Vec2.Dot(v - p, inward));
        double h = Math.Min(height, Math.Min(0.8 * length / StrokeFont.Measure(code, 1), 0.4 * depth));
        var centre = place(mid + (0.8 * h) * inward);
        var dir = place(q) - place(p);
        return new SheetLabel(sheet, code, centre, h, Upright(Math.Atan2(dir.Y, dir.X)), LabelPurpose.SeamCode);
    }

    /// <summary>Part number on the largest facet and an arrow beside it pointing to the pattern's top edge
    /// (+y of the flat pattern), so parts can be turned the same way before gluing.</summary>
    public static (SheetLabel Number, Vec2[][] Arrow) PartMark(int part, int[] faces, Vec2[][] facePolys, double height, double angle, Func<Vec2, Vec2> place, int sheet)
    {
        int largest = faces.OrderByDescending(f => Math.Abs(PolygonMeasures.SignedArea(facePolys[f]))).ThenBy(f => f).First();
        var c = place(PatternSplitter.Centroid(facePolys[largest]));
        string text = (part + 1).ToString(System.Globalization.CultureInfo.InvariantCulture);
        double h = Math.Min(1.5 * height, 0.3 * PolygonMeasures.MinimumWidth(facePolys[largest]));
        h = Math.Min(h, 0.3 * PolygonMeasures.MaxWidth(facePolys[largest]) / (StrokeFont.Measure(text, 1) + 1.5));
        var up = new Vec2(0, -1).Rotated(angle);
        var baseline = up.Rotated(Math.PI / 2);
        double textHalf = StrokeFont.Measure(text, h) / 2;
        var numberCentre = c - (0.5 * h) * baseline;
        var arrowCentre = c + (textHalf + 0.2 * h) * baseline;
        var tail = arrowCentre - (0.6 * h) * up;
        var tip = arrowCentre + (0.6 * h) * up;
        Vec2[][] arrow =
        [
            [tail, tip],
            [tip - (0.35 * h) * up - (0.25 * h) * baseline, tip, tip - (0.35 * h) * up + (0.25 * h) * baseline],
        ];
        return (new SheetLabel(sheet, text, numberCentre, h, Upright(Math.Atan2(baseline.Y, baseline.X)), LabelPurpose.PartNumber), arrow);
    }

    /// <summary><paramref name="a"/> turned by half turns into (-pi/2, pi/2], so text never reads upside down.</summary>
    public static double Upright(double a)
    {
        while (a > Math.PI / 2 + UprightSlack) a -= Math.PI;
        while (a <= -Math.PI / 2 + UprightSlack) a += Math.PI;
        return a;
    }
}
