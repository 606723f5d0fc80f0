using NetTopologySuite.Geometries;
using Tessel.Core.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>Conversions between <see cref="Vec2"/> rings and NetTopologySuite polygons; the single
/// factory the sheet stage uses (floating precision: coordinates are mm with many digits to keep).</summary>
internal static class NtsGeometry
{
    public static readonly GeometryFactory Factory = new(new PrecisionModel(PrecisionModels.Floating));

    /// <summary>A polygon from an open ring (the closing point is added).</summary>
    public static Polygon Polygon(IReadOnlyList<Vec2> ring)
    {
        var coords = new Coordinate[ring.Count + 1];
        for (int i = 0; i < ring.Count; i++) coords[i] = new Coordinate(ring[i].X, ring[i].Y);
        coords[^1] = coords[0].Copy();
        return Factory.CreatePolygon(coords);
    }

    /// <summary>The points of a ring without its closing point.</summary>
    public static Vec2[] OpenRing(LineString ring)
    {
        var c = ring.Coordinates;
        int n = c.Length > 1 && c[0].Equals2D(c[^1]) ? c.Length - 1 : c.Length;
        var r = new Vec2[n];
        for (int i = 0; i < n; i++) r[i] = new Vec2(c[i].X, c[i].Y);
        return r;
    }
}
