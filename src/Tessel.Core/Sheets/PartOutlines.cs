using NetTopologySuite.Geometries;
using NetTopologySuite.Operation.Buffer;
using NtsShape = NetTopologySuite.Geometries.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>The line the cutter follows round each part: the part and its tabs, grown by half the kerf.</summary>
internal static class PartOutlines
{
    /// <summary>Mitre limit of the kerf offset, in offsets: long enough to keep the sharp corners of facets
    /// and tabs, short enough that a very acute corner does not grow a long spike.</summary>
    private const double KerfMitreLimit = 4;

    /// <summary>Each part's outline with its tabs, grown by half of <paramref name="kerfMm"/> with sharp
    /// corners kept; an outline that is not a valid polygon is kept and warned about.</summary>
    /// <exception cref="UncuttableLayoutException">When a part and its tabs do not make one piece.</exception>
    public static Polygon[] Build(LayoutParts parts, SeamTabs seams, double kerfMm, List<string> warnings)
    {
        var outlines = new Polygon[parts.Count];
        for (int p = 0; p < parts.Count; p++)
        {
            NtsShape g = NtsGeometry.UnionSnapped(new[] { parts.Shapes[p] }.Concat(seams.TabsOfPart[p]));
            if (kerfMm > 0)
                g = g.Buffer(kerfMm / 2, new BufferParameters { JoinStyle = JoinStyle.Mitre, MitreLimit = KerfMitreLimit });
            if (g is not Polygon poly)
                throw new UncuttableLayoutException($"part {p + 1} does not make one closed outline with its tabs ({g.GeometryType}), so it cannot be cut as one piece");
            if (!poly.IsValid) warnings.Add($"part {p + 1} outline is not a valid polygon");
            outlines[p] = poly;
        }
        return outlines;
    }
}
