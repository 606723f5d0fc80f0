using NetTopologySuite.Geometries;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Core.Unfolding;

namespace Tessel.Tests.Sheets;

public class SheetLayoutTests
{
    // 10 x 8 Miura cells of 1 m facets at 1:50 is about 346 x 320 mm: more than an A4 sheet holds.
    private static readonly FlatPattern Miura = FlatMiura.Build(10, 8);
    private static readonly FabricationSettings Card = new() { ScaleDenominator = 50, Sheet = SheetSizes.A4, Material = Materials.Card };
    private static readonly SheetLayoutResult CardLayout = SheetLayout.Lay(Miura, Card);

    private static Polygon Poly(Vec2[] ring) =>
        new GeometryFactory().CreatePolygon(ring.Append(ring[0]).Select(p => new Coordinate(p.X, p.Y)).ToArray());

    private static double Length(SheetLine l)
    {
        double s = 0;
        for (int i = 0; i + 1 < l.Points.Length; i++) s += (l.Points[i + 1] - l.Points[i]).Length;
        if (l.Closed) s += (l.Points[0] - l.Points[^1]).Length;
        return s;
    }

    [Fact]
    public void PatternLargerThanTheSheetIsSplitIntoSeveralParts()
    {
        Assert.True(CardLayout.Figures.PartCount >= 2, $"{CardLayout.Figures.PartCount} parts");
        Assert.True(CardLayout.Figures.SheetCount >= 2);
        // Every face in exactly one part.
        var faces = CardLayout.Parts.SelectMany(p => p.Faces).OrderBy(f => f).ToArray();
        Assert.Equal(Enumerable.Range(0, Miura.Folded.FaceCount), faces);
    }

    [Fact]
    public void EveryPartLiesInsideTheMargins()
    {
        double m = Card.MarginMm;
        foreach (var part in CardLayout.Parts)
            foreach (var p in part.Outline)
            {
                Assert.InRange(p.X, m - 1e-9, Card.Sheet.WidthMm - m + 1e-9);
                Assert.InRange(p.Y, m - 1e-9, Card.Sheet.HeightMm - m + 1e-9);
            }
    }

    [Fact]
    public void PartsOnASheetKeepTheSpacingIncludingTabs()
    {
        var parts = CardLayout.Parts;
        for (int i = 0; i < parts.Length; i++)
        {
            Assert.True(Poly(parts[i].Outline).IsValid, $"part {parts[i].Number} outline invalid");
            for (int j = i + 1; j < parts.Length; j++)
            {
                if (parts[i].Sheet != parts[j].Sheet) continue;
                double d = Poly(parts[i].Outline).Distance(Poly(parts[j].Outline));
                Assert.True(d >= Card.SpacingMm - 1e-9, $"parts {parts[i].Number} and {parts[j].Number} are {d} mm apart");
            }
        }
    }

    [Fact]
    public void EverySeamCodeIsPrintedExactlyTwiceOncePerPart()
    {
        Assert.NotEmpty(CardLayout.Seams);
        Assert.Equal(CardLayout.Seams.Length, CardLayout.Seams.Select(s => s.Code).Distinct().Count());
        var partOfFace = new int[Miura.Folded.FaceCount];
        foreach (var p in CardLayout.Parts) foreach (int f in p.Faces) partOfFace[f] = p.Number;
        foreach (var seam in CardLayout.Seams)
        {
            var printed = CardLayout.Labels.Where(l => l.Purpose == LabelPurpose.SeamCode && l.Text == seam.Code).ToArray();
            Assert.Equal(2, printed.Length);
            Assert.NotEqual(seam.TabPart, seam.MatingPart);
            var sheets = new[] { CardLayout.Parts[seam.TabPart - 1].Sheet, CardLayout.Parts[seam.MatingPart - 1].Sheet }.OrderBy(s => s);
            Assert.Equal(sheets, printed.Select(l => l.Sheet).OrderBy(s => s));
            // Each printed code lies inside the outline of one of the two parts.
            foreach (var label in printed)
            {
                var at = new GeometryFactory().CreatePoint(new Coordinate(label.Centre.X, label.Centre.Y));
                Assert.Contains(CardLayout.Parts.Single(p => p.Sheet == label.Sheet && Poly(p.Outline).Contains(at)).Number, new[] { seam.TabPart, seam.MatingPart });
            }
            // Seam edge is a cut between faces of the two parts.
            int fl = Miura.Folded.EdgeFaceLeft[seam.Edge], fr = Miura.Folded.EdgeFaceRight[seam.Edge];
            Assert.Equal(new[] { seam.TabPart, seam.MatingPart }.OrderBy(x => x), new[] { partOfFace[fl], partOfFace[fr] }.OrderBy(x => x));
        }
        Assert.Equal(CardLayout.Seams.Select(s => s.Code), CardLayout.Figures.SeamCodes);
    }

