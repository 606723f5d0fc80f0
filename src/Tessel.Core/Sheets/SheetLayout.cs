using NetTopologySuite.Geometries;
using NtsShape = NetTopologySuite.Geometries.Geometry;
using NetTopologySuite.Operation.Buffer;
using NetTopologySuite.Operation.Union;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;

namespace Tessel.Core.Sheets;

/// <summary>The sheet stage: scales a flat pattern to the model, splits it into parts that fit the sheet,
/// adds glue tabs, nests the parts onto sheets and writes the line work in cutting order.</summary>
public static class SheetLayout
{
    /// <summary>A line with where it belongs while the sheets are put together.</summary>
    private sealed record PendingLine(int Part, int Order, LineClass Class, Vec2[] Points, bool Closed, LineJob Job);

    /// <summary>Which pass of the laser a line belongs to; the enum order is the cutting order.</summary>
    private enum LineJob { Annotation, Label, BackLabel, Score, BackScore, PerforationCut, InnerCut, OutlineCut }

    /// <summary>Least gap, mm, between a glue tab and any other edge or tab of its part once the outline is cut:
    /// room for the blade or beam to separate them, so a seam is cut over its full length (value from memory).
    /// The kerf is added on top, since the outline grows by half a kerf on either side of the gap.</summary>
    public const double TabClearanceMm = 0.5;

    /// <summary>Labels smaller than this (cap height, mm) are warned about as hard to read.</summary>
    public const double MinimumLegibleLabelMm = 1.2;

    /// <summary>Lays out <paramref name="pattern"/> (metres, full scale) on sheets.</summary>
    /// <exception cref="ArgumentException">When the margins and tab allowance leave no room on the sheet.</exception>
    /// <exception cref="InvalidOperationException">When a single facet does not fit the sheet at this scale.</exception>
    public static SheetLayoutResult Lay(FlatPattern pattern, FabricationSettings settings) => Lay(pattern, settings, null);

