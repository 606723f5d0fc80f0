using System.Buffers.Binary;
using System.Text;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Output.Writers;

/// <summary>Writes the folded model as binary STL for 3D printing or viewing: an 80-byte header of fixed
/// text, a 32-bit triangle count, then per triangle a unit normal, three corners and a zero attribute
/// word; all numbers little endian, 32-bit floats (binary layout per the 3D Systems StereoLithography
/// Interface Specification, 1989).</summary>
/// <remarks>
/// Coordinates are written in millimetres at model scale (full-scale metres * 1000 / n), the unit
/// slicers assume. Faces are split into triangles as a fan from their first corner, so a quad
/// [a, b, c, d] becomes (a, b, c) and (a, c, d): the split along the a-c diagonal that the OBJ output
/// uses too. Normals follow the faces' counter-clockwise order, so they point to the top side.
/// </remarks>
public static class StlWriter
{
    /// <summary>The header text (padded with spaces to 80 bytes). It must not start with "solid", which
    /// readers take as the mark of ASCII STL.</summary>
    public const string HeaderText = "Tessel folded model; binary STL; millimetres at model scale";

    /// <summary>Number of triangles the faces are split into (a face of k corners gives k - 2).</summary>
    public static int TriangleCount(int[][] faces) => faces.Sum(f => Math.Max(0, f.Length - 2));

    /// <summary>The STL file as bytes.</summary>
    /// <param name="positions">#V*3 vertex positions in metres at full scale.</param>
    /// <param name="faces">#F faces, counter-clockwise seen from the top side.</param>
    /// <param name="scaleDenominator">Model scale 1:n.</param>
    public static byte[] ToBytes(double[] positions, int[][] faces, double scaleDenominator)
    {
        if (positions.Length % 3 != 0) throw new ArgumentException("positions must hold 3 numbers per vertex");
        if (!(scaleDenominator > 0) || !double.IsFinite(scaleDenominator)) throw new ArgumentException("scale denominator must be a positive number");
        int n = positions.Length / 3;
        int count = TriangleCount(faces);
        var bytes = new byte[84 + 50 * count];
        var header = Encoding.ASCII.GetBytes(HeaderText.PadRight(80));
        header.CopyTo(bytes, 0);
        BinaryPrimitives.WriteUInt32LittleEndian(bytes.AsSpan(80), (uint)count);
        double k = 1000 / scaleDenominator;
        int at = 84;
        foreach (var f in faces)
        {
            foreach (int v in f)
                if (v < 0 || v >= n) throw new ArgumentException($"face refers to vertex {v} of {n}");
            for (int t = 1; t + 1 < f.Length; t++)
            {
                var a = k * Vec3.Read(positions, f[0]);
                var b = k * Vec3.Read(positions, f[t]);
                var c = k * Vec3.Read(positions, f[t + 1]);
                var normal = Vec3.Cross(b - a, c - a).Normalized();
                at = Put(bytes, at, normal);
                at = Put(bytes, at, a);
                at = Put(bytes, at, b);
                at = Put(bytes, at, c);
                at += 2; // attribute byte count, zero
            }
        }
        return bytes;
    }

    /// <summary>The folded mesh as STL bytes (see <see cref="ToBytes(double[], int[][], double)"/>).</summary>
    public static byte[] ToBytes(CreaseMesh folded, double scaleDenominator) => ToBytes(folded.Positions, folded.Faces, scaleDenominator);

    /// <summary>Writes the STL to <paramref name="path"/> through a temporary file in the same folder
    /// and a rename, so readers never see a half-written file.</summary>
    public static void WriteFile(string path, double[] positions, int[][] faces, double scaleDenominator) =>
        IO.AtomicFile.Write(path, ToBytes(positions, faces, scaleDenominator));

    private static int Put(byte[] bytes, int at, Vec3 v)
    {
        BinaryPrimitives.WriteSingleLittleEndian(bytes.AsSpan(at), (float)v.X);
        BinaryPrimitives.WriteSingleLittleEndian(bytes.AsSpan(at + 4), (float)v.Y);
        BinaryPrimitives.WriteSingleLittleEndian(bytes.AsSpan(at + 8), (float)v.Z);
        return at + 12;
    }
}