    [Fact]
    public void CreaseLengthOnAllSheetsEqualsThePatternsAtModelScale()
    {
        // Scored folds are single lines, so lengths add up exactly: front and back mountain/valley lines
        // plus the seam edges (cut apart, drawn as tab folds and cut edges) give the pattern's creases.
        double onSheets = CardLayout.Sheets.SelectMany(s => s.Lines)
            .Where(l => l.Class is LineClass.Mountain or LineClass.Valley).Sum(Length);
        double seams = CardLayout.Seams.Where(s => s.Role is Core.Model.CreaseRole.Mountain or Core.Model.CreaseRole.Valley).Sum(s => s.LengthMm);
        double expected = FlatMiura.CreaseLength(Miura) * 1000 / 50;
        Assert.Equal(expected, onSheets + seams, 6);
        // Card has no root offset, so each tab fold lies on its seam edge, short of both ends by at least the
        // tab clearance (so the tab keeps clear of the next seam).
        double tabFolds = CardLayout.Sheets.SelectMany(s => s.Lines).Where(l => l.Class == LineClass.TabFold).Sum(Length);
        double seamTotal = CardLayout.Seams.Sum(s => s.LengthMm);
        Assert.InRange(tabFolds, 0.5 * seamTotal, seamTotal - 2 * SheetLayout.TabClearanceMm * CardLayout.Seams.Length);
        Assert.Equal(CardLayout.Seams.Length, CardLayout.Sheets.SelectMany(s => s.Lines).Count(l => l.Class == LineClass.TabFold));
    }

    [Fact]
    public void BackJobIsTheFrontValleysMirrored()
    {
        // Card scores valleys from the back: each back sheet precedes its front and holds x' = W - x copies.
        var sheets = CardLayout.Sheets;
        Assert.Equal(2 * CardLayout.Figures.SheetCount, sheets.Length);
        double w = Card.Sheet.WidthMm;
        for (int i = 0; i < sheets.Length; i += 2)
        {
            Assert.Equal(("back", "front"), (sheets[i].Side, sheets[i + 1].Side));
            Assert.Equal(sheets[i].Number, sheets[i + 1].Number);
            var vertices = CardLayout.Parts.Where(p => p.Sheet == sheets[i].Number).SelectMany(p => p.VertexPositions).ToArray();
            var backValleys = sheets[i].Lines.Where(l => l.Class == LineClass.Valley).ToArray();
            Assert.NotEmpty(backValleys);
            Assert.DoesNotContain(sheets[i].Lines, l => l.Class is LineClass.CutOutline or LineClass.Mountain);
            Assert.DoesNotContain(sheets[i + 1].Lines, l => l.Class == LineClass.Valley);
            foreach (var l in backValleys)
                foreach (var p in l.Points)
                {
                    var unmirrored = new Vec2(w - p.X, p.Y);
                    Assert.True(vertices.Any(v => (v - unmirrored).Length < 1e-9), $"back point ({p.X}, {p.Y}) is not a mirrored vertex");
                }
            // Registration marks are symmetric, so they match after the flip.
            var marks = sheets[i].Lines.Where(l => l.Class == LineClass.Annotation).SelectMany(l => l.Points).ToArray();
            Assert.All(marks, p => Assert.Contains(marks, q => Math.Abs(q.X - (w - p.X)) < 1e-9 && Math.Abs(q.Y - p.Y) < 1e-9));
        }
    }

