using Tessel.Core.Sheets;

namespace Tessel.Tests.Sheets;

public class SheetSizesTests
{
    [Theory]
    // ISO 216 A and B series, portrait, mm.
    [InlineData("A0", 841, 1189)]
    [InlineData("A1", 594, 841)]
    [InlineData("A2", 420, 594)]
    [InlineData("A3", 297, 420)]
    [InlineData("A4", 210, 297)]
    [InlineData("A5", 148, 210)]
    [InlineData("B0", 1000, 1414)]
    [InlineData("B1", 707, 1000)]
    [InlineData("B2", 500, 707)]
    [InlineData("B3", 353, 500)]
    [InlineData("B4", 250, 353)]
    [InlineData("B5", 176, 250)]
    // ANSI/ASME Y14.1: Letter 8.5 x 11 in, Tabloid 11 x 17 in, 25.4 mm/in exactly.
    [InlineData("Letter", 215.9, 279.4)]
    [InlineData("Tabloid", 279.4, 431.8)]
    public void NamedSizesAreExact(string name, double width, double height)
    {
        Assert.True(SheetSizes.TryFind(name, out var s));
        Assert.Equal(width, s.WidthMm, 9);
        Assert.Equal(height, s.HeightMm, 9);
        Assert.True(SheetSizes.TryFind(name.ToLowerInvariant(), out var lower));
        Assert.Equal(s, lower);
    }

    [Fact]
    public void ParseHandlesTurningsCustomSizesAndUnknownNames()
    {
        var a4l = SheetSizes.Parse("a4 landscape");
        Assert.Equal((297.0, 210.0), (a4l.WidthMm, a4l.HeightMm));
        Assert.Equal((210.0, 297.0), (SheetSizes.Parse("A4 LANDSCAPE").Portrait.WidthMm, SheetSizes.Parse("A4").HeightMm));
        var custom = SheetSizes.Parse("420x297.5");
        Assert.Equal((420.0, 297.5), (custom.WidthMm, custom.HeightMm));
        Assert.Equal((297.5, 420.0), (SheetSizes.Parse("420x297.5 portrait").WidthMm, SheetSizes.Parse("420x297.5 portrait").HeightMm));
        var bed = SheetSizes.Parse("Studio-Bed");
        Assert.Equal((900.0, 600.0), (bed.WidthMm, bed.HeightMm));
        Assert.Throws<FormatException>(() => SheetSizes.Parse("A9"));
        Assert.Throws<FormatException>(() => SheetSizes.Parse("0x100"));
        Assert.Throws<FormatException>(() => SheetSizes.Parse("A4 sideways"));
    }

    [Fact]
    public void IsoSheetsHalveWithinAMillimetre()
    {
        // ISO 216: each size is the next larger one halved across its long side, rounded down to whole mm.
        var a = new[] { SheetSizes.A0, SheetSizes.A1, SheetSizes.A2, SheetSizes.A3, SheetSizes.A4, SheetSizes.A5 };
        for (int i = 1; i < a.Length; i++)
        {
            Assert.Equal(a[i - 1].WidthMm, a[i].HeightMm);
            Assert.Equal(Math.Floor(a[i - 1].HeightMm / 2), a[i].WidthMm);
        }
    }
}
