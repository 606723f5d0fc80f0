using NetTopologySuite.Geometries;
using Tessel.Core.Geometry;
using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>The sheets put together, and the lengths the laser runs over them, mm.</summary>
/// <param name="Sheets">Per sheet number the back job (when there is one) and then the front job.</param>
/// <param name="Utilisation">Share of each sheet's usable area covered by part outlines.</param>
internal sealed record AssembledSheets(Sheet[] Sheets, double[] Utilisation,
    double OutlineCut, double InnerCut, double Score, double BackScore, double PerforationCut, double LabelLength, double Travel);

/// <summary>Puts the line work onto sheets in cutting order: passes in job order, within a pass the line
/// classes in the writers' layer order, and within each class the nearest line next.</summary>
internal static class SheetAssembly
{
    /// <summary>Least length, mm, of a registration mark's arm.</summary>
    private const double MinimumMarkArmMm = 3;

    public static AssembledSheets Assemble(List<PendingLine> lines, PartPacking packing, Polygon[] outlines, SheetArea area, FabricationSettings settings)
    {
        int partCount = outlines.Length, sheetCount = packing.SheetCount;
        double sheetW = area.SheetWidth, sheetH = area.SheetHeight;
        var placements = packing.Placements;
        var sheets = new List<Sheet>();
        double outlineCut = 0, innerCut = 0, score = 0, backScore = 0, perfCut = 0, labelLength = 0, travel = 0;
        var utilisation = new double[sheetCount];
        for (int sh = 0; sh < sheetCount; sh++)
        {
            var onSheet = Enumerable.Range(0, partCount).Where(p => placements[p].Bin == sh).ToArray();
            utilisation[sh] = onSheet.Sum(p => outlines[p].Area) / (area.UsableWidth * area.UsableHeight);
            // Passes in job order; within a pass, classes in the writers' layer order (they write one layer
            // per class in that order), so the order here is the order in the files.
            var sorted = lines.Where(l => placements[l.Part].Bin == sh)
                .OrderBy(l => l.Pass).ThenBy(l => ClassRank(l.Class)).ThenBy(l => l.Part).ThenBy(l => l.Order).ToList();
            // Within each pass and class, nearest line next: the front job starts at the sheet's top-left
            // corner, the back job at its own top-left, which is the front's top-right.
            var sheetLines = new List<PendingLine>();
            Vec2 atFront = Vec2.Zero, atBack = new(sheetW, 0);
            foreach (var group in sorted.GroupBy(l => (l.Pass, l.Class)))
            {
                if (group.Key.Pass is LaserPass.BackLabel or LaserPass.BackScore) sheetLines.AddRange(NearestFirst(group.ToList(), ref atBack));
                else sheetLines.AddRange(NearestFirst(group.ToList(), ref atFront));
            }
            var marks = settings.NeedsBackJob ? RegistrationMarks(sheetW, sheetH, area.Margin) : [];
            var front = marks.Concat(sheetLines.Where(l => l.Pass is not (LaserPass.BackScore or LaserPass.BackLabel)).Select(l => new SheetLine(l.Class, l.Points, l.Closed))).ToArray();
            foreach (var l in sheetLines)
            {
                double len = PolygonMeasures.PathLength(l.Points, l.Closed);
                switch (l.Pass)
                {
                    case LaserPass.OutlineCut: outlineCut += len; break;
                    case LaserPass.InnerCut: innerCut += len; break;
                    case LaserPass.PerforationCut: perfCut += len; break;
                    case LaserPass.Score: score += len; break;
                    case LaserPass.BackScore: backScore += len; break;
                    case LaserPass.Label or LaserPass.BackLabel: labelLength += len; break;
                }
            }
            if (settings.NeedsBackJob)
            {
                var back = marks.Concat(sheetLines.Where(l => l.Pass is LaserPass.BackScore or LaserPass.BackLabel)
                    .Select(l => new SheetLine(l.Class, l.Points.Select(q => new Vec2(sheetW - q.X, q.Y)).ToArray(), l.Closed))).ToArray();
                travel += TravelLength(back);
                sheets.Add(new Sheet(sh + 1, sheetW, sheetH, back) { Side = "back", Utilisation = utilisation[sh] });
            }
            travel += TravelLength(front);
            sheets.Add(new Sheet(sh + 1, sheetW, sheetH, front) { Side = "front", Utilisation = utilisation[sh] });
        }
        return new AssembledSheets(sheets.ToArray(), utilisation, outlineCut, innerCut, score, backScore, perfCut, labelLength, travel);
    }

    private static int ClassRank(LineClass c)
    {
        int i = LineStyleTable.FabricationOrder.ToList().IndexOf(c);
        return i < 0 ? int.MaxValue : i;
    }

    /// <summary>Orders a pass greedily: from the head's position, the line whose start (or, for open lines, end)
    /// is nearest goes next, open lines turned round when entered from their end. Ties keep the earlier line.</summary>
    private static List<PendingLine> NearestFirst(List<PendingLine> group, ref Vec2 at)
    {
        var used = new bool[group.Count];
        var result = new List<PendingLine>(group.Count);
        for (int n = 0; n < group.Count; n++)
        {
            int best = -1; bool reverse = false; double bestD = double.PositiveInfinity;
            for (int i = 0; i < group.Count; i++)
            {
                if (used[i]) continue;
                var pts = group[i].Points;
                double d = (pts[0] - at).Length;
                if (d < bestD) { bestD = d; best = i; reverse = false; }
                if (!group[i].Closed)
                {
                    double e = (pts[^1] - at).Length;
                    if (e < bestD) { bestD = e; best = i; reverse = true; }
                }
            }
            used[best] = true;
            var line = reverse ? group[best] with { Points = group[best].Points.Reverse().ToArray() } : group[best];
            result.Add(line);
            at = line.Closed ? line.Points[0] : line.Points[^1];
        }
        return result;
    }

    /// <summary>L-shaped corner marks just inside the margin, symmetric under x' = W - x so front and back
    /// jobs can be checked against each other.</summary>
    private static SheetLine[] RegistrationMarks(double w, double h, double margin)
    {
        double d = margin / 2, arm = Math.Max(MinimumMarkArmMm, margin / 2);
        return
        [
            new SheetLine(LineClass.Annotation, [new(d + arm, d), new(d, d), new(d, d + arm)]),
            new SheetLine(LineClass.Annotation, [new(w - d - arm, d), new(w - d, d), new(w - d, d + arm)]),
            new SheetLine(LineClass.Annotation, [new(d + arm, h - d), new(d, h - d), new(d, h - d - arm)]),
            new SheetLine(LineClass.Annotation, [new(w - d - arm, h - d), new(w - d, h - d), new(w - d, h - d - arm)]),
        ];
    }

    /// <summary>Beam-off travel through a job: from the sheet's corner to each line's start in order.
    /// Annotation and flat-crease lines are drawn, not lasered, and are skipped.</summary>
    internal static double TravelLength(IEnumerable<SheetLine> job)
    {
        var at = Vec2.Zero;
        double travel = 0;
        foreach (var l in job)
        {
            if (l.Class is LineClass.Annotation or LineClass.FlatCrease || l.Points.Length == 0) continue;
            travel += (l.Points[0] - at).Length;
            at = l.Closed ? l.Points[0] : l.Points[^1];
        }
        return travel;
    }
}