    [Fact]
    public void FrontJobsRunScoresThenInnerCutsThenOutlines()
    {
        foreach (var sheet in CardLayout.Sheets.Where(s => s.Side == "front"))
        {
            var classes = sheet.Lines.Select(l => l.Class).ToList();
            int lastScore = classes.FindLastIndex(c => c is LineClass.Mountain or LineClass.TabFold);
            int firstOutline = classes.FindIndex(c => c == LineClass.CutOutline);
            Assert.True(lastScore >= 0 && firstOutline > lastScore);
            Assert.True(classes.Skip(firstOutline).All(c => c == LineClass.CutOutline));
        }
    }

    [Fact]
    public void NoCreaseRunsAlongAnOutlineAndTabFoldsLieInside()
    {
        foreach (var sheet in CardLayout.Sheets.Where(s => s.Side == "front"))
        {
            var outlines = sheet.Lines.Where(l => l.Class == LineClass.CutOutline).Select(l => Poly(l.Points)).ToArray();
            foreach (var l in sheet.Lines.Where(l => l.Class is LineClass.Mountain or LineClass.TabFold))
            {
                var mid = (l.Points[0] + l.Points[^1]) / 2;
                var pt = new GeometryFactory().CreatePoint(new Coordinate(mid.X, mid.Y));
                Assert.All(outlines, o => Assert.True(o.ExteriorRing.Distance(pt) > 1e-3, $"{l.Class} on an outline"));
                Assert.Single(outlines, o => o.Contains(pt));
            }
        }
    }

    [Fact]
    public void PerforatedCreasesKeepCutBridgeLengthsAndClearVertexZones()
    {
        var settings = Card with { Material = Materials.Polypropylene };
        var layout = SheetLayout.Lay(Miura, settings);
        Assert.DoesNotContain(layout.Sheets, s => s.Side == "back");
        double cut = Materials.Polypropylene.PerforationCutMm, bridge = Materials.Polypropylene.PerforationBridgeMm;
        double zone = settings.PerforationVertexZoneMm;
        int dashes = 0, bridges = 0;
        foreach (var sheet in layout.Sheets)
        {
            var vertices = layout.Parts.Where(p => p.Sheet == sheet.Number).SelectMany(p => p.VertexPositions).ToArray();
            var perf = sheet.Lines.Where(l => l.Class is LineClass.Mountain or LineClass.Valley).ToArray();
            foreach (var l in perf)
            {
                Assert.Equal(2, l.Points.Length);
                Assert.Equal(cut, Length(l), 9);
                foreach (var v in vertices)
                    Assert.True(SegmentDistance(v, l.Points[0], l.Points[1]) >= zone - 1e-9, $"dash within {zone} mm of a vertex");
                dashes++;
            }
            // Dashes of one crease come in order: each next one starts a bridge after the previous ends.
            // Dashes of different creases cannot touch, since creases meet only at vertices (zone checked above).
            for (int i = 1; i < perf.Length; i++)
            {
                var prev = perf[i - 1].Points; var next = perf[i].Points;
                var dir = (prev[1] - prev[0]) / cut;
                var gap = next[0] - prev[1];
                if (Math.Abs(Vec2.Cross(dir, gap)) < 1e-9 && Vec2.Dot(dir, gap) > 0 && gap.Length < cut + bridge)
                {
                    Assert.Equal(bridge, gap.Length, 9);
                    bridges++;
                }
            }
        }
        Assert.True(bridges > dashes / 2, $"{bridges} bridges for {dashes} dashes");
        Assert.True(dashes > 0);
        // Facet edges at 1:50 are 20 mm: room for dashes on every crease, so no slot fallback here.
        Assert.Equal(0, layout.Figures.ShortPerforationCount);
        Assert.Equal(dashes * cut, layout.Figures.PerforationCutLengthMm, 6);
    }

