using System.Text;
using Tessel.Core.Checks;
using Tessel.Core.Fitting;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Output.Writers;

namespace Tessel.Tests.Output.Writers;

/// <summary>The model writers on worked tiny examples: a square of two triangles folded along its diagonal.</summary>
public class ModelWriterTests
{
    // Vertices 0 (0,0) 1 (1,0) 2 (1,1) 3 (0,1), 3 raised by 0.5 m; faces 0-1-2 and 0-2-3 share the diagonal 0-2.
    // Edges sort by (v0, v1): 0-1, 0-2, 0-3, 1-2, 2-3; only 0-2 is interior.
    private static CreaseMesh FoldedSquare(CreaseRole diagonal) => new("test", [0, 0, 0, 1, 0, 0, 1, 1, 0, 0, 1, 0.5],
        [[0, 1, 2], [0, 2, 3]], [VertexLayer.Top, VertexLayer.Top, VertexLayer.Top, VertexLayer.Top], (_, _) => diagonal);

    [Fact]
    public void FoldedModelObjHasPanelsThenCreasesByRole()
    {
        var text = Encoding.UTF8.GetString(FoldedModelObjWriter.Write(FoldedSquare(CreaseRole.Mountain), "tiny"));
        // Wavefront OBJ: "l i j" is a polyline through 1-based vertices, "g" a group (value from memory).
        Assert.Equal(
            "# tiny\nv 0 0 0\nv 1 0 0\nv 1 1 0\nv 0 1 0.5\ng panels\nf 1 2 3\nf 1 3 4\n" +
            "g mountain\nl 1 3\ng boundary\nl 1 2\nl 1 4\nl 2 3\nl 3 4\n", text);
    }

    [Fact]
    public void ParetoCsvRoundTripsEveryNumber()
    {
        var front = new[]
        {
            new ParetoPoint(0.5, 0.1, 0.25, 1e-7, 0.00873, 1.5e-10, 2e-9, true),
            new ParetoPoint(1, 1.0 / 3, 0.5, 12, 0.0175, 0, 0, false),
        };
        var text = Encoding.UTF8.GetString(ParetoCsvWriter.Write(front));
        var lines = text.Split('\n');
        Assert.Equal(ParetoCsvWriter.Header, lines[0]);
        Assert.Equal("0.5,0.1,0.25,1E-07,0.00873,1.5E-10,2E-09,true", lines[1]);
        Assert.Equal("1,0.3333333333333333,0.5,12,0.0175,0,0,false", lines[2]);
        Assert.Equal(1.0 / 3, double.Parse(lines[2].Split(',')[1], System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal("", lines[3]);
        Assert.Equal(4, lines.Length);
    }

    [Fact]
    public void FoldAngleCsvHasFixedDecimalsAndInvariantNumbers()
    {
        var rows = new[] { new FoldAngleRow(7, 2, 5, CreaseRole.Valley, 0.8, 16.0, -80.00049) };
        var csv = FoldAngleCsvWriter.ToCsv(rows);
        Assert.Equal("edge,v0,v1,role,length_m,model_length_mm,fold_angle_deg\n7,2,5,valley,0.800000,16.000,-80.000\n", csv);
    }

    [Fact]
    public void FoldAngleCsvOfTheFoldedSquareGivesTheDiagonal()
    {
        // The diagonal 0-2 is sqrt(2) m long, 14.142 mm at 1:100.
        var csv = FoldAngleCsvWriter.ToCsv(FoldAngleTable.Build(FoldedSquare(CreaseRole.Valley), 100));
        var row = csv.Split('\n')[1].Split(',');
        Assert.Equal(["1", "0", "2", "valley", "1.414214", "14.142"], row[..6]);
    }

    [Fact]
    public void CreasePatternDrawingIsTrueSizeWithABorderAndALegendStrip()
    {
        // A 1 m x 0.5 m rectangle cut along its diagonal (valley) at 1:100: 10 mm x 5 mm inside a 10 mm border.
        var mesh = new CreaseMesh("test", [0, 0, 0, 1, 0, 0, 1, 0.5, 0, 0, 0.5, 0], [[0, 1, 2], [0, 2, 3]],
            [VertexLayer.Top, VertexLayer.Top, VertexLayer.Top, VertexLayer.Top], (_, _) => CreaseRole.Valley);
        var flat = new FlatPattern(mesh, [0, 0, 1, 0, 1, 0.5, 0, 0.5], new double[mesh.EdgeCount]);
        var sheet = CreasePatternSvgWriter.Layout(flat, 100, "lantern-yard", LineStyleTable.Default);

        // Narrower than the legend, so the drawing takes the legend's width plus two borders.
        Assert.Equal(CreasePatternSvgWriter.MinimumLegendWidthMm + 2 * CreasePatternSvgWriter.BorderMm, sheet.WidthMm, 12);
        var valley = Assert.Single(sheet.Lines, l => l.Class == LineClass.Valley);
        // y down: the pattern's top edge (y = 0.5 m) is at the border, its bottom 5 mm lower. Turning the
        // rectangle by a half turn maps the diagonal onto itself, so only the end points' set is fixed.
        var ends = valley.Points.Select(p => (Math.Round(p.X, 9), Math.Round(p.Y, 9))).OrderBy(p => p).ToArray();
        Assert.Equal([(10.0, 15.0), (20.0, 10.0)], ends);
        var outline = sheet.Lines.Where(l => l.Class == LineClass.CutOutline).SelectMany(l => l.Points)
            .Select(p => (Math.Round(p.X, 9), Math.Round(p.Y, 9))).Distinct().OrderBy(p => p).ToArray();
        Assert.Equal([(10.0, 10.0), (10.0, 15.0), (20.0, 10.0), (20.0, 15.0)], outline);
        // The legend strip sits below the pattern: the sheet is taller than pattern and two borders.
        Assert.True(sheet.HeightMm > 5 + 3 * CreasePatternSvgWriter.BorderMm, $"height {sheet.HeightMm}");

        var svg = Encoding.UTF8.GetString(CreasePatternSvgWriter.Write(flat, 100, "lantern-yard", LineStyleTable.Default));
        Assert.Contains($"width=\"{CreasePatternSvgWriter.MinimumLegendWidthMm + 2 * CreasePatternSvgWriter.BorderMm}mm\"", svg);
        Assert.True(svg.Contains("M10,15 L20,10") || svg.Contains("M20,10 L10,15"), "the valley is drawn at its place");
    }
}