    /// <summary>As <see cref="Lay(FlatPattern, FabricationSettings)"/>, with the parts given (#F part number
    /// of each face, numbered from 0 by lowest face) instead of found; for tests of seams and tabs.</summary>
    internal static SheetLayoutResult Lay(FlatPattern pattern, FabricationSettings settings, int[]? givenParts)
    {
        if (!(settings.ScaleDenominator > 0)) throw new ArgumentOutOfRangeException(nameof(settings), "scale denominator must be positive");
        if (!(settings.TabWidthMm > 0)) throw new ArgumentOutOfRangeException(nameof(settings), "tab width must be positive");
        if (!(settings.TabTaperDegrees > 0 && settings.TabTaperDegrees < 90)) throw new ArgumentOutOfRangeException(nameof(settings), "tab taper must lie between 0 and 90 degrees");
        if (!(settings.KerfMm >= 0 && settings.PartGapMm >= 0 && settings.MarginMm >= 0)) throw new ArgumentOutOfRangeException(nameof(settings), "kerf, gap and margin must not be negative");
        var mesh = pattern.Folded;
        var material = settings.Material;
        double k = settings.MillimetresPerMetre;
        double sheetW = settings.Sheet.WidthMm, sheetH = settings.Sheet.HeightMm, margin = settings.MarginMm;
        double usableW = sheetW - 2 * margin;
        // Parts stay above the annotation strip, with the part spacing between them and it.
        double usableH = sheetH - 2 * margin - (settings.AnnotationStripMm > 0 ? settings.AnnotationStripMm + settings.SpacingMm : 0);
        double rootOffset = material.ThicknessMm > 0.5 ? material.ThicknessMm : 0;
        // Tabs reach at most width + root offset past a part's faces, and the kerf allowance half a kerf
        // more, so a part whose faces fit the usable area less twice that fits with its tabs in any turning.
        double allowance = 2 * (settings.TabWidthMm + rootOffset + settings.KerfMm / 2);
        if (usableW - allowance <= 0 || usableH - allowance <= 0)
            throw new ArgumentException($"sheet {settings.Sheet.Name} leaves no room inside margins of {margin} mm and tabs of {settings.TabWidthMm} mm");

        // Model scale, y flipped so the pattern seen from the top side reads the same on the sheet.
        var model = new Vec2[pattern.VertexCount];
        for (int v = 0; v < model.Length; v++) { var p = pattern.Vertex(v); model[v] = new Vec2(p.X * k, -p.Y * k); }
        var facePolys = mesh.Faces.Select(f => f.Select(v => model[v]).ToArray()).ToArray();
        var neighbourSets = Enumerable.Range(0, mesh.FaceCount).Select(_ => new SortedSet<int>()).ToArray();
        for (int e = 0; e < mesh.EdgeCount; e++)
            if (mesh.IsInterior(e)) { neighbourSets[mesh.EdgeFaceLeft[e]].Add(mesh.EdgeFaceRight[e]); neighbourSets[mesh.EdgeFaceRight[e]].Add(mesh.EdgeFaceLeft[e]); }
        var neighbours = neighbourSets.Select(s => s.ToArray()).ToArray();

        var (flipped, overlap, total) = SelfOverlap(facePolys);
        // Overlaps below a millionth of the pattern's area are rounding in the union, not facets on top of each other.
        if (flipped > 0 || overlap > 1e-6 * total)
            throw new UncuttableLayoutException($"the flat layout overlaps itself ({flipped} facet(s) turned over, {overlap:0.#} mm2 of facets lying on others at model scale), so its parts cannot be cut from a sheet; a facet of the fitted model is folded over or crossed: let the fit converge (raise fitting.maxIterations, loosen fitting.tolerance or epsilonDeg) or try other cells or fold depth");

        var partOf = givenParts ?? ChooseSplit(facePolys, neighbours, usableW, usableH, allowance, settings.SpacingMm);
        int partCount = partOf.Length == 0 ? 0 : partOf.Max() + 1;
        var partFaces = Enumerable.Range(0, partCount).Select(p => Enumerable.Range(0, partOf.Length).Where(f => partOf[f] == p).ToArray()).ToArray();
        var partPolys = partFaces.Select(fs => UnionOfFaces(fs.Select(f => NtsGeometry.Polygon(facePolys[f])).ToArray())).ToArray();

        var warnings = new List<string>();
        var faceShapes = facePolys.Select(NtsGeometry.Polygon).ToArray();

        // Seams, one per cut edge, with the tab on the lower-numbered part unless it overlaps there.
        var seamEdges = Enumerable.Range(0, mesh.EdgeCount).Where(e => mesh.IsInterior(e) && partOf[mesh.EdgeFaceLeft[e]] != partOf[mesh.EdgeFaceRight[e]]).ToArray();
        var seamTabPart = new int[seamEdges.Length];
        var seamTabs = new GlueTab[seamEdges.Length];
        var tabsOfPart = Enumerable.Range(0, partCount).Select(_ => new List<Polygon>()).ToArray();
        var overlappingCodes = new List<string>();
        double clearance = TabClearanceMm + settings.KerfMm;
        // Edges on each part's outline (seams and the pattern's own boundary), as segments.
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
                // No facet of the part under the tab (shrunk by a micrometre, as it shares its root with its own
                // facet), and every other outline edge and tab of the part clear by nearly the clearance.
                var shape = NtsGeometry.Polygon(tab.Polygon);
                var core = shape.Buffer(-1e-3);
                double gap = 0.9 * clearance;
                bool overlaps = partFaces[part].Any(f => Overlaps(core, faceShapes[f]))
                    || outlineEdges[part].Any(o => o.Edge != e && Near(shape, o.Segment, gap))
                    || tabsOfPart[part].Any(o => Near(shape, o, gap));
                if (chosen is null || !overlaps) { chosen = tab; chosenPart = part; clean = !overlaps; }
                if (!overlaps) break;
            }
            seamTabs[s] = chosen!;
            seamTabPart[s] = chosenPart;
            tabsOfPart[chosenPart].Add(NtsGeometry.Polygon(chosen!.Polygon));
            if (!clean) overlappingCodes.Add(SeamCode(s));
        }
        if (overlappingCodes.Count > 0)
            warnings.Add($"{overlappingCodes.Count} glue tab(s) overlap or come within {clearance:0.##} mm of their own part or another tab: seams {string.Join(", ", overlappingCodes)}");

        // Outlines: part plus tabs, grown by half the kerf with sharp corners kept.
        var outlines = new Polygon[partCount];
        for (int p = 0; p < partCount; p++)
        {
            NtsShape g = NtsGeometry.UnionSnapped(new[] { partPolys[p] }.Concat(tabsOfPart[p]));
            if (settings.KerfMm > 0)
                g = g.Buffer(settings.KerfMm / 2, new BufferParameters { JoinStyle = JoinStyle.Mitre, MitreLimit = 4 });
            if (g is not Polygon poly)
                throw new UncuttableLayoutException($"part {p + 1} does not make one closed outline with its tabs ({g.GeometryType}), so it cannot be cut as one piece");
            if (!poly.IsValid) warnings.Add($"part {p + 1} outline is not a valid polygon");
            outlines[p] = poly;
        }

        // Turn each part to its smallest box that fits, then pack the boxes with the spacing added.
        double spacing = settings.SpacingMm;
        var boxes = new OrientedBox[partCount];
        var hulls = new Vec2[partCount][];
        for (int p = 0; p < partCount; p++)
        {
            hulls[p] = MinimumAreaRectangle.ConvexHull(NtsGeometry.OpenRing(outlines[p].ExteriorRing));
            var faceHull = MinimumAreaRectangle.ConvexHull(partFaces[p].SelectMany(f => facePolys[f]).ToArray());
            boxes[p] = MinimumAreaRectangle.FittingBox(hulls[p], usableW, usableH, MinimumAreaRectangle.CaliperAngles(faceHull))
                ?? throw new InvalidOperationException($"part {p + 1} does not fit the usable sheet area");
        }
        var fixedTurn = new bool[partCount];
        if (settings.Grain != GrainDirection.Any)
        {
            var offGrain = new List<int>();
            for (int p = 0; p < partCount; p++)
            {
                double family = LongestCreaseFamily(pattern, partOf, p, model);
                double angle = (settings.Grain == GrainDirection.AlongWidth ? 0 : Math.PI / 2) - family;
                var box = MinimumAreaRectangle.BoxAt(hulls[p], angle);
                if (box.Width <= usableW + 1e-9 && box.Height <= usableH + 1e-9) { boxes[p] = box; fixedTurn[p] = true; }
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
            offsets[p] = new Vec2(margin + placements[p].X, margin + placements[p].Y) - box.Min;
        }
        Vec2 Place(int part, Vec2 m) => m.Rotated(angles[part]) + offsets[part];

        // Line work.
        var lines = new List<PendingLine>();
        var labels = new List<(int Part, SheetLabel Label)>();
        var foldTotals = new Dictionary<LineClass, (FoldMethod Method, double Crease, double Score, double Perf)>();
        int shortPerforations = 0;
        void AddFold(int part, int order, LineClass cls, FoldMethod method, Vec2 a, Vec2 b)
        {
            double len = (b - a).Length;
            var t = foldTotals.GetValueOrDefault(cls, (method, 0, 0, 0));
            t.Crease += len;
            if (method == FoldMethod.Perforate)
            {
                var plan = Perforation.Plan(len, material.PerforationCutMm, material.PerforationBridgeMm, settings.PerforationVertexZoneMm);
                if (plan.Kind != PerforationKind.Pattern) shortPerforations++;
                // A perforated fold's layer is sent to the cutter as a cut, so a crease too short even for
                // one slot is left unmarked rather than scored on that layer (it would be cut through).
                var dir = (b - a) / len;
                foreach (var (s0, s1) in plan.Cuts)
                {
                    lines.Add(new PendingLine(part, order, cls, [a + s0 * dir, a + s1 * dir], false, LineJob.PerforationCut));
                    t.Perf += s1 - s0;
                }
            }
            else
            {
                lines.Add(new PendingLine(part, order, cls, [a, b], false, method == FoldMethod.ScoreFromBack ? LineJob.BackScore : LineJob.Score));
                t.Score += len;
            }
            foldTotals[cls] = t;
        }

        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            if (!mesh.IsInterior(e)) continue;
            int fl = mesh.EdgeFaceLeft[e], fr = mesh.EdgeFaceRight[e];
            if (partOf[fl] != partOf[fr]) continue;
            var role = pattern.Role(e);
            var (v0, v1) = pattern.Edge(e);
            int part = partOf[fl];
            // A crease the fitted model leaves flat is shown, so the facet edges stay visible, but never folded.
            if (role == CreaseRole.Flat)
            {
                lines.Add(new PendingLine(part, e, LineClass.FlatCrease, [Place(part, model[v0]), Place(part, model[v1])], false, LineJob.Annotation));
                continue;
            }
            if (settings.MethodFor(role) is not FoldMethod method) continue;
            AddFold(part, e, role == CreaseRole.Mountain ? LineClass.Mountain : LineClass.Valley, method, Place(part, model[v0]), Place(part, model[v1]));
        }

        var seams = new Seam[seamEdges.Length];
        for (int s = 0; s < seamEdges.Length; s++)
        {
            int e = seamEdges[s], tabPart = seamTabPart[s];
            var tab = seamTabs[s];
            AddFold(tabPart, mesh.EdgeCount + s, LineClass.TabFold, settings.TabFoldMethod, Place(tabPart, tab.FoldFrom), Place(tabPart, tab.FoldTo));
            var (v0, v1) = pattern.Edge(e);
            int fl = mesh.EdgeFaceLeft[e], fr = mesh.EdgeFaceRight[e];
            int matingPart = partOf[fl] == tabPart ? partOf[fr] : partOf[fl];
            string code = SeamCode(s);
            foreach (int face in new[] { fl, fr })
            {
                int part = partOf[face];
                labels.Add((part, EdgeLabel(code, model[v0], model[v1], facePolys[face], settings.LabelHeightMm, m => Place(part, m), placements[part].Bin + 1)));
            }
            seams[s] = new Seam(code, e, tabPart + 1, matingPart + 1, pattern.Role(e), (model[v1] - model[v0]).Length,
                tab.Polygon.Select(m => Place(tabPart, m)).ToArray());
        }

        var labelJob = settings.LabelsOnBack ? LineJob.BackLabel : LineJob.Label;
        for (int p = 0; p < partCount; p++)
        {
            var outline = outlines[p];
            lines.Add(new PendingLine(p, 0, LineClass.CutOutline, NtsGeometry.OpenRing(outline.ExteriorRing).Select(m => Place(p, m)).ToArray(), true, LineJob.OutlineCut));
            for (int h = 0; h < outline.NumInteriorRings; h++)
                lines.Add(new PendingLine(p, h, LineClass.CutInner, NtsGeometry.OpenRing(outline.GetInteriorRingN(h)).Select(m => Place(p, m)).ToArray(), true, LineJob.InnerCut));
            var (number, arrow) = PartMark(p, partFaces[p], facePolys, settings.LabelHeightMm, angles[p], m => Place(p, m), placements[p].Bin + 1);
            labels.Add((p, number));
            foreach (var stroke in arrow) lines.Add(new PendingLine(p, 0, LineClass.Label, stroke, false, labelJob));
        }

        // Labels become single-stroke glyphs; the font turns counter-clockwise as seen, our angles clockwise.
        // Labels for the back are laid out to read on the back job, then kept in front coordinates like every
        // other back line (the back job mirrors x' = W - x when the sheets are put together).
        if (settings.LabelsOnBack)
        {
            for (int i = 0; i < labels.Count; i++)
            {
                var l = labels[i].Label;
                labels[i] = (labels[i].Part, l with { Centre = new Vec2(sheetW - l.Centre.X, l.Centre.Y), AngleRadians = Upright(Math.PI - l.AngleRadians), Side = "back" });
            }
        }
        foreach (var (part, label) in labels)
            foreach (var stroke in StrokeFont.Layout(label.Text, label.Centre, label.HeightMm, -label.AngleRadians, TextAnchor.MiddleCentre))
            {
                var points = settings.LabelsOnBack ? stroke.Select(q => new Vec2(sheetW - q.X, q.Y)).ToArray() : stroke;
                lines.Add(new PendingLine(part, label.Purpose == LabelPurpose.PartNumber ? 0 : 1, LineClass.Label, points, false, labelJob));
            }

        // Sheets: the lines in job order, parts in number order, each part's lines in edge order.
        var sheets = new List<Sheet>();
        double outlineCut = 0, innerCut = 0, score = 0, backScore = 0, perfCut = 0, labelLength = 0, travel = 0;
        var utilisation = new double[sheetCount];
        for (int sh = 0; sh < sheetCount; sh++)
        {
            var onSheet = Enumerable.Range(0, partCount).Where(p => placements[p].Bin == sh).ToArray();
            utilisation[sh] = onSheet.Sum(p => outlines[p].Area) / (usableW * usableH);
            // Passes in job order; within a pass, classes in the writers' layer order (they write one layer
            // per class in that order), so the order here is the order in the files.
            var sorted = lines.Where(l => placements[l.Part].Bin == sh)
                .OrderBy(l => l.Job).ThenBy(l => ClassRank(l.Class)).ThenBy(l => l.Part).ThenBy(l => l.Order).ToList();
            // Within each pass and class, nearest line next: the front job starts at the sheet's top-left
            // corner, the back job at its own top-left, which is the front's top-right.
            var sheetLines = new List<PendingLine>();
            Vec2 atFront = Vec2.Zero, atBack = new(sheetW, 0);
            foreach (var group in sorted.GroupBy(l => (l.Job, l.Class)))
            {
                if (group.Key.Job is LineJob.BackLabel or LineJob.BackScore) sheetLines.AddRange(NearestFirst(group.ToList(), ref atBack));
                else sheetLines.AddRange(NearestFirst(group.ToList(), ref atFront));
            }
            var marks = settings.NeedsBackJob ? RegistrationMarks(sheetW, sheetH, margin) : [];
            var front = marks.Concat(sheetLines.Where(l => l.Job is not (LineJob.BackScore or LineJob.BackLabel)).Select(l => new SheetLine(l.Class, l.Points, l.Closed))).ToArray();
            foreach (var l in sheetLines)
            {
                double len = PathLength(l.Points, l.Closed);
                switch (l.Job)
                {
                    case LineJob.OutlineCut: outlineCut += len; break;
                    case LineJob.InnerCut: innerCut += len; break;
                    case LineJob.PerforationCut: perfCut += len; break;
                    case LineJob.Score: score += len; break;
                    case LineJob.BackScore: backScore += len; break;
                    case LineJob.Label or LineJob.BackLabel: labelLength += len; break;
                }
            }
            if (settings.NeedsBackJob)
            {
                var back = marks.Concat(sheetLines.Where(l => l.Job is LineJob.BackScore or LineJob.BackLabel)
                    .Select(l => new SheetLine(l.Class, l.Points.Select(q => new Vec2(sheetW - q.X, q.Y)).ToArray(), l.Closed))).ToArray();
                travel += TravelLength(back);
                sheets.Add(new Sheet(sh + 1, sheetW, sheetH, back) { Side = "back", Utilisation = utilisation[sh] });
            }
            travel += TravelLength(front);
            sheets.Add(new Sheet(sh + 1, sheetW, sheetH, front) { Side = "front", Utilisation = utilisation[sh] });
        }

        // Checks.
        int narrow = 0; double narrowest = double.PositiveInfinity; int narrowestFace = -1;
        for (int f = 0; f < facePolys.Length; f++)
        {
            double w = MinimumWidth(facePolys[f]);
            if (w < material.MinFacetWidthMm) narrow++;
            if (w < narrowest) { narrowest = w; narrowestFace = f; }
        }
        if (narrow > 0)
            warnings.Add($"{narrow} facet(s) narrower than {material.MinFacetWidthMm:0.##} mm (10 x thickness of {material.Name}); narrowest {narrowest:0.##} mm (face {narrowestFace})");
        // Single-stroke capitals below about 1.2 mm blur under a laser spot of 0.1-0.2 mm (fabrication.md [CP/M]).
        var tiny = labels.Where(l => l.Label.HeightMm < MinimumLegibleLabelMm).Select(l => l.Label.Text).ToArray();
        if (tiny.Length > 0)
            warnings.Add($"{tiny.Length} label(s) shrunk below {MinimumLegibleLabelMm} mm to fit their facet: {string.Join(", ", tiny.Take(12))}{(tiny.Length > 12 ? ", ..." : "")}");
        if (shortPerforations > 0)
            warnings.Add($"{shortPerforations} perforated crease(s) too short for two cut/bridge cycles: made one centred slot, or left uncut where even a slot does not fit");
        int strained = 0; double worstStrain = 0;
        for (int e = 0; e < pattern.EdgeCount; e++)
        {
            double s = Math.Abs(pattern.EdgeStrain[e]);
            if (s > material.StrainLimit) strained++;
            worstStrain = Math.Max(worstStrain, s);
        }
        if (strained > 0)
            warnings.Add($"{strained} edge(s) stretched or shrunk beyond {material.StrainLimit * 100:0.###} % in the flat pattern; worst {worstStrain * 100:0.###} %");

        double totalCut = outlineCut + innerCut + perfCut;
        double seconds = totalCut / material.CutSpeedMmPerS + (score + backScore + labelLength) / material.ScoreSpeedMmPerS + travel / material.TravelSpeedMmPerS;
        var folds = foldTotals.OrderBy(kv => kv.Key)
            .Select(kv => new FoldFigures(kv.Key, kv.Value.Method, kv.Value.Crease, kv.Value.Score, kv.Value.Perf)).ToArray();
        var figures = new SheetFigures
        {
            TotalCutLengthMm = totalCut,
            OutlineCutLengthMm = outlineCut,
            InnerCutLengthMm = innerCut,
            ScoreLengthMm = score + backScore,
            BackScoreLengthMm = backScore,
            PerforationCutLengthMm = perfCut,
            TravelLengthMm = travel,
            EstimatedLaserSeconds = seconds,
            Folds = folds,
            SheetCount = sheetCount,
            PartCount = partCount,
            Utilisation = utilisation,
            SeamCodes = seams.Select(s => s.Code).ToArray(),
            NarrowFacetCount = narrow,
            ShortPerforationCount = shortPerforations,
            OverlappingTabCount = overlappingCodes.Count,
            StrainedEdgeCount = strained,
            Warnings = warnings.ToArray(),
        };

        var parts = new PlacedPart[partCount];
        for (int p = 0; p < partCount; p++)
        {
            var verts = partFaces[p].SelectMany(f => mesh.Faces[f]).Distinct().OrderBy(v => v).ToArray();
            parts[p] = new PlacedPart(p + 1, placements[p].Bin + 1, partFaces[p], verts, verts.Select(v => Place(p, model[v])).ToArray(),
                angles[p], offsets[p], NtsGeometry.OpenRing(outlines[p].ExteriorRing).Select(m => Place(p, m)).ToArray(), outlines[p].Area);
        }
        var orderedLabels = labels.OrderBy(l => l.Label.Sheet).ThenBy(l => l.Part).ThenBy(l => l.Label.Purpose).ThenBy(l => l.Label.Text, StringComparer.Ordinal)
            .Select(l => l.Label).ToArray();
        return new SheetLayoutResult(sheets.ToArray(), parts, seams, orderedLabels, figures);
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

    /// <summary>Seam code of the s-th seam: A..Z, AA..ZZ, AAA.. (letters only, so codes never read as part numbers).</summary>
    public static string SeamCode(int index)
    {
        var chars = new List<char>();
        int n = index;
        do { chars.Insert(0, (char)('A' + n % 26)); n = n / 26 - 1; } while (n >= 0);
        return new string(chars.ToArray());
    }

    /// <summary>Union of faces that share whole edges with identical end points (a polygon coverage): the
    /// coverage union only merges the shared edges, which is far faster than a general overlay; a general
    /// union is the fallback should the faces not form a clean coverage.</summary>
    private static NtsShape UnionOfFaces(Polygon[] faces)
    {
        var collection = NtsGeometry.Factory.CreateMultiPolygon(faces);
        try
        {
            var union = NetTopologySuite.Operation.OverlayNG.CoverageUnion.Union(collection);
            if (union is Polygon && union.IsValid) return union;
        }
        catch (TopologyException) { }
        return NtsGeometry.Union(faces);
    }

    /// <summary>Facets of the layout (model frame, y down) that are turned over or cross themselves, the area
    /// by which facets lie on each other (sum of facet areas less the area of their union) and the sum, mm2.</summary>
    private static (int Flipped, double Overlap, double Total) SelfOverlap(Vec2[][] facePolys)
    {
        // Faces run counter-clockwise seen from the top; the model frame flips y, so there they run clockwise.
        int flipped = facePolys.Count(f => !(SignedArea(f) < 0) || !NtsGeometry.Polygon(f).IsValid);
        double total = facePolys.Sum(f => Math.Abs(SignedArea(f)));
        if (facePolys.Length == 0) return (0, 0, 0);
        double union = UnionOfFaces(facePolys.Select(NtsGeometry.Polygon).ToArray()).Area;
        return (flipped, Math.Max(0, total - union), total);
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

    /// <summary>A seam code inside the facet beside its edge, baseline along the edge, shrunk to fit.</summary>
    private static SheetLabel EdgeLabel(string code, Vec2 p, Vec2 q, Vec2[] facet, double height, Func<Vec2, Vec2> place, int sheet)
    {
        var edge = q - p;
        double length = edge.Length;
        var inward = edge.Perp / length;
        var mid = (p + q) / 2;
        if (Vec2.Dot(PatternSplitter.Centroid(facet) - mid, inward) < 0) inward = -inward;
        double depth = facet.Max(v => Vec2.Dot(v - p, inward));
        double h = Math.Min(height, Math.Min(0.8 * length / StrokeFont.Measure(code, 1), 0.4 * depth));
        var centre = place(mid + (0.8 * h) * inward);
        var dir = place(q) - place(p);
        return new SheetLabel(sheet, code, centre, h, Upright(Math.Atan2(dir.Y, dir.X)), LabelPurpose.SeamCode);
    }

    /// <summary>Part number on the largest facet and an arrow beside it pointing to the pattern's top edge
    /// (+y of the flat pattern), so parts can be turned the same way before gluing.</summary>
    private static (SheetLabel Number, Vec2[][] Arrow) PartMark(int part, int[] faces, Vec2[][] facePolys, double height, double angle, Func<Vec2, Vec2> place, int sheet)
    {
        int largest = faces.OrderByDescending(f => Math.Abs(SignedArea(facePolys[f]))).ThenBy(f => f).First();
        var c = place(PatternSplitter.Centroid(facePolys[largest]));
        string text = (part + 1).ToString(System.Globalization.CultureInfo.InvariantCulture);
        double h = Math.Min(1.5 * height, 0.3 * MinimumWidth(facePolys[largest]));
        h = Math.Min(h, 0.3 * MaxWidth(facePolys[largest]) / (StrokeFont.Measure(text, 1) + 1.5));
        var up = new Vec2(0, -1).Rotated(angle);
        var baseline = up.Rotated(Math.PI / 2);
        double textHalf = StrokeFont.Measure(text, h) / 2;
        var numberCentre = c - (0.5 * h) * baseline;
        var arrowCentre = c + (textHalf + 0.2 * h) * baseline;
        var tail = arrowCentre - (0.6 * h) * up;
        var tip = arrowCentre + (0.6 * h) * up;
        Vec2[][] arrow =
        [
            [tail, tip],
            [tip - (0.35 * h) * up - (0.25 * h) * baseline, tip, tip - (0.35 * h) * up + (0.25 * h) * baseline],
        ];
        return (new SheetLabel(sheet, text, numberCentre, h, Upright(Math.Atan2(baseline.Y, baseline.X)), LabelPurpose.PartNumber), arrow);
    }

    private static double Upright(double a)
    {
        while (a > Math.PI / 2 + 1e-12) a -= Math.PI;
        while (a <= -Math.PI / 2 + 1e-12) a += Math.PI;
        return a;
    }

    /// <summary>L-shaped corner marks just inside the margin, symmetric under x' = W - x so front and back
    /// jobs can be checked against each other.</summary>
    private static SheetLine[] RegistrationMarks(double w, double h, double margin)
    {
        double d = margin / 2, arm = Math.Max(3, margin / 2);
        return
        [
            new SheetLine(LineClass.Annotation, [new(d + arm, d), new(d, d), new(d, d + arm)]),
            new SheetLine(LineClass.Annotation, [new(w - d - arm, d), new(w - d, d), new(w - d, d + arm)]),
            new SheetLine(LineClass.Annotation, [new(d + arm, h - d), new(d, h - d), new(d, h - d - arm)]),
            new SheetLine(LineClass.Annotation, [new(w - d - arm, h - d), new(w - d, h - d), new(w - d, h - d - arm)]),
        ];
    }

    internal static double PathLength(Vec2[] points, bool closed)
    {
        double len = 0;
        for (int i = 0; i + 1 < points.Length; i++) len += (points[i + 1] - points[i]).Length;
        if (closed && points.Length > 1) len += (points[0] - points[^1]).Length;
        return len;
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

    private static double SignedArea(Vec2[] ring)
    {
        double a = 0;
        for (int i = 0; i < ring.Length; i++) a += Vec2.Cross(ring[i], ring[(i + 1) % ring.Length]);
        return a / 2;
    }

    /// <summary>Width of a polygon: the least, over its edges, of the farthest vertex distance from the edge's line
    /// (exact for convex facets).</summary>
    internal static double MinimumWidth(Vec2[] ring)
    {
        double best = double.PositiveInfinity;
        for (int i = 0; i < ring.Length; i++)
        {
            var a = ring[i]; var d = ring[(i + 1) % ring.Length] - a;
            double l = d.Length;
            if (l == 0) continue;
            double far = ring.Max(v => Math.Abs(Vec2.Cross(d, v - a)) / l);
            best = Math.Min(best, far);
        }
        return best;
    }

    private static double MaxWidth(Vec2[] ring)
    {
        double best = 0;
        foreach (var a in ring) foreach (var b in ring) best = Math.Max(best, (b - a).Length);
        return best;
    }
}