    [Fact]
    public void FiguresAddUpFromTheLines()
    {
        var f = CardLayout.Figures;
        var lines = CardLayout.Sheets.SelectMany(s => s.Lines).ToArray();
        Assert.Equal(lines.Where(l => l.Class == LineClass.CutOutline).Sum(Length), f.OutlineCutLengthMm, 6);
        Assert.Equal(lines.Where(l => l.Class is LineClass.Mountain or LineClass.Valley or LineClass.TabFold).Sum(Length), f.ScoreLengthMm, 6);
        Assert.Equal(CardLayout.Sheets.Where(s => s.Side == "back").SelectMany(s => s.Lines).Where(l => l.Class == LineClass.Valley).Sum(Length), f.BackScoreLengthMm, 6);
        Assert.Equal(f.OutlineCutLengthMm + f.InnerCutLengthMm + f.PerforationCutLengthMm, f.TotalCutLengthMm, 9);
        double usable = (Card.Sheet.WidthMm - 2 * Card.MarginMm) * (Card.Sheet.HeightMm - 2 * Card.MarginMm);
        for (int s = 0; s < f.SheetCount; s++)
        {
            double area = CardLayout.Parts.Where(p => p.Sheet == s + 1).Sum(p => Poly(p.Outline).Area);
            Assert.Equal(area / usable, f.Utilisation[s], 6);
            Assert.InRange(f.Utilisation[s], 0.01, 1);
        }
        Assert.True(f.EstimatedLaserSeconds > f.TotalCutLengthMm / Materials.Card.CutSpeedMmPerS);
        // Travel: from each job's top-left corner to every lasered line's start in turn.
        double travel = 0;
        foreach (var sheet in CardLayout.Sheets)
        {
            var at = Vec2.Zero;
            foreach (var l in sheet.Lines.Where(l => l.Class != LineClass.Annotation))
            {
                travel += (l.Points[0] - at).Length;
                at = l.Closed ? l.Points[0] : l.Points[^1];
            }
        }
        Assert.Equal(travel, f.TravelLengthMm, 6);
        // Nearest-first ordering: well under the travel of visiting the same lines in part/edge order
        // (about 28 m measured before ordering; our own acceptance level, no source).
        Assert.InRange(f.TravelLengthMm, 1, 20000);
        Assert.Equal(0, f.OverlappingTabCount);
    }

    [Fact]
    public void NarrowFacetsAndStrainAreWarnedAbout()
    {
        // 0.15 m facets at 1:50 are 3 mm wide at most, under 10 x 0.4 mm card thickness (docs/reference/fabrication.md [M]).
        var small = FlatMiura.Build(3, 3, 0.15, 0.15);
        var strained = new FlatPattern(small.Folded, small.Positions, Enumerable.Range(0, small.EdgeCount).Select(e => e == 0 ? 0.002 : 0.0).ToArray());
        var layout = SheetLayout.Lay(strained, Card);
        Assert.Equal(small.Folded.FaceCount, layout.Figures.NarrowFacetCount);
        Assert.Equal(1, layout.Figures.StrainedEdgeCount);
        Assert.Contains(layout.Figures.Warnings, w => w.Contains("narrower than 4 mm"));
        // The part number had to shrink to 0.3 of a 2.6 mm facet: under the legibility floor.
        Assert.Contains(layout.Figures.Warnings, w => w.Contains("label(s) shrunk below 1.2 mm"));
        Assert.DoesNotContain(CardLayout.Figures.Warnings, w => w.Contains("shrunk below"));
        Assert.Equal(1, layout.Figures.PartCount);
        Assert.Empty(layout.Seams);
    }

