using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Output.Sheets;

namespace Tessel.Tests.Sheets;

public class WriterFormatsTests
{
    [Theory]
    [InlineData("svg", ".svg", true)]
    [InlineData("DXF", ".dxf", true)]
    [InlineData("pdf", ".pdf", false)]
    [InlineData(" png ", ".png", true)]
    public void Formats_resolve_to_writers_with_the_right_extension(string name, string extension, bool onePerSheet)
    {
        ISheetWriter writer = SheetFormats.Create(name, pngDpi: 30);
        Assert.Equal(extension, writer.FileExtension);
        Assert.Equal(onePerSheet, writer.OneFilePerSheet);
    }

    [Fact]
    public void Unknown_format_is_refused_with_the_known_names()
    {
        var e = Assert.Throws<ArgumentException>(() => SheetFormats.Create("eps"));
        Assert.Contains("svg, dxf, pdf, png", e.Message);
    }

    [Fact]
    public void Every_writer_is_deterministic_and_single_sheet_writers_refuse_two()
    {
        Sheet a4 = WriterTestSheets.A4WithEveryClass(), small = WriterTestSheets.SmallWithOneLine();
        foreach (string name in SheetFormats.Names)
        {
            ISheetWriter writer = SheetFormats.Create(name, pngDpi: 30);
            byte[] Once()
            {
                using var ms = new MemoryStream();
                writer.Write([a4], LineStyleTable.Default, ms);
                return ms.ToArray();
            }
            byte[] first = Once();
            Assert.True(first.Length > 100, $"{name} wrote almost nothing");
            Assert.Equal(first, Once());
            if (writer.OneFilePerSheet)
                Assert.Throws<ArgumentException>(() => writer.Write([a4, small], LineStyleTable.Default, new MemoryStream()));
        }
    }

    [Fact]
    public void Sheets_without_a_size_or_with_non_finite_points_are_refused()
    {
        var bad = new Sheet(1, 100, 50, [new SheetLine(LineClass.Valley, [new(0, 0), new(double.NaN, 1)])]);
        foreach (string name in SheetFormats.Names)
        {
            ISheetWriter writer = SheetFormats.Create(name, pngDpi: 30);
            Assert.Throws<ArgumentException>(() => writer.Write([bad], LineStyleTable.Default, new MemoryStream()));
            Assert.Throws<ArgumentException>(() => writer.Write([new Sheet(1, 0, 50, [])], LineStyleTable.Default, new MemoryStream()));
        }
    }
}
