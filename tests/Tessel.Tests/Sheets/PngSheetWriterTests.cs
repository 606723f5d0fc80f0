using System.Buffers.Binary;
using System.Text;
using SkiaSharp;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Output.Sheets;

namespace Tessel.Tests.Sheets;

public class PngSheetWriterTests
{
    private static byte[] Write(Sheet sheet, int dpi, LineStyleTable? styles = null)
    {
        using var ms = new MemoryStream();
        new PngSheetWriter(dpi).Write(sheet, styles ?? LineStyleTable.Default, ms);
        return ms.ToArray();
    }

    [Fact]
    public void Phys_chunk_follows_ihdr_with_11811_pixels_per_metre_at_300_dpi()
    {
        // PNG (ISO/IEC 15948) pHYs: x and y pixels per unit, unit 1 = metre. 300 / 0.0254 = 11811.02.
        var chunks = PngFile.Chunks(Write(WriterTestSheets.SmallWithOneLine(), 300)).ToList();
        Assert.Equal("IHDR", chunks[0].Type);
        Assert.Equal("pHYs", chunks[1].Type);
        Assert.Single(chunks, c => c.Type == "pHYs");
        byte[] phys = chunks[1].Data;
        Assert.Equal(9, phys.Length);
        Assert.Equal(11811u, BinaryPrimitives.ReadUInt32BigEndian(phys));
        Assert.Equal(11811u, BinaryPrimitives.ReadUInt32BigEndian(phys.AsSpan(4)));
        Assert.Equal(1, phys[8]);
        Assert.Equal("IEND", chunks[^1].Type);
        Assert.Equal(3937u, new PngSheetWriter(100).PixelsPerMetre); // 100 / 0.0254 = 3937.008
    }

    [Fact]
    public void Every_chunk_crc_checks_out()
    {
        // CRC-32 check value from the PNG specification's algorithm: "123456789" -> CBF43926.
        Assert.Equal(0xCBF43926u, PngChunks.Crc32(Encoding.ASCII.GetBytes("123456789")));
        byte[] png = Write(WriterTestSheets.SmallWithOneLine(), 100);
        int at = 8;
        while (at < png.Length)
        {
            int length = (int)BinaryPrimitives.ReadUInt32BigEndian(png.AsSpan(at));
            uint stored = BinaryPrimitives.ReadUInt32BigEndian(png.AsSpan(at + 8 + length));
            Assert.Equal(PngChunks.Crc32(png.AsSpan(at + 4, 4 + length)), stored);
            at += 12 + length;
        }
        Assert.Equal(png.Length, at);
    }

    [Fact]
    public void A4_at_100_dpi_is_827_by_1169_pixels()
    {
        // 210 mm / 25.4 * 100 = 826.8 -> 827; 297 mm -> 1169.3 -> 1169.
        byte[] png = Write(WriterTestSheets.A4WithEveryClass(), 100);
        Assert.Equal((827, 1169), PngFile.Size(png));
        Assert.Equal((2480, 3508), new PngSheetWriter().PixelSize(WriterTestSheets.A4WithEveryClass()));
    }

    [Fact]
    public void Line_pixels_fall_where_the_geometry_says_and_dashes_leave_gaps()
    {
        // 254 dpi = 10 px per mm. Cut line y = 25 mm, x = 10..90 mm, 0.5 mm wide: rows 247.5..252.5.
        // Valley line x = 20 mm from y = 5 to 45 mm: dashes 3 mm, gaps 0.75 mm (12d/3d, d = 0.25 mm),
        // so the first dash covers y 5..8 mm and the first gap y 8..8.75 mm.
        var sheet = new Sheet(3, 100, 50,
        [
            new SheetLine(LineClass.CutOutline, [new(10, 25), new(90, 25)]),
            new SheetLine(LineClass.Valley, [new(20, 5), new(20, 45)]),
        ]);
        using SKBitmap bmp = SKBitmap.Decode(Write(sheet, 254, LineStyleTable.Default.WithStrokeWidth(0.5)));
        Assert.Equal((1000, 500), (bmp.Width, bmp.Height));
        SKColor onCut = bmp.GetPixel(500, 250);
        Assert.Equal((0x14, 0x14, 0x14), (onCut.Red, onCut.Green, onCut.Blue)); // the style colour exactly
        Assert.Equal(SKColors.White, bmp.GetPixel(500, 240));
        Assert.Equal(SKColors.White, bmp.GetPixel(500, 260));
        Assert.Equal(SKColors.White, bmp.GetPixel(50, 250));
        Assert.Equal(SKColors.White, bmp.GetPixel(950, 250));
        SKColor onDash = bmp.GetPixel(200, 65);
        Assert.Equal((0x2E, 0x8F, 0xE6), (onDash.Red, onDash.Green, onDash.Blue));
        Assert.Equal(SKColors.White, bmp.GetPixel(200, 84)); // inside the first gap
        Assert.Equal(SKColors.White, bmp.GetPixel(200, 20)); // above the line's start
    }

    [Fact]
    public void Image_is_not_blank_and_the_background_is_white()
    {
        using SKBitmap bmp = SKBitmap.Decode(Write(WriterTestSheets.A4WithEveryClass(), 50));
        int inked = 0;
        for (int y = 0; y < bmp.Height; y++)
            for (int x = 0; x < bmp.Width; x++)
                if (bmp.GetPixel(x, y) != SKColors.White) inked++;
        Assert.InRange(inked, 500, bmp.Width * bmp.Height / 10); // lines, not a flood
        Assert.Equal(SKColors.White, bmp.GetPixel(0, 0));
        Assert.Equal(SKColors.White, bmp.GetPixel(bmp.Width - 1, bmp.Height - 1));
    }

    [Fact]
    public void Output_is_identical_byte_for_byte()
    {
        Sheet sheet = WriterTestSheets.A4WithEveryClass();
        Assert.Equal(Write(sheet, 60), Write(sheet, 60));
    }

    [Fact]
    public void Unreasonable_resolutions_are_refused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new PngSheetWriter(0));
        Assert.Throws<ArgumentException>(() => new PngSheetWriter(2400).Write(new Sheet(1, 1000, 1000, []), LineStyleTable.Default, new MemoryStream()));
    }
}
