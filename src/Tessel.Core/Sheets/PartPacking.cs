using NetTopologySuite.Geometries;
using Tessel.Core.Geometry;
using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>Where each part goes: the sheet, the turn and the shift from the model frame to the sheet.</summary>
/// <param name="Placements">#parts packer placement (bin = sheet from 0).</param>
/// <param name="Angles">#parts turn, radians, applied before the shift.</param>
/// <param name="Offsets">#parts shift, mm.</param>
/// <param name="SheetCount">Number of sheets used.</param>
internal sealed record PartPacking(RectanglePlacement[] Placements, double[] Angles, Vec2[] Offsets, int SheetCount)
{
    /// <summary>Slack, mm, when testing whether a box turned to the grain still fits the usable area.</summary>
    private const double FitSlackMm = 1e-9;

    /// <summary>A point of <paramref name="part"/> in the model frame, on its sheet.</summary>
    public Vec2 Place(int part, Vec2 m) => m.Rotated(Angles[part]) + Offsets[part];

    /// <summary>The sheet number (from 1) <paramref name="part"/> lies on.</summary>
    public int SheetOf(int part) => Placements[part].Bin + 1;

    /// <summary>Turns each part to its smallest box that fits (or to the grain when the settings ask and it
    /// fits), then packs the boxes with the spacing added.</summary>
    /// <exception cref="InvalidOperationException">When a part does not fit the usable area in any turning.</exception>
    public static PartPacking Pack(FlatPattern pattern, ModelScalePattern modelPattern, LayoutParts parts, Polygon[] outlines,
        SheetArea area, FabricationSettings settings, List<string> warnings)
    {
        int partCount = parts.Count;
        double usableW = area.UsableWidth, usableH = area.UsableHeight;
        double spacing = settings.SpacingMm;
        var boxes = new OrientedBox[partCount];
        var hulls = new Vec2[partCount][];
        for (int p = 0; p < partCount; p++)
        {
            hulls[p] = MinimumAreaRectangle.ConvexHull(NtsGeometry.OpenRing(outlines[p].ExteriorRing));
            var faceHull = MinimumAreaRectangle.ConvexHull(parts.Faces[p].SelectMany(f => modelPattern.Faces[f]).ToArray());
            boxes[p] = MinimumAreaRectangle.FittingBox(hulls[p], usableW, usableH, MinimumAreaRectangle.CaliperAngles(faceHull))
                ?? throw new InvalidOperationException($"part {p + 1} does not fit the usable sheet area");
        }
        var fixedTurn = new bool[partCount];
        if (settings.Grain != GrainDirection.Any)
        {
            var offGrain = new List<int>();
            for (int p = 0; p < partCount; p++)
            {
                double family = LongestCreaseFamily(pattern, parts.PartOf, p, modelPattern.Vertices);
                double angle = (settings.Grain == GrainDirection.AlongWidth ? 0 : Math.PI / 2) - family;
                var box = MinimumAreaRectangle.BoxAt(hulls[p], angle);
                if (box.Width <= usableW + FitSlackMm && box.Height <= usableH + FitSlackMm) { boxes[p] = box; fixedTurn[p] = true; }
                else offGrain.Add(p + 1);
            }
            if (offGrain.Count > 0)
                warnings.Add($"{offGrain.Count} part(s) fit the sheet only across the grain: {string.Join(", ", offGrain)}");
        }
        var placements = RectanglePacker.PackBest(boxes.Select(b => (b.Width + spacing, b.Height + spacing)).ToArray(), usableW + spacing, usableH + spacing, fixedTurn);
        int sheetCount = partCount == 0 ? 0 : placements.Max(pl => pl.Bin) + 1;
        var angles = new double[partCount];
        var offsets = new Vec2[partCount];
        for (int p = 0; p < partCount; p++)
        {
            var box = placements[p].Turned ? MinimumAreaRectangle.BoxAt(hulls[p], boxes[p].Angle + Math.PI / 2) : boxes[p];
            angles[p] = box.Angle;
            offsets[p] = new Vec2(area.Margin + placements[p].X, area.Margin + placements[p].Y) - box.Min;
        }
        return new PartPacking(placements, angles, offsets, sheetCount);
    }

    /// <summary>Direction (radians, in [0, pi), model frame) of the part's longest crease family: mountain and
    /// valley edges grouped by direction to the nearest tenth of a degree, summed by length; ties take the
    /// smaller angle.</summary>
    private static double LongestCreaseFamily(FlatPattern pattern, int[] partOf, int part, Vec2[] model)
    {
        var mesh = pattern.Folded;
        var totals = new SortedDictionary<int, double>();
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            if (!mesh.IsInterior(e) || partOf[mesh.EdgeFaceLeft[e]] != part || partOf[mesh.EdgeFaceRight[e]] != part) continue;
            if (pattern.Role(e) is not (CreaseRole.Mountain or CreaseRole.Valley)) continue;
            var (v0, v1) = pattern.Edge(e);
            var d = model[v1] - model[v0];
            double a = Math.Atan2(d.Y, d.X);
            if (a < 0) a += Math.PI;
            int bin = (int)Math.Round(a * 1800 / Math.PI) % 1800;
            totals[bin] = totals.GetValueOrDefault(bin) + d.Length;
        }
        if (totals.Count == 0) return 0;
        var best = totals.First();
        foreach (var kv in totals) if (kv.Value > best.Value + 1e-9) best = kv;
        return best.Key * Math.PI / 1800;
    }
}
