using System.Globalization;
using System.Text;
using Tessel.Core.Targets.Meshes;

namespace Tessel.Output.Writers;

/// <summary>Writes Wavefront OBJ text: vertices, polygon faces, optional named groups. Numbers use the
/// invariant culture and round-trip formatting, so equal meshes give byte-identical files.</summary>
public static class ObjWriter
{
    /// <summary>A named set of faces written under a <c>g</c> record.</summary>
    public sealed record Group(string Name, int[] Faces);

    /// <summary>OBJ bytes (UTF-8, '\n' line ends).</summary>
    /// <param name="positions">x, y, z per vertex (length 3V).</param>
    /// <param name="faces">Zero-based vertex indices per face, any number of corners (at least 3).</param>
    /// <param name="groups">Named face sets; faces in no group are written first, ungrouped.</param>
    /// <param name="comment">Lines written as # comments at the top; no timestamps, so output stays deterministic.</param>
    public static byte[] Write(double[] positions, int[][] faces, IReadOnlyList<Group>? groups = null, string? comment = null)
    {
        if (positions.Length % 3 != 0) throw new ArgumentException("positions must hold 3 numbers per vertex", nameof(positions));
        int n = positions.Length / 3;
        var sb = new StringBuilder();
        if (comment is not null)
            foreach (var line in comment.Split('\n')) sb.Append("# ").Append(line).Append('\n');
        for (int i = 0; i < n; i++)
            sb.Append("v ").Append(F(positions[3 * i])).Append(' ').Append(F(positions[3 * i + 1])).Append(' ').Append(F(positions[3 * i + 2])).Append('\n');
        var grouped = new bool[faces.Length];
        if (groups is not null)
            foreach (var g in groups)
                foreach (int f in g.Faces) grouped[f] = true;
        for (int f = 0; f < faces.Length; f++)
            if (!grouped[f]) Face(sb, faces[f], n);
        if (groups is not null)
            foreach (var g in groups)
            {
                if (string.IsNullOrWhiteSpace(g.Name) || g.Name.Any(char.IsWhiteSpace))
                    throw new ArgumentException($"OBJ group names cannot be empty or contain spaces: '{g.Name}'");
                sb.Append("g ").Append(g.Name).Append('\n');
                foreach (int f in g.Faces) Face(sb, faces[f], n);
            }
        return Encoding.UTF8.GetBytes(sb.ToString());
    }

    /// <summary>A triangle mesh as OBJ bytes.</summary>
    public static byte[] Write(TriangleMesh mesh, string? comment = null)
    {
        var faces = new int[mesh.TriangleCount][];
        for (int t = 0; t < faces.Length; t++) faces[t] = [mesh.Triangles[3 * t], mesh.Triangles[3 * t + 1], mesh.Triangles[3 * t + 2]];
        return Write(mesh.Positions, faces, null, comment);
    }

    private static void Face(StringBuilder sb, int[] face, int n)
    {
        if (face.Length < 3) throw new ArgumentException("an OBJ face needs at least 3 corners");
        sb.Append('f');
        foreach (int i in face)
        {
            if (i < 0 || i >= n) throw new ArgumentOutOfRangeException(nameof(face), $"vertex index {i} out of range 0..{n - 1}");
            sb.Append(' ').Append((i + 1).ToString(CultureInfo.InvariantCulture));
        }
        sb.Append('\n');
    }

    private static string F(double v) => v.ToString("R", CultureInfo.InvariantCulture);
}
