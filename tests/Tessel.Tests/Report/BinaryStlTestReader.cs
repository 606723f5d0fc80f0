using System.Buffers.Binary;
using System.Text;

namespace Tessel.Tests.Report;

/// <summary>A strict reader of binary STL for tests, written from the file layout (80-byte header,
/// uint32 count, 50 bytes per triangle; 3D Systems StereoLithography Interface Specification, 1989)
/// and independent of the writer's code.</summary>
internal static class BinaryStlTestReader
{
    /// <summary>One triangle as stored: normal and three corners, 32-bit floats.</summary>
    public sealed record Triangle(float[] Normal, float[] A, float[] B, float[] C, ushort Attribute);

    public static (string Header, Triangle[] Triangles) Read(byte[] bytes)
    {
        if (bytes.Length < 84) throw new InvalidDataException("shorter than a binary STL header");
        string header = Encoding.ASCII.GetString(bytes, 0, 80);
        uint count = BinaryPrimitives.ReadUInt32LittleEndian(bytes.AsSpan(80));
        if (bytes.Length != 84 + 50L * count) throw new InvalidDataException($"length {bytes.Length} does not fit {count} triangles");
        var tris = new Triangle[count];
        for (int t = 0; t < count; t++)
        {
            int at = 84 + 50 * t;
            float[] V(int k) => [F(bytes, at + 12 * k), F(bytes, at + 12 * k + 4), F(bytes, at + 12 * k + 8)];
            tris[t] = new Triangle(V(0), V(1), V(2), V(3), BinaryPrimitives.ReadUInt16LittleEndian(bytes.AsSpan(at + 48)));
        }
        return (header, tris);
    }

    private static float F(byte[] b, int at) => BinaryPrimitives.ReadSingleLittleEndian(b.AsSpan(at));
}
