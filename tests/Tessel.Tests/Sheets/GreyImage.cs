using System.Text;

namespace Tessel.Tests.Sheets;

/// <summary>An 8-bit greyscale raster for pixel checks, read from a binary PGM (netpbm "P5").</summary>
internal sealed class GreyImage(int width, int height, byte[] pixels)
{
    public int Width { get; } = width;
    public int Height { get; } = height;
    public int this[int x, int y] => pixels[y * Width + x];

    public static GreyImage ReadPgm(byte[] file)
    {
        // Header: "P5", width, height, maxval, separated by whitespace, then one byte per pixel.
        int at = 0;
        string Token()
        {
            while (char.IsWhiteSpace((char)file[at])) at++;
            int start = at;
            while (!char.IsWhiteSpace((char)file[at])) at++;
            return Encoding.ASCII.GetString(file, start, at - start);
        }
        Assert.Equal("P5", Token());
        int w = int.Parse(Token()), h = int.Parse(Token());
        Assert.Equal("255", Token());
        at++; // the single whitespace byte after maxval
        return new GreyImage(w, h, file.AsSpan(at, w * h).ToArray());
    }
}
