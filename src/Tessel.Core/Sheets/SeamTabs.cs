using NetTopologySuite.Geometries;
using Tessel.Core.Model;
using NtsShape = NetTopologySuite.Geometries.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>The seams (one per interior edge between two parts) and the glue tab of each.</summary>
/// <param name="Edges">Mesh edge of each seam, ascending; the seam's index gives its code.</param>
/// <param name="TabPart">Part (from 0) that carries each seam's tab.</param>
/// <param name="Tabs">Each seam's tab, mm, model frame.</param>
/// <param name="TabsOfPart">Tab polygons on each part, in seam order.</param>
/// <param name="OverlappingCodes">Codes of the seams whose tab overlaps or comes too close on both sides.</param>
/// <param name="Clearance">Gap, mm, a tab keeps from the rest of its part: <see cref="SheetLayout.TabClearanceMm"/> plus the kerf.</param>
internal sealed record SeamTabs(int[] Edges, int[] TabPart, GlueTab[] Tabs, List<Polygon>[] TabsOfPart, List<string> OverlappingCodes, double Clearance)
{
    /// <summary>Share of the clearance a tab must keep from other edges and tabs of its part to count as
    /// clean: a little under the full clearance, as the tab is built to keep exactly that.</summary>
    private const double ClearanceShare = 0.9;

    /// <summary>How far a tab is shrunk, mm, before testing it against its part's facets: it shares its root
    /// with its own facet, so the unshrunk tab always touches it.</summary>
    private const double RootShrinkMm = 1e-3;

    /// <summary>The warning for tabs that overlap, or null when every tab is clean.</summary>
    public string? Warning => OverlappingCodes.Count > 0
        ? $"{OverlappingCodes.Count} glue tab(s) overlap or come within {Clearance:0.##} mm of their own part or another tab: seams {string.Join(", ", OverlappingCodes)}"
        : null;

    /// <summary>Finds the seams and puts each tab on the lower-numbered part unless it overlaps there.</summary>
    public static SeamTabs Place(FlatPattern pattern, ModelScalePattern modelPattern, LayoutParts parts, FabricationSettings settings, double rootOffset)
    {
        var mesh = pattern.Folded;
        var model = modelPattern.Vertices;
        var facePolys = modelPattern.Faces;
        var partOf = parts.PartOf;
        int partCount = parts.Count;
        var faceShapes = facePolys.Select(NtsGeometry.Polygon).ToArray();

        var seamEdges = Enumerable.Range(0, mesh.EdgeCount).Where(e => mesh.IsInterior(e) && partOf[mesh.EdgeFaceLeft[e]] != partOf[mesh.EdgeFaceRight[e]]).ToArray();
        var seamTabPart = new int[seamEdges.Length];
        var seamTabs = new GlueTab[seamEdges.Length];
        var tabsOfPart = Enumerable.Range(0, partCount).Select(_ => new List<Polygon>()).ToArray();
        var overlappingCodes = new List<string>();
        double clearance = SheetLayout.TabClearanceMm + settings.KerfMm;
        var outlineEdges = OutlineEdges(pattern, model, partOf, partCount);
        for (int s = 0; s < seamEdges.Length; s++)
        {
            int e = seamEdges[s];
            var (v0, v1) = pattern.Edge(e);
            int fl = mesh.EdgeFaceLeft[e], fr = mesh.EdgeFaceRight[e];
            int[] sides = partOf[fl] < partOf[fr] ? [fl, fr] : [fr, fl];
            GlueTab? chosen = null; int chosenPart = -1; bool clean = false;
            foreach (int tabFace in sides)
            {
                int matingFace = tabFace == fl ? fr : fl;
                var tab = GlueTab.Build(model[v0], model[v1], facePolys[matingFace], settings.TabWidthMm, settings.TabTaperDegrees * Math.PI / 180, rootOffset, clearance);
                int part = partOf[tabFace];
                // No facet of the part under the tab core, and every other outline edge and tab of the part
                // clear by nearly the clearance.
                var shape = NtsGeometry.Polygon(tab.Polygon);
                var core = shape.Buffer(-RootShrinkMm);
                double gap = ClearanceShare * clearance;
                bool overlaps = parts.Faces[part].Any(f => Overlaps(core, faceShapes[f]))
                    || outlineEdges[part].Any(o => o.Edge != e && Near(shape, o.Segment, gap))
                    || tabsOfPart[part].Any(o => Near(shape, o, gap));
                if (chosen is null || !overlaps) { chosen = tab; chosenPart = part; clean = !overlaps; }
                if (!overlaps) break;
            }
            seamTabs[s] = chosen!;
            seamTabPart[s] = chosenPart;
            tabsOfPart[chosenPart].Add(NtsGeometry.Polygon(chosen!.Polygon));
            if (!clean) overlappingCodes.Add(SheetLayout.SeamCode(s));
        }
        return new SeamTabs(seamEdges, seamTabPart, seamTabs, tabsOfPart, overlappingCodes, clearance);
    }

    /// <summary>Edges on each part's outline (seams and the pattern's own boundary), as segments.</summary>
    private static List<(int Edge, LineString Segment)>[] OutlineEdges(FlatPattern pattern, Geometry.Vec2[] model, int[] partOf, int partCount)
    {
        var mesh = pattern.Folded;
        var outlineEdges = Enumerable.Range(0, partCount).Select(_ => new List<(int Edge, LineString Segment)>()).ToArray();
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            int fl = mesh.EdgeFaceLeft[e], fr = mesh.EdgeFaceRight[e];
            var (a, b) = pattern.Edge(e);
            var segment = NtsGeometry.Factory.CreateLineString([new Coordinate(model[a].X, model[a].Y), new Coordinate(model[b].X, model[b].Y)]);
            if (fl < 0 || fr < 0) { outlineEdges[partOf[Math.Max(fl, fr)]].Add((e, segment)); continue; }
            if (partOf[fl] == partOf[fr]) continue;
            outlineEdges[partOf[fl]].Add((e, segment));
            outlineEdges[partOf[fr]].Add((e, segment));
        }
        return outlineEdges;
    }

    /// <summary>True when the (slightly shrunk) tab core meets another polygon.</summary>
    private static bool Overlaps(NtsShape core, NtsShape other) =>
        core.EnvelopeInternal.Intersects(other.EnvelopeInternal) && NtsGeometry.Intersects(core, other);

    /// <summary>True when two shapes come closer than <paramref name="gap"/> (or overlap).</summary>
    private static bool Near(NtsShape a, NtsShape b, double gap)
    {
        var env = new Envelope(a.EnvelopeInternal);
        env.ExpandBy(gap);
        if (!env.Intersects(b.EnvelopeInternal)) return false;
        try { return a.IsWithinDistance(b, gap); }
        catch (TopologyException) { return true; }
    }
}
