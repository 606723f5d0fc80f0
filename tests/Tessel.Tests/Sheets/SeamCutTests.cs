using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;

namespace Tessel.Tests.Sheets;

/// <summary>Every seam is cut over its full length on both parts, and no glue tab touches another seam or tab,
/// also at concave part corners where a tab's tapered end would lie along the next seam.</summary>
public class SeamCutTests
{
    /// <summary>A closed fan of <paramref name="count"/> equal triangles around a centre (radius in metres);
    /// every spoke a mountain.</summary>
    private static FlatPattern Fan(int count, double radius)
    {
        var pos = new double[(count + 1) * 3];
        var xy = new double[(count + 1) * 2];
        for (int k = 0; k < count; k++)
        {
            var p = new Vec2(radius, 0).Rotated(k * 2 * Math.PI / count);
            pos[3 * (k + 1)] = p.X; pos[3 * (k + 1) + 1] = p.Y;
            xy[2 * (k + 1)] = p.X; xy[2 * (k + 1) + 1] = p.Y;
        }
        var faces = Enumerable.Range(0, count).Select(k => new[] { 0, k + 1, (k + 1) % count + 1 }).ToArray();
        var mesh = new CreaseMesh("fan", pos, faces, new VertexLayer[count + 1], (_, _) => CreaseRole.Mountain);
        return new FlatPattern(mesh, xy, new double[mesh.EdgeCount]);
    }

    private static double SegmentDistance(Vec2 p, Vec2 a, Vec2 b)
    {
        var d = b - a;
        double l2 = Vec2.Dot(d, d);
        double t = l2 == 0 ? 0 : Math.Clamp(Vec2.Dot(p - a, d) / l2, 0, 1);
        return (a + t * d - p).Length;
    }

    private static IEnumerable<(Vec2 A, Vec2 B)> Segments(SheetLine line)
    {
        for (int i = 0; i + 1 < line.Points.Length; i++) yield return (line.Points[i], line.Points[i + 1]);
        if (line.Closed && line.Points.Length > 1) yield return (line.Points[^1], line.Points[0]);
    }

    /// <summary>Length (mm) of the seam on <paramref name="part"/> that lies on no cut (within the half kerf the outline
    /// is grown by, plus 1 um for the 0.1 um grid outlines are snapped to) and, on the part carrying the tab, on no
    /// fold line of its tab; 2000 samples.</summary>
    private static double UncutLength(SheetLayoutResult layout, Seam seam, PlacedPart part, FlatPattern pattern, double kerf)
    {
        var (v0, v1) = pattern.Edge(seam.Edge);
        var a = part.VertexPositions[Array.BinarySearch(part.Vertices, v0)];
        var b = part.VertexPositions[Array.BinarySearch(part.Vertices, v1)];
        var sheet = layout.Sheets.Single(s => s.Number == part.Sheet && s.Side == "front");
        var classes = part.Number == seam.TabPart ? new[] { LineClass.CutOutline, LineClass.TabFold } : [LineClass.CutOutline];
        var segments = sheet.Lines.Where(l => classes.Contains(l.Class)).SelectMany(Segments).ToArray();
        const int samples = 2000;
        int covered = 0;
        for (int i = 0; i < samples; i++)
        {
            var p = a + ((i + 0.5) / samples) * (b - a);
            if (segments.Any(s => SegmentDistance(p, s.A, s.B) <= kerf / 2 + 1e-3)) covered++;
        }
        return (samples - covered) / (double)samples * (b - a).Length;
    }

