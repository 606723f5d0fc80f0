using Tessel.Core.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>A glue tab along one seam edge: a trapezoid on the edge's outer side, lying over the mating
/// facet once folded (docs/reference/fabrication.md, "Glue tabs" [CP/M]).</summary>
/// <param name="Polygon">Open ring in mm: the two ends of the root on the seam edge first, then the far side.</param>
/// <param name="FoldFrom">Start of the tab's fold line.</param>
/// <param name="FoldTo">End of the tab's fold line.</param>
/// <param name="WidthMm">Width from the fold line to the far side.</param>
public sealed record GlueTab(Vec2[] Polygon, Vec2 FoldFrom, Vec2 FoldTo, double WidthMm)
{
    /// <summary>Builds the tab on seam edge p-q that folds under <paramref name="matingFacet"/>.</summary>
    /// <param name="p">One end of the seam edge (mm).</param>
    /// <param name="q">The other end.</param>
    /// <param name="matingFacet">Open ring of the facet across the seam, containing p and q as corners.</param>
    /// <param name="tabWidth">Wanted width; capped at a third of the mating facet's width across the edge.</param>
    /// <param name="taperRadians">Angle between tab end and fold line; capped at the mating facet's corner angles.</param>
    /// <param name="rootOffset">Distance the fold line moves out from the edge (t on card thicker than 0.5 mm).</param>
    /// <param name="endClearance">Least distance kept between the tab and the mating facet's other edges at p and q:
    /// the root starts that far from them (clearance / sin of the corner angle along the seam), so a tab never
    /// touches the next seam at a concave part corner, nor the tab of a seam beside it.</param>
    public static GlueTab Build(Vec2 p, Vec2 q, Vec2[] matingFacet, double tabWidth, double taperRadians, double rootOffset,
        double endClearance = 0)
    {
        var edge = q - p;
        double length = edge.Length;
        var u = edge / length;
        var n = u.Perp;
        // The tab lies on the mating facet's side of the edge.
        if (Vec2.Dot(PatternSplitter.Centroid(matingFacet) - p, n) < 0) n = -n;

        double facetWidth = matingFacet.Max(v => Vec2.Dot(v - p, n));
        double width = Math.Min(tabWidth, facetWidth / 3);
        double cornerP = CornerAngle(matingFacet, p, u), cornerQ = CornerAngle(matingFacet, q, -u);
        double taperP = Math.Min(taperRadians, cornerP);
        double taperQ = Math.Min(taperRadians, cornerQ);
        // The tab stays inside the corner's wedge (taper <= corner angle), so starting its root
        // clearance / sin(corner) along the seam keeps it that far from the corner's other edge. At most a
        // quarter of the edge goes to each end.
        double insetP = Math.Min(endClearance / Math.Sin(Math.Min(cornerP, Math.PI / 2)), length / 4);
        double insetQ = Math.Min(endClearance / Math.Sin(Math.Min(cornerQ, Math.PI / 2)), length / 4);
        double rootLength = length - insetP - insetQ;
        double insetPerWidth = 1 / Math.Tan(taperP) + 1 / Math.Tan(taperQ);
        // Keep a far side at least a fifth of the root long, so the tab does not end in a point.
        width = Math.Min(width, 0.8 * rootLength / insetPerWidth);

        var startP = p + insetP * u;
        var startQ = q - insetQ * u;
        var rootP = startP + rootOffset * n;
        var rootQ = startQ + rootOffset * n;
        var farQ = rootQ - (width / Math.Tan(taperQ)) * u + width * n;
        var farP = rootP + (width / Math.Tan(taperP)) * u + width * n;
        Vec2[] ring = rootOffset > 0 ? [startP, startQ, rootQ, farQ, farP, rootP] : [startP, startQ, farQ, farP];
        return new GlueTab(ring, rootP, rootQ, width);
    }

    /// <summary>Interior angle of the facet at corner c between direction <paramref name="along"/> (toward the
    /// seam's other end) and the facet's other edge at c; pi/2 if c is not a corner.</summary>
    private static double CornerAngle(Vec2[] facet, Vec2 c, Vec2 along)
    {
        int i = Array.FindIndex(facet, v => (v - c).Length < 1e-9);
        if (i < 0) return Math.PI / 2;
        var prev = facet[(i + facet.Length - 1) % facet.Length] - c;
        var next = facet[(i + 1) % facet.Length] - c;
        // One neighbour is the seam's other end (along u); the other edge bounds the corner.
        var other = Math.Abs(Vec2.Cross(prev.Normalized(), along)) < 1e-9 && Vec2.Dot(prev, along) > 0 ? next : prev;
        double angle = Math.Acos(Math.Clamp(Vec2.Dot(other.Normalized(), along), -1, 1));
        return angle > 1e-6 ? angle : Math.PI / 2;
    }
}
