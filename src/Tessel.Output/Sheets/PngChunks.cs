using System.Buffers.Binary;
using System.Text;

namespace Tessel.Output.Sheets;

/// <summary>PNG chunk surgery (ISO/IEC 15948): each chunk is a 4-byte big-endian length, a 4-byte
/// type, the data, and a CRC-32 over type and data; the 8-byte signature is followed by IHDR.</summary>
internal static class PngChunks
{
    private const int SignatureLength = 8;

    /// <summary>Returns <paramref name="png"/> with any pHYs chunk removed and a new one, in pixels
    /// per metre on both axes (unit specifier 1 = metre), inserted right after IHDR.</summary>
    public static byte[] SetPhysicalResolution(byte[] png, uint pixelsPerMetre)
    {
        if (png.Length < SignatureLength + 25 || Encoding.ASCII.GetString(png, 12, 4) != "IHDR")
            throw new InvalidOperationException("Not a PNG starting with IHDR.");
        var physData = new byte[9];
        BinaryPrimitives.WriteUInt32BigEndian(physData, pixelsPerMetre);
        BinaryPrimitives.WriteUInt32BigEndian(physData.AsSpan(4), pixelsPerMetre);
        physData[8] = 1;

        using var output = new MemoryStream(png.Length + 21);
        output.Write(png, 0, SignatureLength);
        int at = SignatureLength;
        bool inserted = false;
        while (at < png.Length)
        {
            int length = checked((int)BinaryPrimitives.ReadUInt32BigEndian(png.AsSpan(at)));
            string type = Encoding.ASCII.GetString(png, at + 4, 4);
            int total = 12 + length;
            if (type != "pHYs") output.Write(png, at, total);
            if (type == "IHDR" && !inserted) { WriteChunk(output, "pHYs", physData); inserted = true; }
            at += total;
        }
        return output.ToArray();
    }

    /// <summary>Writes one chunk with its CRC.</summary>
    public static void WriteChunk(Stream output, string type, byte[] data)
    {
        Span<byte> word = stackalloc byte[4];
        BinaryPrimitives.WriteUInt32BigEndian(word, (uint)data.Length);
        output.Write(word);
        byte[] typeBytes = Encoding.ASCII.GetBytes(type);
        output.Write(typeBytes);
        output.Write(data);
        BinaryPrimitives.WriteUInt32BigEndian(word, Crc32([.. typeBytes, .. data]));
        output.Write(word);
    }

    private static readonly uint[] CrcTable = BuildCrcTable();

    /// <summary>The CRC-32 the PNG standard specifies (polynomial 0xEDB88320, reflected, initial and
    /// final XOR 0xFFFFFFFF).</summary>
    public static uint Crc32(ReadOnlySpan<byte> bytes)
    {
        uint crc = 0xFFFFFFFFu;
        foreach (byte b in bytes) crc = CrcTable[(crc ^ b) & 0xFF] ^ (crc >> 8);
        return crc ^ 0xFFFFFFFFu;
    }

    private static uint[] BuildCrcTable()
    {
        var table = new uint[256];
        for (uint n = 0; n < 256; n++)
        {
            uint c = n;
            for (int k = 0; k < 8; k++) c = (c & 1) != 0 ? 0xEDB88320u ^ (c >> 1) : c >> 1;
            table[n] = c;
        }
        return table;
    }
}
