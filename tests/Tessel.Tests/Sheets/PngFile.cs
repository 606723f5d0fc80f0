using System.Buffers.Binary;
using System.Text;

namespace Tessel.Tests.Sheets;

/// <summary>Minimal PNG chunk reader for the tests (PNG, ISO/IEC 15948: 8-byte signature, then
/// chunks of length, type, data, CRC; IHDR first).</summary>
internal static class PngFile
{
    public static IEnumerable<(string Type, byte[] Data)> Chunks(byte[] png)
    {
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }, png.Take(8).ToArray());
        int at = 8;
        while (at + 12 <= png.Length)
        {
            int length = (int)BinaryPrimitives.ReadUInt32BigEndian(png.AsSpan(at));
            string type = Encoding.ASCII.GetString(png, at + 4, 4);
            yield return (type, png.AsSpan(at + 8, length).ToArray());
            at += 12 + length;
        }
    }

    public static (int Width, int Height) Size(byte[] png)
    {
        var ihdr = Chunks(png).First();
        Assert.Equal("IHDR", ihdr.Type);
        return ((int)BinaryPrimitives.ReadUInt32BigEndian(ihdr.Data), (int)BinaryPrimitives.ReadUInt32BigEndian(ihdr.Data.AsSpan(4)));
    }
}
