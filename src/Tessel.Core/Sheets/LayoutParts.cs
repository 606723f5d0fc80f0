using Tessel.Core.Geometry;
using NtsShape = NetTopologySuite.Geometries.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>The pattern cut into parts that each fit a sheet with their tabs.</summary>
/// <param name="PartOf">#F part number of each face, numbered from 0 by lowest face.</param>
/// <param name="Count">Number of parts.</param>
/// <param name="Faces">Faces of each part, ascending.</param>
/// <param name="Shapes">Union of each part's faces, mm.</param>
internal sealed record LayoutParts(int[] PartOf, int Count, int[][] Faces, NtsShape[] Shapes)
{
    /// <summary>Splits <paramref name="model"/> (or takes <paramref name="givenParts"/>) into parts.</summary>
    public static LayoutParts Split(ModelScalePattern model, SheetArea area, double spacing, int[]? givenParts)
    {
        var facePolys = model.Faces;
        var partOf = givenParts ?? ChooseSplit(facePolys, model.Neighbours, area.UsableWidth, area.UsableHeight, area.Allowance, spacing);
        int partCount = partOf.Length == 0 ? 0 : partOf.Max() + 1;
        var partFaces = Enumerable.Range(0, partCount).Select(p => Enumerable.Range(0, partOf.Length).Where(f => partOf[f] == p).ToArray()).ToArray();
        var partPolys = partFaces.Select(fs => NtsGeometry.UnionOfFaces(fs.Select(f => NtsGeometry.Polygon(facePolys[f])).ToArray())).ToArray();
        return new LayoutParts(partOf, partCount, partFaces, partPolys);
    }

    /// <summary>Splits for the full usable area, its halves and thirds each way and its quarter, and keeps the split whose parts
    /// (boxed with the tab allowance) pack onto the fewest sheets, then the one with fewest parts: smaller
    /// parts sometimes pair up on a sheet where larger ones each need their own.</summary>
    private static int[] ChooseSplit(Vec2[][] facePolys, int[][] neighbours, double usableW, double usableH, double allowance, double spacing)
    {
        double w = usableW - allowance, h = usableH - allowance;
        (double W, double H)[] targets = [(w, h), (w, h / 2), (w / 2, h), (w / 2, h / 2), (w, h / 3), (w / 3, h)];
        int[]? best = null; int bestSheets = int.MaxValue, bestParts = int.MaxValue;
        foreach (var (tw, th) in targets)
        {
            int[] partOf;
            try { partOf = PatternSplitter.Split(facePolys, neighbours, tw, th); }
            catch (InvalidOperationException) when (best is not null) { continue; }
            int parts = partOf.Max() + 1;
            var items = new (double, double)[parts];
            for (int p = 0; p < parts; p++)
            {
                var hull = MinimumAreaRectangle.ConvexHull(Enumerable.Range(0, partOf.Length).Where(f => partOf[f] == p).SelectMany(f => facePolys[f]).ToArray());
                var box = MinimumAreaRectangle.FittingBox(hull, w, h) ?? MinimumAreaRectangle.Of(hull);
                items[p] = (box.Width + allowance + spacing, box.Height + allowance + spacing);
            }
            int sheets;
            try { sheets = RectanglePacker.PackBest(items, usableW + spacing, usableH + spacing).Max(pl => pl.Bin) + 1; }
            catch (ArgumentException) { sheets = int.MaxValue - 1; }
            if (sheets < bestSheets || (sheets == bestSheets && parts < bestParts)) { best = partOf; bestSheets = sheets; bestParts = parts; }
        }
        return best!;
    }
}
