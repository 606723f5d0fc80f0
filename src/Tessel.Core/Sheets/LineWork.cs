using NetTopologySuite.Geometries;
using Tessel.Core.Geometry;
using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>Gathers the line work of every part, placed on its sheet: creases, tab folds, outlines, part
/// marks and label strokes, each tagged with its laser pass; and sums the fold lengths by class.</summary>
internal sealed class LineWork
{
    private readonly FabricationSettings _settings;

    public LineWork(FabricationSettings settings) => _settings = settings;

    /// <summary>Every line so far, in the order added.</summary>
    public List<PendingLine> Lines { get; } = [];

    /// <summary>Every label so far with its part, in the order added.</summary>
    public List<(int Part, SheetLabel Label)> Labels { get; } = [];

    /// <summary>Per fold class: its method and the lengths of crease, score and perforation cuts, mm.</summary>
    public Dictionary<LineClass, (FoldMethod Method, double Crease, double Score, double Perf)> FoldTotals { get; } = [];

    /// <summary>Perforated creases too short for the full cut/bridge pattern.</summary>
    public int ShortPerforations { get; private set; }

    /// <summary>A fold from <paramref name="a"/> to <paramref name="b"/> (sheet mm) by <paramref name="method"/>.</summary>
    private void AddFold(int part, int order, LineClass cls, FoldMethod method, Vec2 a, Vec2 b)
    {
        var material = _settings.Material;
        double len = (b - a).Length;
        var t = FoldTotals.GetValueOrDefault(cls, (method, 0, 0, 0));
        t.Crease += len;
        if (method == FoldMethod.Perforate)
        {
            var plan = Perforation.Plan(len, material.PerforationCutMm, material.PerforationBridgeMm, _settings.PerforationVertexZoneMm);
            if (plan.Kind != PerforationKind.Pattern) ShortPerforations++;
            // A perforated fold's layer is sent to the cutter as a cut, so a crease too short even for
            // one slot is left unmarked rather than scored on that layer (it would be cut through).
            var dir = (b - a) / len;
            foreach (var (s0, s1) in plan.Cuts)
            {
                Lines.Add(new PendingLine(part, order, cls, [a + s0 * dir, a + s1 * dir], false, LaserPass.PerforationCut));
                t.Perf += s1 - s0;
            }
        }
        else
        {
            Lines.Add(new PendingLine(part, order, cls, [a, b], false, method == FoldMethod.ScoreFromBack ? LaserPass.BackScore : LaserPass.Score));
            t.Score += len;
        }
        FoldTotals[cls] = t;
    }