    [Fact]
    public void SameInputGivesTheSameSheets()
    {
        var again = SheetLayout.Lay(FlatMiura.Build(10, 8), Card);
        Assert.Equal(CardLayout.Sheets.Length, again.Sheets.Length);
        for (int s = 0; s < again.Sheets.Length; s++)
        {
            var a = CardLayout.Sheets[s]; var b = again.Sheets[s];
            Assert.Equal((a.Number, a.Side, a.Lines.Length), (b.Number, b.Side, b.Lines.Length));
            for (int i = 0; i < a.Lines.Length; i++)
            {
                Assert.Equal(a.Lines[i].Class, b.Lines[i].Class);
                Assert.Equal(a.Lines[i].Points, b.Lines[i].Points);
            }
        }
        Assert.Equal(CardLayout.Labels, again.Labels);
    }

    [Fact]
    public void LabelsAreStrokeTextInsideTheirParts()
    {
        foreach (var sheet in CardLayout.Sheets.Where(s => s.Side == "front"))
        {
            var outlines = CardLayout.Parts.Where(p => p.Sheet == sheet.Number).Select(p => Poly(p.Outline)).ToArray();
            var strokes = sheet.Lines.Where(l => l.Class == LineClass.Label).ToArray();
            Assert.NotEmpty(strokes);
            foreach (var l in strokes)
                foreach (var p in l.Points)
                {
                    var pt = new GeometryFactory().CreatePoint(new Coordinate(p.X, p.Y));
                    Assert.Single(outlines, o => o.Contains(pt));
                }
        }
        // Labels are upright: baseline within (-90, 90] degrees.
        Assert.All(CardLayout.Labels, l => Assert.InRange(l.AngleRadians, -Math.PI / 2, Math.PI / 2 + 1e-12));
        Assert.Equal(CardLayout.Figures.PartCount, CardLayout.Labels.Count(l => l.Purpose == LabelPurpose.PartNumber));
    }

    [Fact]
    public void AnnotationStripStaysFreeOfParts()
    {
        var settings = Card with { AnnotationStripMm = 40 };
        var layout = SheetLayout.Lay(Miura, settings);
        var strip = settings.AnnotationStrip;
        Assert.Equal((8.0, 297.0 - 8 - 40, 194.0, 40.0), (strip.X, strip.Y, strip.Width, strip.Height));
        foreach (var part in layout.Parts)
            Assert.All(part.Outline, p => Assert.True(p.Y <= strip.Y - settings.SpacingMm + 1e-9, $"part {part.Number} reaches y = {p.Y}"));
    }

    [Fact]
    public void KerfGrowsTheOutlineByHalfTheKerf()
    {
        // Half a kerf outward along the whole perimeter, plus mitred corners: area grows by about P k / 2.
        var small = FlatMiura.Build(2, 2);
        var none = SheetLayout.Lay(small, Card with { KerfMm = 0 });
        var kerf = SheetLayout.Lay(small, Card with { KerfMm = 0.4 });
        Assert.Equal(1, none.Figures.PartCount);
        double perimeter = none.Figures.OutlineCutLengthMm;
        double grown = kerf.Parts[0].AreaMm2 - none.Parts[0].AreaMm2;
        Assert.InRange(grown, perimeter * 0.2, perimeter * 0.2 * 1.1);
        // Every outline point of the kerf layout is 0.2 mm from the uncompensated outline.
        var a = Poly(none.Parts[0].Outline.Select(p => (p - none.Parts[0].Offset).Rotated(-none.Parts[0].AngleRadians)).ToArray());
        foreach (var p in kerf.Parts[0].Outline.Select(p => (p - kerf.Parts[0].Offset).Rotated(-kerf.Parts[0].AngleRadians)))
            Assert.True(a.ExteriorRing.Distance(new GeometryFactory().CreatePoint(new Coordinate(p.X, p.Y))) >= 0.2 - 1e-6);
    }

    [Fact]
    public void FacetLargerThanTheSheetOrNoRoomIsRefusedWithAReason()
    {
        // 1 m facets at 1:2 are 500 mm: no A4 turning holds one.
        var big = Assert.Throws<InvalidOperationException>(() => SheetLayout.Lay(FlatMiura.Build(1, 1), Card with { ScaleDenominator = 2 }));
        Assert.Contains("larger than the usable sheet area", big.Message);
        // 30 mm margins and 7 mm tabs leave nothing of a 60 x 60 mm sheet.
        Assert.Throws<ArgumentException>(() => SheetLayout.Lay(Miura, Card with { Sheet = new SheetSize("tiny", 60, 60), MarginMm = 30 }));
    }

