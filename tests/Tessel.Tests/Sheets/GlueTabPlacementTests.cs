using NetTopologySuite.Geometries;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;

namespace Tessel.Tests.Sheets;

public class GlueTabPlacementTests
{
    /// <summary>Six equilateral triangles around a centre (radius in metres); every spoke a mountain.</summary>
    private static FlatPattern HexagonFan(double radius)
    {
        var pos = new double[7 * 3];
        var xy = new double[7 * 2];
        for (int k = 0; k < 6; k++)
        {
            var p = new Vec2(radius, 0).Rotated(k * Math.PI / 3);
            pos[3 * (k + 1)] = p.X; pos[3 * (k + 1) + 1] = p.Y;
            xy[2 * (k + 1)] = p.X; xy[2 * (k + 1) + 1] = p.Y;
        }
        var faces = Enumerable.Range(0, 6).Select(k => new[] { 0, k + 1, (k + 1) % 6 + 1 }).ToArray();
        var mesh = new CreaseMesh("fan", pos, faces, new VertexLayer[7], (_, _) => CreaseRole.Mountain);
        return new FlatPattern(mesh, xy, new double[mesh.EdgeCount]);
    }

    private static Polygon Poly(Vec2[] ring) =>
        new GeometryFactory().CreatePolygon(ring.Append(ring[0]).Select(p => new Coordinate(p.X, p.Y)).ToArray());

    [Fact]
    public void SecondTabInTheSameNarrowCornerMovesToTheOtherPart()
    {
        // Part 1 wraps around triangle 1 (part 2). Both seams' tabs on part 1 would lie in triangle 1 and meet
        // at its 60 deg corner with 40 + 40 deg tapers, so they would overlap: the second goes to part 2.
        var fan = HexagonFan(0.5);
        var settings = new FabricationSettings { ScaleDenominator = 50, Material = Materials.Card, TabTaperDegrees = 40 };
        var layout = SheetLayout.Lay(fan, settings, [0, 1, 0, 0, 0, 0]);
        Assert.Equal(2, layout.Seams.Length);
        Assert.Equal(new[] { 1, 2 }, layout.Seams.Select(s => s.TabPart).OrderBy(p => p));
        Assert.Equal(0, layout.Figures.OverlappingTabCount);
        // With a 25 deg taper the two tabs fit side by side in the 60 deg corner and both stay on part 1.
        var narrow = SheetLayout.Lay(fan, settings with { TabTaperDegrees = 25 }, [0, 1, 0, 0, 0, 0]);
        Assert.All(narrow.Seams, s => Assert.Equal(1, s.TabPart));
        Assert.True(Poly(narrow.Seams[0].Tab).Intersection(Poly(narrow.Seams[1].Tab)).Area < 1e-9);
    }

    [Fact]
    public void NoTabOverlapsItsOwnPartOrAnotherTabOfIt()
    {
        // Tabs of a split Miura: each tab meets its own part only along its fold line.
        var miura = FlatMiura.Build(10, 8);
        var layout = SheetLayout.Lay(miura, new FabricationSettings { ScaleDenominator = 50, KerfMm = 0 });
        Assert.Equal(0, layout.Figures.OverlappingTabCount);
        var facesOfPart = layout.Parts.ToDictionary(p => p.Number, p => p.Faces.Select(f =>
            Poly(miura.Folded.Faces[f].Select(v => p.VertexPositions[Array.BinarySearch(p.Vertices, v)]).ToArray())).ToArray());
        foreach (var seam in layout.Seams)
        {
            var tab = Poly(seam.Tab);
            Assert.All(facesOfPart[seam.TabPart], f => Assert.True(tab.Intersection(f).Area < 1e-6, $"tab {seam.Code} overlaps its part"));
            foreach (var other in layout.Seams.Where(o => o.TabPart == seam.TabPart && o.Code != seam.Code))
                Assert.True(tab.Intersection(Poly(other.Tab)).Area < 1e-6, $"tabs {seam.Code} and {other.Code} overlap");
            // Width cap: no tab point farther from the seam edge (its first two points) than the 7 mm tab width.
            var (a, b) = (seam.Tab[0], seam.Tab[1]);
            // The root lies on the seam, short of its ends by the clearance that keeps tabs off the next seam.
            Assert.InRange((b - a).Length, 0.5 * seam.LengthMm, seam.LengthMm - SheetLayout.TabClearanceMm);
            Assert.All(seam.Tab, t => Assert.True(Math.Abs(Vec2.Cross((b - a).Normalized(), t - a)) <= 7 + 1e-9));
            Assert.True(seam.Tab.Max(t => Math.Abs(Vec2.Cross((b - a).Normalized(), t - a))) > 1);
        }
    }
}
