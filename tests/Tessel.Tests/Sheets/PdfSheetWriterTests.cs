using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Output.Sheets;

namespace Tessel.Tests.Sheets;

public class PdfSheetWriterTests
{
    private static byte[] Write(IReadOnlyList<Sheet> sheets, LineStyleTable? styles = null)
    {
        using var ms = new MemoryStream();
        new PdfSheetWriter().Write(sheets, styles ?? LineStyleTable.Default, ms);
        return ms.ToArray();
    }

    private static List<(double W, double H)> MediaBoxes(byte[] pdf) =>
        Regex.Matches(Encoding.Latin1.GetString(pdf), @"/MediaBox \[0 0 ([0-9.]+) ([0-9.]+)\]")
            .Select(m => (double.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture), double.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture)))
            .ToList();

    private static string TempDir()
    {
        string dir = Path.Combine(Path.GetTempPath(), "tessel-pdf-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        return dir;
    }

    [Fact]
    public void A4_page_is_595_28_by_841_89_points_in_the_mediabox()
    {
        // ISO 32000-1: 1 pt = 1/72 in; ISO 216 A4 = 210 x 297 mm = 595.28 x 841.89 pt.
        var boxes = MediaBoxes(Write([WriterTestSheets.A4WithEveryClass()]));
        Assert.Single(boxes);
        Assert.Equal(595.28, boxes[0].W, 2);
        Assert.Equal(841.89, boxes[0].H, 2);
    }

    [Fact]
    public void One_page_per_sheet_each_at_its_own_size_checked_by_pdfinfo()
    {
        Sheet a4 = WriterTestSheets.A4WithEveryClass();
        Sheet small = WriterTestSheets.SmallWithOneLine(); // 100 x 50 mm = 283.46 x 141.73 pt
        string dir = TempDir();
        try
        {
            string path = Path.Combine(dir, "sheets.pdf");
            File.WriteAllBytes(path, Write([a4, small]));
            var run = ExternalTool.Run("pdfinfo", $"-f 1 -l 2 \"{path}\"");
            Assert.True(run.ExitCode == 0, run.Output);
            Assert.Matches(@"Pages:\s+2\b", run.Output);
            Assert.Matches(@"Page\s+1 size:\s+595\.27\d* x 841\.89 pts \(A4\)", run.Output);
            Assert.Matches(@"Page\s+2 size:\s+283\.46\d* x 141\.73\d* pts", run.Output);
            Assert.DoesNotContain("Error", run.Output); // a broken xref after the MediaBox patch would show here
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void Cross_reference_offsets_point_at_their_objects_after_the_patch()
    {
        byte[] pdf = Write([WriterTestSheets.A4WithEveryClass(), WriterTestSheets.SmallWithOneLine()]);
        string text = Encoding.Latin1.GetString(pdf);
        int startxref = int.Parse(Regex.Match(text, @"startxref\n(\d+)\n%%EOF\n$").Groups[1].Value, CultureInfo.InvariantCulture);
        Assert.StartsWith("xref\n", text[startxref..]);
        var entries = Regex.Matches(text[startxref..], @"(\d{10}) (\d{5}) n \n");
        Assert.NotEmpty(entries);
        int objectNumber = 1;
        foreach (Match m in entries)
        {
            int offset = int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture);
            Assert.StartsWith($"{objectNumber} 0 obj", text[offset..]);
            objectNumber++;
        }
    }

    [Fact]
    public void Output_is_identical_byte_for_byte_with_fixed_metadata_and_no_dates()
    {
        Sheet[] sheets = [WriterTestSheets.A4WithEveryClass(), WriterTestSheets.SmallWithOneLine()];
        byte[] first = Write(sheets);
        Assert.Equal(first, Write(sheets));
        string text = Encoding.Latin1.GetString(first);
        Assert.DoesNotContain("/CreationDate", text);
        Assert.DoesNotContain("/ModDate", text);
        Assert.DoesNotContain("/ID", text);
        Assert.Contains("/Producer (Tessel)", text);
    }

    [Fact]
    public void Rendered_page_shows_the_line_where_the_geometry_says()
    {
        // 100 x 50 mm sheet, cut line along y = 25 mm from x = 10 to 90 mm, drawn 0.5 mm wide.
        // pdftoppm at 254 dpi gives 10 px per mm, so the line covers rows 248..251 from column 100 to 900.
        string dir = TempDir();
        try
        {
            string path = Path.Combine(dir, "line.pdf");
            File.WriteAllBytes(path, Write([WriterTestSheets.SmallWithOneLine()], LineStyleTable.Default.WithStrokeWidth(0.5)));
            var run = ExternalTool.Run("pdftoppm", $"-r 254 -gray -singlefile \"{path}\" \"{Path.Combine(dir, "page")}\"");
            Assert.True(run.ExitCode == 0, run.Output);
            var image = GreyImage.ReadPgm(File.ReadAllBytes(Path.Combine(dir, "page.pgm")));
            // 283.4646 pt x 254/72 = 1000.0 px; poppler rounds the float product up, so allow one extra pixel.
            Assert.InRange(image.Width, 1000, 1001);
            Assert.InRange(image.Height, 500, 501);
            Assert.True(image[500, 250] < 60, $"on the line: {image[500, 250]}");
            Assert.True(image[150, 249] < 60, $"on the line: {image[150, 249]}");
            Assert.Equal(255, image[500, 240]); // 1 mm above
            Assert.Equal(255, image[500, 260]); // 1 mm below
            Assert.Equal(255, image[50, 250]);  // 5 mm: before the line starts
            Assert.Equal(255, image[950, 250]); // 95 mm: after it ends
        }
        finally { Directory.Delete(dir, true); }
    }
}