    [Fact]
    public void LabelsOnTheBackGoIntoTheMirroredJobAndReadFromTheBack()
    {
        var settings = Card with { LabelsOnBack = true, ValleyMethod = FoldMethod.Score };
        var layout = SheetLayout.Lay(Miura, settings);
        double w = settings.Sheet.WidthMm;
        Assert.DoesNotContain(layout.Sheets.Where(s => s.Side == "front").SelectMany(s => s.Lines), l => l.Class == LineClass.Label);
        foreach (var back in layout.Sheets.Where(s => s.Side == "back"))
        {
            var outlines = layout.Parts.Where(p => p.Sheet == back.Number).Select(p => Poly(p.Outline)).ToArray();
            var strokes = back.Lines.Where(l => l.Class == LineClass.Label).ToArray();
            Assert.NotEmpty(strokes);
            Assert.Equal(strokes.Length, back.Lines.Count(l => l.Class != LineClass.Annotation));
            // Flipped back onto the front (x = W - x'), every stroke lies on its part.
            foreach (var p in strokes.SelectMany(l => l.Points))
                Assert.Single(outlines, o => o.Contains(new GeometryFactory().CreatePoint(new Coordinate(w - p.X, p.Y))));
        }
        Assert.All(layout.Labels, l => Assert.Equal("back", l.Side));
        // Same text, positions mirrored: a label's back centre is the front one with x' = W - x.
        var front = CardLayout.Labels.Single(l => l.Text == "1" && l.Purpose == LabelPurpose.PartNumber);
        var mirrored = layout.Labels.Single(l => l.Text == "1" && l.Purpose == LabelPurpose.PartNumber);
        Assert.Equal(w - front.Centre.X, mirrored.Centre.X, 9);
        Assert.Equal(front.Centre.Y, mirrored.Centre.Y, 9);
    }

    [Theory]
    [InlineData(GrainDirection.AlongWidth, 0.0)]
    [InlineData(GrainDirection.AlongHeight, 90.0)]
    public void LongestCreaseFamilyFollowsTheGrain(GrainDirection grain, double expectedDegrees)
    {
        // Common practice (docs/reference/fabrication.md [CP]): fold long crease families along the grain.
        var layout = SheetLayout.Lay(Miura, Card with { Grain = grain });
        Assert.DoesNotContain(layout.Figures.Warnings, w => w.Contains("across the grain"));
        var mesh = Miura.Folded;
        foreach (var part in layout.Parts)
        {
            var inPart = new HashSet<int>(part.Faces);
            var totals = new Dictionary<int, double>();
            for (int e = 0; e < mesh.EdgeCount; e++)
            {
                if (!mesh.IsInterior(e) || !inPart.Contains(mesh.EdgeFaceLeft[e]) || !inPart.Contains(mesh.EdgeFaceRight[e])) continue;
                if (Miura.Role(e) is not (Core.Model.CreaseRole.Mountain or Core.Model.CreaseRole.Valley)) continue;
                var (v0, v1) = Miura.Edge(e);
                var d = part.VertexPositions[Array.BinarySearch(part.Vertices, v1)] - part.VertexPositions[Array.BinarySearch(part.Vertices, v0)];
                int deg = (int)Math.Round((Math.Atan2(d.Y, d.X) * 180 / Math.PI + 360) % 180) % 180;
                totals[deg] = totals.GetValueOrDefault(deg) + d.Length;
            }
            Assert.Equal((int)expectedDegrees, totals.OrderByDescending(kv => kv.Value).ThenBy(kv => kv.Key).First().Key);
        }
    }

    private static double SegmentDistance(Vec2 p, Vec2 a, Vec2 b)
    {
        var d = b - a;
        double t = Math.Clamp(Vec2.Dot(p - a, d) / Vec2.Dot(d, d), 0, 1);
        return (p - (a + t * d)).Length;
    }
}
