using NetTopologySuite.Geometries;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Unfolding;

namespace Tessel.Core.Sheets;

/// <summary>Which face of the boards the hinge film or fabric is glued to.</summary>
public enum HingeSide
{
    /// <summary>On the top side (the side the target's normal points to).</summary>
    Top,
    /// <summary>On the underside.</summary>
    Bottom,
}

/// <summary>Settings for thick-panel output: rigid boards hinged on film or fabric.</summary>
/// <param name="BoardThicknessMm">Board thickness t at model scale.</param>
/// <param name="Hinge">Face the hinge layer is on.</param>
/// <param name="InsideGapMm">Gap between boards where the hinge is on the inside of the fold
/// (0.3-0.5 mm, docs/reference/fabrication.md [M]); also the least gap anywhere.</param>
/// <param name="KerfMm">Width the cutter removes: each panel outline is drawn kerf/2 outside the panel so
/// that the cut board has the panel's size and the hinge gaps stay as computed.</param>
public sealed record ThickPanelSettings(double BoardThicknessMm, HingeSide Hinge = HingeSide.Top, double InsideGapMm = 0.4,
    double KerfMm = 0);

/// <summary>Board panels for every facet, on the same sheets and in the same place as the crease layout.</summary>
/// <param name="Sheets">One sheet per layout sheet (Side "boards"): panel outlines to cut, part outlines as
/// annotation (the hinge layer's template).</param>
/// <param name="Panels">#F panel outline of each facet in sheet mm (open ring); empty when the facet vanishes.</param>
/// <param name="EdgeGapMm">#E total gap between the two boards at each edge (0 on the boundary).</param>
/// <param name="Warnings">Facets that vanish at this board thickness.</param>
public sealed record ThickPanelResult(Sheet[] Sheets, Vec2[][] Panels, double[] EdgeGapMm, string[] Warnings);

/// <summary>Square-edged thick panels (docs/reference/fabrication.md "Thick panels"; Lang et al., Appl. Mech. Rev. 70(1),
/// 2018): where the hinge lies on the outside of a fold of angle rho the boards must stand
/// g = 2 t sin(rho/2) apart on the hinge face, so each board's edge moves back g/2; where it lies on the
/// inside a small fixed gap suffices (also the least gap used on the outside, for nearly flat folds). Each facet's panel is its polygon
/// clipped back from every edge by that edge's setback, so facets are taken as convex.</summary>
public static class ThickPanels
{
    /// <summary>Side name of the board sheets: "sheet-01-boards".</summary>
    public const string BoardsSide = "boards";

    /// <summary>Panels smaller than this (mm^2) count as vanished: a sliver left by the strips' floating-point ends.</summary>
    private const double VanishedAreaMm2 = 1e-6;

    /// <summary>Least gap on the hinge face for square edges with the hinge outside a fold of angle rho (radians).</summary>
    public static double OutsideGap(double thicknessMm, double rho) => 2 * thicknessMm * Math.Sin(Math.Abs(rho) / 2);

    /// <summary>Builds the panels for a layout made from <paramref name="pattern"/>; fold angles come from
    /// the pattern's folded mesh.</summary>
    public static ThickPanelResult Build(FlatPattern pattern, SheetLayoutResult layout, ThickPanelSettings settings)
    {
        var mesh = pattern.Folded;
        var gaps = new double[mesh.EdgeCount];
        var edgeOf = new Dictionary<(int, int), int>();
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            var (v0, v1) = pattern.Edge(e);
            edgeOf[(v0, v1)] = e;
            if (!mesh.IsInterior(e)) continue;
            double rho = mesh.FoldAngle(e);
            // A mountain (rho > 0) is convex on the top side: a top hinge is then on the outside.
            bool hingeOutside = rho > 0 ? settings.Hinge == HingeSide.Top : settings.Hinge == HingeSide.Bottom;
            gaps[e] = hingeOutside ? Math.Max(OutsideGap(settings.BoardThicknessMm, rho), settings.InsideGapMm) : settings.InsideGapMm;
        }