    /// <summary>The creases inside parts, ordered by edge: mountain and valley by the settings' fold method
    /// (none when it is null); a crease the fitted model leaves flat is shown, so the facet edges stay
    /// visible, but never folded.</summary>
    public void AddCreases(FlatPattern pattern, Vec2[] model, int[] partOf, PartPacking packing)
    {
        var mesh = pattern.Folded;
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            if (!mesh.IsInterior(e)) continue;
            int fl = mesh.EdgeFaceLeft[e], fr = mesh.EdgeFaceRight[e];
            if (partOf[fl] != partOf[fr]) continue;
            var role = pattern.Role(e);
            var (v0, v1) = pattern.Edge(e);
            int part = partOf[fl];
            if (role == CreaseRole.Flat)
            {
                Lines.Add(new PendingLine(part, e, LineClass.FlatCrease, [packing.Place(part, model[v0]), packing.Place(part, model[v1])], false, LaserPass.Annotation));
                continue;
            }
            if (_settings.MethodFor(role) is not FoldMethod method) continue;
            AddFold(part, e, role == CreaseRole.Mountain ? LineClass.Mountain : LineClass.Valley, method, packing.Place(part, model[v0]), packing.Place(part, model[v1]));
        }
    }

    /// <summary>Each seam's tab fold and its code on both sides of the cut; returns the seams.</summary>
    public Seam[] AddSeams(FlatPattern pattern, ModelScalePattern modelPattern, int[] partOf, SeamTabs tabs, PartPacking packing)
    {
        var mesh = pattern.Folded;
        var model = modelPattern.Vertices;
        var seams = new Seam[tabs.Edges.Length];
        for (int s = 0; s < tabs.Edges.Length; s++)
        {
            int e = tabs.Edges[s], tabPart = tabs.TabPart[s];
            var tab = tabs.Tabs[s];
            AddFold(tabPart, mesh.EdgeCount + s, LineClass.TabFold, _settings.TabFoldMethod, packing.Place(tabPart, tab.FoldFrom), packing.Place(tabPart, tab.FoldTo));
            var (v0, v1) = pattern.Edge(e);
            int fl = mesh.EdgeFaceLeft[e], fr = mesh.EdgeFaceRight[e];
            int matingPart = partOf[fl] == tabPart ? partOf[fr] : partOf[fl];
            string code = SheetLayout.SeamCode(s);
            foreach (int face in new[] { fl, fr })
            {
                int part = partOf[face];
                Labels.Add((part, PartLabels.EdgeLabel(code, model[v0], model[v1], modelPattern.Faces[face], _settings.LabelHeightMm, m => packing.Place(part, m), packing.SheetOf(part))));
            }
            seams[s] = new Seam(code, e, tabPart + 1, matingPart + 1, pattern.Role(e), (model[v1] - model[v0]).Length,
                tab.Polygon.Select(m => packing.Place(tabPart, m)).ToArray());
        }
        return seams;
    }

    private LaserPass LabelPass => _settings.LabelsOnBack ? LaserPass.BackLabel : LaserPass.Label;

    /// <summary>Each part's outline and holes as cuts, its number and its up arrow.</summary>
    public void AddOutlinesAndMarks(Polygon[] outlines, LayoutParts parts, Vec2[][] facePolys, PartPacking packing)
    {
        for (int p = 0; p < parts.Count; p++)
        {
            var outline = outlines[p];
            Lines.Add(new PendingLine(p, 0, LineClass.CutOutline, NtsGeometry.OpenRing(outline.ExteriorRing).Select(m => packing.Place(p, m)).ToArray(), true, LaserPass.OutlineCut));
            for (int h = 0; h < outline.NumInteriorRings; h++)
                Lines.Add(new PendingLine(p, h, LineClass.CutInner, NtsGeometry.OpenRing(outline.GetInteriorRingN(h)).Select(m => packing.Place(p, m)).ToArray(), true, LaserPass.InnerCut));
            var (number, arrow) = PartLabels.PartMark(p, parts.Faces[p], facePolys, _settings.LabelHeightMm, packing.Angles[p], m => packing.Place(p, m), packing.SheetOf(p));
            Labels.Add((p, number));
            foreach (var stroke in arrow) Lines.Add(new PendingLine(p, 0, LineClass.Label, stroke, false, LabelPass));
        }
    }

    /// <summary>Turns every label into single-stroke glyphs. The font turns counter-clockwise as seen, our
    /// angles clockwise. Labels for the back are laid out to read on the back job, then kept in front
    /// coordinates like every other back line (the back job mirrors x' = W - x when the sheets are put together).</summary>
    public void AddLabelStrokes(double sheetWidth)
    {
        if (_settings.LabelsOnBack)
        {
            for (int i = 0; i < Labels.Count; i++)
            {
                var l = Labels[i].Label;
                Labels[i] = (Labels[i].Part, l with { Centre = new Vec2(sheetWidth - l.Centre.X, l.Centre.Y), AngleRadians = PartLabels.Upright(Math.PI - l.AngleRadians), Side = "back" });
            }
        }
        foreach (var (part, label) in Labels)
            foreach (var stroke in StrokeFont.Layout(label.Text, label.Centre, label.HeightMm, -label.AngleRadians, TextAnchor.MiddleCentre))
            {
                var points = _settings.LabelsOnBack ? stroke.Select(q => new Vec2(sheetWidth - q.X, q.Y)).ToArray() : stroke;
                Lines.Add(new PendingLine(part, label.Purpose == LabelPurpose.PartNumber ? 0 : 1, LineClass.Label, points, false, LabelPass));
            }
    }
}
