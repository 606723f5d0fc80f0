using NetTopologySuite.Geometries;
using NetTopologySuite.Geometries.Utilities;
using NetTopologySuite.Operation.OverlayNG;
using Tessel.Core.Geometry;
using NtsShape = NetTopologySuite.Geometries.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>Conversions between <see cref="Vec2"/> rings and NetTopologySuite polygons, and the polygon
/// operations of the sheet stage made robust: inputs are repaired when invalid, and an overlay that fails in
/// floating point is redone snap-rounded to <see cref="Snap"/>.</summary>
internal static class NtsGeometry
{
    /// <summary>The single factory the sheet stage uses (floating precision: coordinates are mm with many digits to keep).</summary>
    public static readonly GeometryFactory Factory = new(new PrecisionModel(PrecisionModels.Floating));

    /// <summary>Grid of the fallback overlay: 0.1 micrometre (coordinates are mm), a thousandth of the finest
    /// laser spot or kerf (docs/reference/fabrication.md: 0.1-0.3 mm), so snapping never shows on a sheet.</summary>
    public static readonly PrecisionModel Snap = new(1e4);

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

    /// <summary><paramref name="g"/> itself when valid; otherwise its repair (a self-crossing ring becomes the
    /// polygons it encloses, a collapsed one becomes empty).</summary>
    public static NtsShape Repaired(NtsShape g) => g.IsValid ? g : GeometryFixer.Fix(g);

    /// <summary>Union of the shapes, repaired first; floating-point overlay with snapping, then snap-rounding to
    /// <see cref="Snap"/> should that still meet a topology conflict.</summary>
    public static NtsShape Union(IEnumerable<NtsShape> shapes)
    {
        var all = Factory.BuildGeometry(shapes.Select(Repaired).Where(g => !g.IsEmpty).ToArray());
        try { return OverlayNGRobust.Union(all); }
        catch (TopologyException) { return UnaryUnionNG.Union(all, Snap); }
    }

    /// <summary>Union of shapes that meet along edges which are not noded alike (a glue tab's root on part of a
    /// facet's edge): snap-rounded to <see cref="Snap"/>, so touching edges merge instead of leaving a hairline
    /// gap between pieces.</summary>
    public static NtsShape UnionSnapped(IEnumerable<NtsShape> shapes) =>
        UnaryUnionNG.Union(Factory.BuildGeometry(shapes.Select(Repaired).Where(g => !g.IsEmpty).ToArray()), Snap);

    /// <summary>True when the shapes meet; on a topology conflict the test is repeated on repaired shapes,
    /// and a pair that still cannot be decided counts as meeting.</summary>
    public static bool Intersects(NtsShape a, NtsShape b)
    {
        try { return a.Intersects(b); }
        catch (TopologyException)
        {
            try { return Repaired(a).Intersects(Repaired(b)); }
            catch (TopologyException) { return true; }
        }
    }
}