        var panels = new Vec2[mesh.FaceCount][];
        var warnings = new List<string>();
        var sheets = new List<Sheet>();
        foreach (var sheetNumber in layout.Parts.Select(p => p.Sheet).Distinct().OrderBy(n => n))
        {
            var lines = new List<SheetLine>();
            foreach (var part in layout.Parts.Where(p => p.Sheet == sheetNumber).OrderBy(p => p.Number))
            {
                lines.Add(new SheetLine(LineClass.Annotation, part.Outline, true));
                foreach (int f in part.Faces)
                {
                    var face = mesh.Faces[f];
                    var ring = face.Select(v => part.VertexPositions[Array.BinarySearch(part.Vertices, v)]).ToArray();
                    var centre = PatternSplitter.Centroid(ring);
                    var panel = ring;
                    for (int k = 0; k < face.Length && panel.Length >= 3; k++)
                    {
                        int a = face[k], b = face[(k + 1) % face.Length];
                        double setback = gaps[edgeOf[a < b ? (a, b) : (b, a)]] / 2;
                        if (setback <= 0) continue;
                        panel = KeepBeyond(panel, ring[k], ring[(k + 1) % face.Length], setback, centre);
                    }
                    if (panel.Length >= 3 && Math.Abs(SignedArea(panel)) > VanishedAreaMm2)
                    {
                        panels[f] = panel;
                        var cut = settings.KerfMm > 0 && NtsGeometry.Polygon(panel).Buffer(settings.KerfMm / 2, KerfJoin) is Polygon wider
                            ? NtsGeometry.OpenRing(wider.ExteriorRing) : panel;
                        lines.Add(new SheetLine(LineClass.CutOutline, cut, true));
                    }
                    else
                    {
                        panels[f] = [];
                        warnings.Add($"facet {f} vanishes at a board thickness of {settings.BoardThicknessMm} mm");
                    }
                }
            }
            // Annotations first, then the cuts, as on the crease sheets.
            var ordered = lines.Where(l => l.Class == LineClass.Annotation).Concat(lines.Where(l => l.Class != LineClass.Annotation)).ToArray();
            var like = layout.Sheets.First(s => s.Number == sheetNumber);
            sheets.Add(new Sheet(sheetNumber, like.WidthMm, like.HeightMm, ordered) { Side = BoardsSide, Utilisation = like.Utilisation });
        }
        for (int f = 0; f < panels.Length; f++) panels[f] ??= [];
        return new ThickPanelResult(sheets.ToArray(), panels, gaps, warnings.ToArray());
    }

    /// <summary>Mitred corners keep a panel's corners sharp when the outline moves out by half the kerf.</summary>
    private static readonly NetTopologySuite.Operation.Buffer.BufferParameters KerfJoin =
        new() { JoinStyle = NetTopologySuite.Operation.Buffer.JoinStyle.Mitre, MitreLimit = 4 };

    /// <summary>The part of convex <paramref name="polygon"/> at least <paramref name="depth"/> from the line
    /// through p and q, on the side of <paramref name="inside"/> (one Sutherland-Hodgman clip: exact for convex
    /// facets, and free of the noding failures a polygon difference meets on nearly parallel edges).</summary>
    private static Vec2[] KeepBeyond(Vec2[] polygon, Vec2 p, Vec2 q, double depth, Vec2 inside)
    {
        var n = (q - p).Normalized().Perp;
        if (Vec2.Dot(inside - p, n) < 0) n = -n;
        double Height(Vec2 x) => Vec2.Dot(x - p, n) - depth;
        var kept = new List<Vec2>();
        for (int i = 0; i < polygon.Length; i++)
        {
            Vec2 a = polygon[i], b = polygon[(i + 1) % polygon.Length];
            double ha = Height(a), hb = Height(b);
            if (ha >= 0) kept.Add(a);
            if ((ha >= 0) != (hb >= 0)) kept.Add(a + ha / (ha - hb) * (b - a));
        }
        return kept.ToArray();
    }

    private static double SignedArea(Vec2[] ring)
    {
        double twice = 0;
        for (int i = 0; i < ring.Length; i++) twice += Vec2.Cross(ring[i], ring[(i + 1) % ring.Length]);
        return twice / 2;
    }
}
