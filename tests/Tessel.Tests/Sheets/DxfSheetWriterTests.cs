using System.Globalization;
using System.Text;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Output.Sheets;

namespace Tessel.Tests.Sheets;

public class DxfSheetWriterTests
{
    private static string Write(Sheet sheet, LineStyleTable? styles = null)
    {
        using var ms = new MemoryStream();
        new DxfSheetWriter().Write(sheet, styles ?? LineStyleTable.Default, ms);
        return Encoding.ASCII.GetString(ms.ToArray());
    }

    [Fact]
    public void Header_declares_r12_and_the_sheet_extents()
    {
        // Autodesk DXF Reference: $ACADVER AC1009 = Release 12.
        var dxf = new WriterDxfReader(Write(WriterTestSheets.A4WithEveryClass()));
        Assert.Equal([(1, "AC1009")], dxf.HeaderVariable("$ACADVER"));
        Assert.Equal([(10, "0.0000"), (20, "0.0000"), (30, "0.0000")], dxf.HeaderVariable("$EXTMIN"));
        Assert.Equal([(10, "210.0000"), (20, "297.0000"), (30, "0.0000")], dxf.HeaderVariable("$EXTMAX"));
    }

    [Fact]
    public void Segments_per_layer_survive_the_round_trip()
    {
        Sheet sheet = WriterTestSheets.A4WithEveryClass();
        var dxf = new WriterDxfReader(Write(sheet));
        var expected = sheet.Lines.GroupBy(l => LineStyleTable.Default[l.Class].LayerName)
            .ToDictionary(g => g.Key, g => g.Sum(l => l.Points.Length - 1 + (l.Closed ? 1 : 0)));
        Assert.Equal(expected.OrderBy(kv => kv.Key), dxf.SegmentsPerLayer().OrderBy(kv => kv.Key));
        // Two-point lines are LINE entities, the rest POLYLINEs; the closed outline keeps its flag.
        var entities = dxf.Entities();
        Assert.Equal(sheet.Lines.Count(l => l.Points.Length == 2 && !l.Closed), dxf.Records().Count(r => r.Type == "LINE"));
        Assert.Equal(sheet.Lines.Count(l => l.Closed), entities.Count(e => e.Closed));
    }

    [Fact]
    public void Y_is_flipped_because_dxf_y_points_up()
    {
        // The mountain line runs at sheet y = 60 mm on a 297 mm sheet: DXF y = 237.
        var dxf = new WriterDxfReader(Write(WriterTestSheets.A4WithEveryClass()));
        var mountain = dxf.Entities().Single(e => e.Layer == LineStyleTable.Default[LineClass.Mountain].LayerName);
        Assert.Equal([(20.0, 237.0), (120.0, 237.0)], mountain.Points);
    }

    [Fact]
    public void Tables_hold_one_layer_per_class_with_colour_and_line_type()
    {
        var dxf = new WriterDxfReader(Write(WriterTestSheets.A4WithEveryClass()));
        var layers = dxf.TableEntries("LAYER");
        Assert.Equal(Enum.GetValues<LineClass>().Length, layers.Count);
        var ltypes = dxf.TableEntries("LTYPE").ToDictionary(g => g[2]);
        foreach (LineClass c in Enum.GetValues<LineClass>())
        {
            LineStyle s = LineStyleTable.Default[c];
            var layer = layers.Single(l => l[2] == s.LayerName);
            int expected = s.Operation == LineOperation.DrawOnly ? -s.DxfColourIndex : s.DxfColourIndex;
            Assert.Equal(expected.ToString(CultureInfo.InvariantCulture), layer[62]);
            Assert.True(ltypes.ContainsKey(layer[6]), $"layer {s.LayerName} uses undefined line type {layer[6]}");
        }
        // Valley: dashed 12d/3d with d = 0.25 mm: 3 mm dash, 0.75 mm gap, pattern length 3.75 mm.
        var valley = ltypes[layers.Single(l => l[2] == LineStyleTable.Default[LineClass.Valley].LayerName)[6]];
        Assert.Equal("2", valley[73]);
        Assert.Equal("3.7500", valley[40]);
    }

    [Fact]
    public void No_lwpolyline_no_insunits_and_it_ends_with_eof()
    {
        string text = Write(WriterTestSheets.A4WithEveryClass());
        Assert.DoesNotContain("LWPOLYLINE", text);
        Assert.DoesNotContain("$INSUNITS", text);
        Assert.EndsWith("  0\nEOF\n", text);
        Assert.StartsWith("999\n", text);
        Assert.All(text, c => Assert.True(c == '\n' || (c >= ' ' && c <= '~'), "R12 ASCII only"));
    }

    [Fact]
    public void Output_is_identical_byte_for_byte()
    {
        Sheet sheet = WriterTestSheets.A4WithEveryClass() with { Side = "back\n0\nEOF" };
        string a = Write(sheet), b = Write(sheet);
        Assert.Equal(a, b);
        // A hostile side text cannot inject group codes: the comment stays one line.
        Assert.Single(new WriterDxfReader(a).Pairs, p => p.Value == "EOF");
    }
}