    /// <param name="allowedUncutMm">0 without kerf. With a kerf the beam runs half a kerf outside the outline, and
    /// where two outline edges meet at an exterior angle theta under 180 deg (a notch) its path stops
    /// (k/2) cot(theta/2) short of the corner (plane geometry): that much may stay uncut at each end.</param>
    private static void AssertSeamsCutAndTabsClear(SheetLayoutResult layout, FlatPattern pattern, double kerf, double allowedUncutMm = 0)
    {
        Assert.NotEmpty(layout.Seams);
        var parts = layout.Parts.ToDictionary(p => p.Number);
        foreach (var seam in layout.Seams)
            foreach (int number in new[] { seam.TabPart, seam.MatingPart })
            {
                double uncut = UncutLength(layout, seam, parts[number], pattern, kerf);
                Assert.True(uncut <= allowedUncutMm + 0.01, $"seam {seam.Code}: {uncut:0.###} of {seam.LengthMm:0.###} mm left uncut on part {number}");
            }
        // Tabs keep the clearance from every other seam of their part and from each other.
        foreach (var seam in layout.Seams)
        {
            var part = parts[seam.TabPart];
            foreach (var other in layout.Seams.Where(o => o.Code != seam.Code && (o.TabPart == seam.TabPart || o.MatingPart == seam.TabPart)))
            {
                var (v0, v1) = pattern.Edge(other.Edge);
                var a = part.VertexPositions[Array.BinarySearch(part.Vertices, v0)];
                var b = part.VertexPositions[Array.BinarySearch(part.Vertices, v1)];
                double gap = seam.Tab.Min(t => SegmentDistance(t, a, b));
                Assert.True(gap >= 0.9 * SheetLayout.TabClearanceMm, $"tab {seam.Code} comes within {gap:0.###} mm of seam {other.Code}");
                if (other.TabPart == seam.TabPart)
                {
                    var ring = other.Tab;
                    double tabGap = seam.Tab.Min(t => Enumerable.Range(0, ring.Length).Min(i => SegmentDistance(t, ring[i], ring[(i + 1) % ring.Length])));
                    Assert.True(tabGap >= 0.9 * SheetLayout.TabClearanceMm, $"tabs {seam.Code} and {other.Code} come within {tabGap:0.###} mm");
                }
            }
        }
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.2)]
    public void NarrowWedgeAtAConcaveCornerLeavesBothSeamsCut(double kerf)
    {
        // Ten 36 deg triangles; the second is its own part, so part 1 wraps around a 36 deg wedge. With a
        // 40 deg taper capped at the wedge's corner a tab's end used to lie along the neighbouring seam, and
        // the outline union fused them (the seam left uncut for the tab's length).
        var fan = Fan(10, 0.5);
        var settings = new FabricationSettings { ScaleDenominator = 20, Material = Materials.Card, TabTaperDegrees = 40, TabWidthMm = 6, KerfMm = kerf };
        var layout = SheetLayout.Lay(fan, settings, [0, 1, 0, 0, 0, 0, 0, 0, 0, 0]);
        Assert.Equal(2, layout.Seams.Length);
        // The notch at the fan's centre is 36 deg: (k/2) cot(18 deg) at that end, a tab-root corner (140 deg
        // exterior) at most (k/2) cot(70 deg) at the other.
        AssertSeamsCutAndTabsClear(layout, fan, kerf, kerf / 2 * (1 / Math.Tan(18 * Math.PI / 180) + 1 / Math.Tan(70 * Math.PI / 180)));
        Assert.Equal(0, layout.Figures.OverlappingTabCount);
    }

    [Fact]
    public void WedgeTooNarrowForTwoTabsMovesOneAndCountsNone()
    {
        // Six 60 deg triangles, the second its own part: both tabs in the one wedge would come within the
        // clearance of each other, so one goes to the wedge's part, and no tab is counted as overlapping.
        var fan = Fan(6, 0.5);
        var settings = new FabricationSettings { ScaleDenominator = 50, Material = Materials.Card, TabTaperDegrees = 40, KerfMm = 0 };
        var layout = SheetLayout.Lay(fan, settings, [0, 1, 0, 0, 0, 0]);
        Assert.Equal(new[] { 1, 2 }, layout.Seams.Select(s => s.TabPart).OrderBy(p => p));
        AssertSeamsCutAndTabsClear(layout, fan, settings.KerfMm);
        Assert.Equal(0, layout.Figures.OverlappingTabCount);
    }

    [Fact]
    public void SplitMiuraHasEverySeamCutOnBothParts()
    {
        // A Miura sheet split over several A4 sheets: part corners along the zig-zag split lines are concave.
        var miura = FlatMiura.Build(12, 12);
        var settings = new FabricationSettings { ScaleDenominator = 20, Material = Materials.Card, Sheet = SheetSizes.A4, TabWidthMm = 6, TabTaperDegrees = 40, KerfMm = 0 };
        var layout = SheetLayout.Lay(miura, settings);
        Assert.True(layout.Parts.Length > 1);
        AssertSeamsCutAndTabsClear(layout, miura, settings.KerfMm);
    }
}
