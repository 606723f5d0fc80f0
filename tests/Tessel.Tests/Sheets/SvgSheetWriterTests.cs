using System.Globalization;
using System.Xml.Linq;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Output.Sheets;

namespace Tessel.Tests.Sheets;

public class SvgSheetWriterTests
{
    private static readonly XNamespace Svg = "http://www.w3.org/2000/svg";

    private static byte[] Write(Sheet sheet, LineStyleTable? styles = null)
    {
        using var ms = new MemoryStream();
        new SvgSheetWriter().Write(sheet, styles ?? LineStyleTable.Default, ms);
        return ms.ToArray();
    }

    [Fact]
    public void A4_is_written_at_true_size_with_a_millimetre_viewbox()
    {
        // ISO 216: A4 = 210 x 297 mm. One user unit = 1 mm when the viewBox equals the size in mm.
        var doc = XDocument.Load(new MemoryStream(Write(WriterTestSheets.A4WithEveryClass())));
        XElement root = doc.Root!;
        Assert.Equal(Svg + "svg", root.Name);
        Assert.Equal("210mm", root.Attribute("width")!.Value);
        Assert.Equal("297mm", root.Attribute("height")!.Value);
        Assert.Equal("0 0 210 297", root.Attribute("viewBox")!.Value);
    }

    [Fact]
    public void One_group_per_layer_with_every_line_as_a_path_and_no_fills()
    {
        Sheet sheet = WriterTestSheets.A4WithEveryClass();
        var doc = XDocument.Load(new MemoryStream(Write(sheet)));
        var groups = doc.Root!.Elements(Svg + "g").ToArray();
        Assert.Equal(LineStyleTable.FabricationOrder.Select(c => LineStyleTable.Default[c].LayerName),
                     groups.Select(g => g.Attribute("id")!.Value));
        foreach (LineClass c in Enum.GetValues<LineClass>())
        {
            XElement g = groups.Single(x => x.Attribute("id")!.Value == LineStyleTable.Default[c].LayerName);
            Assert.Equal(sheet.Lines.Count(l => l.Class == c), g.Elements(Svg + "path").Count());
            Assert.Equal("none", g.Attribute("fill")!.Value);
            Assert.Equal(LineStyleTable.Default[c].ColourHex, g.Attribute("stroke")!.Value);
        }
        Assert.DoesNotContain(doc.Descendants(), e => e.Name == Svg + "text");
        // Valley: ISO 128-20 dashed, 12d / 3d with d = 0.25 mm.
        XElement valley = groups.Single(x => x.Attribute("id")!.Value == LineStyleTable.Default[LineClass.Valley].LayerName);
        Assert.Equal("3 0.75", valley.Attribute("stroke-dasharray")!.Value);
        XElement outline = groups.Single(x => x.Attribute("id")!.Value == LineStyleTable.Default[LineClass.CutOutline].LayerName);
        Assert.Null(outline.Attribute("stroke-dasharray"));
        Assert.Equal("M20,20 L120,20 L120,100 L20,100 Z", outline.Elements(Svg + "path").First().Attribute("d")!.Value);
    }

    [Fact]
    public void Output_is_identical_byte_for_byte_and_culture_independent()
    {
        Sheet sheet = WriterTestSheets.A4WithEveryClass();
        byte[] first = Write(sheet);
        CultureInfo saved = CultureInfo.CurrentCulture;
        try
        {
            CultureInfo.CurrentCulture = CultureInfo.InvariantCulture;
            Assert.Equal(first, Write(sheet));
        }
        finally { CultureInfo.CurrentCulture = saved; }
        Assert.DoesNotContain((byte)0xEF, first.Take(3)); // no byte-order mark
    }

    [Fact]
    public void Hostile_side_text_is_escaped_and_the_file_still_parses()
    {
        Sheet sheet = WriterTestSheets.SmallWithOneLine() with { Side = "back <&> \"q\" -- x -" };
        var doc = XDocument.Load(new MemoryStream(Write(sheet)));
        Assert.Contains("back <&> \"q\"", doc.Root!.Element(Svg + "title")!.Value);
    }

    [Fact]
    public void More_than_one_sheet_per_file_is_refused()
    {
        Sheet s = WriterTestSheets.SmallWithOneLine();
        Assert.Throws<ArgumentException>(() => new SvgSheetWriter().Write([s, s], LineStyleTable.Default, new MemoryStream()));
    }

    [Fact]
    public void Rsvg_renders_a4_at_96_dpi_to_794_by_1123_pixels()
    {
        // CSS Values and Units Level 3: 96 px per inch, 25.4 mm per inch.
        // 210 mm -> 793.7 px, 297 mm -> 1122.5 px; rsvg-convert rounds up to whole pixels.
        string dir = Path.Combine(Path.GetTempPath(), "tessel-svg-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        try
        {
            string svgPath = Path.Combine(dir, "a4.svg"), pngPath = Path.Combine(dir, "a4.png");
            File.WriteAllBytes(svgPath, Write(WriterTestSheets.A4WithEveryClass()));
            var run = ExternalTool.Run("rsvg-convert", $"--dpi-x 96 --dpi-y 96 -o \"{pngPath}\" \"{svgPath}\"");
            Assert.True(run.ExitCode == 0, run.Output);
            var (width, height) = PngFile.Size(File.ReadAllBytes(pngPath));
            Assert.Equal(794, width);
            Assert.Equal(1123, height);
        }
        finally { Directory.Delete(dir, recursive: true); }
    }
}
