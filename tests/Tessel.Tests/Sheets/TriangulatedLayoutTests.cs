using NetTopologySuite.Geometries;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;

namespace Tessel.Tests.Sheets;

public class TriangulatedLayoutTests
{
    /// <summary>A jittered grid of nx x ny quads (0.5 m), each cut into two triangles; creases alternate
    /// mountain and valley. Deterministic jitter, so the pattern is irregular but repeatable.</summary>
    private static FlatPattern JitteredTriangles(int nx, int ny)
    {
        int Index(int i, int j) => j * (nx + 1) + i;
        var pos = new double[(nx + 1) * (ny + 1) * 3];
        var xy = new double[(nx + 1) * (ny + 1) * 2];
        for (int j = 0; j <= ny; j++)
            for (int i = 0; i <= nx; i++)
            {
                bool inner = i > 0 && j > 0 && i < nx && j < ny;
                double dx = inner ? 0.08 * Math.Sin(12.9898 * i + 78.233 * j) : 0;
                double dy = inner ? 0.08 * Math.Cos(39.3468 * i + 11.135 * j) : 0;
                int k = Index(i, j);
                pos[3 * k] = xy[2 * k] = 0.5 * i + dx;
                pos[3 * k + 1] = xy[2 * k + 1] = 0.5 * j + dy;
            }
        var faces = new List<int[]>();
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                faces.Add([Index(i, j), Index(i + 1, j), Index(i + 1, j + 1)]);
                faces.Add([Index(i, j), Index(i + 1, j + 1), Index(i, j + 1)]);
            }
        var mesh = new CreaseMesh("triangles", pos, faces.ToArray(), new VertexLayer[(nx + 1) * (ny + 1)],
            (a, b) => (a + b) % 2 == 0 ? CreaseRole.Mountain : CreaseRole.Valley);
        return new FlatPattern(mesh, xy, new double[mesh.EdgeCount]);
    }

    private static Polygon Poly(Vec2[] ring) =>
        new GeometryFactory().CreatePolygon(ring.Append(ring[0]).Select(p => new Coordinate(p.X, p.Y)).ToArray());

    [Fact]
    public void IrregularTrianglesSplitNestAndKeepTheInvariants()
    {
        // 16 x 12 quads of 0.5 m at 1:40 is about 200 x 150 mm: more than A5 landscape holds.
        var pattern = JitteredTriangles(16, 12);
        var settings = new FabricationSettings { ScaleDenominator = 40, Sheet = SheetSizes.A5.Landscape, Material = Materials.Polypropylene };
        var layout = SheetLayout.Lay(pattern, settings);
        Assert.True(layout.Figures.PartCount >= 2);
        Assert.Equal(Enumerable.Range(0, pattern.Folded.FaceCount), layout.Parts.SelectMany(p => p.Faces).OrderBy(f => f));
        foreach (var part in layout.Parts)
        {
            Assert.True(Poly(part.Outline).IsValid);
            Assert.All(part.Outline, p =>
            {
                Assert.InRange(p.X, settings.MarginMm - 1e-9, settings.Sheet.WidthMm - settings.MarginMm + 1e-9);
                Assert.InRange(p.Y, settings.MarginMm - 1e-9, settings.Sheet.HeightMm - settings.MarginMm + 1e-9);
            });
            foreach (var other in layout.Parts.Where(o => o.Sheet == part.Sheet && o.Number > part.Number))
                Assert.True(Poly(part.Outline).Distance(Poly(other.Outline)) >= settings.SpacingMm - 1e-9);
        }
        Assert.All(layout.Seams, s => Assert.Equal(2, layout.Labels.Count(l => l.Text == s.Code)));
        // Perforated: the figures' dash length matches the lines drawn.
        double drawn = layout.Sheets.SelectMany(s => s.Lines).Where(l => l.Class is LineClass.Mountain or LineClass.Valley)
            .Sum(l => (l.Points[^1] - l.Points[0]).Length);
        Assert.Equal(layout.Figures.PerforationCutLengthMm + layout.Figures.Folds.Where(f => f.Class != LineClass.TabFold).Sum(f => f.ScoreLengthMm), drawn, 6);
    }
}
