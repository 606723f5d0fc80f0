using System.Buffers.Binary;
using System.Globalization;
using System.Text;
using Tessel.Core.Jobs;

namespace Tessel.Core.Targets.Meshes;

/// <summary>Reads STL files, binary or ASCII, into an indexed mesh by merging corners with identical
/// coordinates.</summary>
/// <remarks>STL stores single-precision numbers (binary: 80-byte header, uint32 count, 50 bytes per
/// facet). ASCII coordinates are parsed as single precision too, so the two forms of one mesh give
/// identical vertices. A file is binary when its length is exactly 84 + 50 * count.</remarks>
public static class StlMeshReader
{
    /// <summary>Parses STL bytes.</summary>
    /// <exception cref="JobError">Malformed file or no triangles.</exception>
    public static TriangleMesh Parse(byte[] bytes, string sourceName)
    {
        if (bytes.Length >= 84)
        {
            uint count = BinaryPrimitives.ReadUInt32LittleEndian(bytes.AsSpan(80, 4));
            if (84L + 50L * count == bytes.Length) return ParseBinary(bytes, (int)count, sourceName);
        }
        string head = Encoding.ASCII.GetString(bytes, 0, Math.Min(bytes.Length, 512)).TrimStart();
        if (!head.StartsWith("solid", StringComparison.Ordinal))
            throw new JobError(sourceName, "not an STL file: neither binary (84 + 50 * n bytes) nor ASCII (starting with 'solid')");
        return ParseAscii(Encoding.ASCII.GetString(bytes), sourceName);
    }

    private static TriangleMesh ParseBinary(byte[] b, int count, string source)
    {
        var welder = new Welder();
        for (int t = 0; t < count; t++)
        {
            int o = 84 + 50 * t + 12; // skip the facet normal
            for (int k = 0; k < 3; k++)
            {
                float x = BinaryPrimitives.ReadSingleLittleEndian(b.AsSpan(o + 12 * k, 4));
                float y = BinaryPrimitives.ReadSingleLittleEndian(b.AsSpan(o + 12 * k + 4, 4));
                float z = BinaryPrimitives.ReadSingleLittleEndian(b.AsSpan(o + 12 * k + 8, 4));
                if (!float.IsFinite(x) || !float.IsFinite(y) || !float.IsFinite(z))
                    throw new JobError(source, $"facet {t + 1} has a non-finite coordinate");
                welder.Add(x, y, z);
            }
        }
        return welder.Finish(source);
    }

    private static TriangleMesh ParseAscii(string text, string source)
    {
        var welder = new Welder();
        var tokens = text.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries);
        for (int i = 0; i < tokens.Length; i++)
        {
            if (tokens[i] != "vertex") continue;
            if (i + 3 >= tokens.Length) throw new JobError(source, "'vertex' needs x y z");
            var v = new float[3];
            for (int k = 0; k < 3; k++)
                if (!float.TryParse(tokens[i + 1 + k], NumberStyles.Float, CultureInfo.InvariantCulture, out v[k]) || !float.IsFinite(v[k]))
                    throw new JobError(source, $"'{tokens[i + 1 + k]}' is not a finite number");
            welder.Add(v[0], v[1], v[2]);
            i += 3;
        }
        if (welder.CornerCount % 3 != 0) throw new JobError(source, "the number of vertices is not a multiple of 3");
        return welder.Finish(source);
    }

    private sealed class Welder
    {
        private readonly Dictionary<(float, float, float), int> _index = new();
        private readonly List<double> _pos = new();
        private readonly List<int> _tris = new();

        public int CornerCount => _tris.Count;

        public void Add(float x, float y, float z)
        {
            if (!_index.TryGetValue((x, y, z), out int i))
            {
                i = _pos.Count / 3;
                _index[(x, y, z)] = i;
                _pos.Add(x); _pos.Add(y); _pos.Add(z);
            }
            _tris.Add(i);
        }

        public TriangleMesh Finish(string source)
        {
            // Facets whose corners merged into fewer than three vertices have no area.
            var kept = new List<int>();
            for (int t = 0; t + 2 < _tris.Count; t += 3)
            {
                int a = _tris[t], b = _tris[t + 1], c = _tris[t + 2];
                if (a != b && b != c && a != c) { kept.Add(a); kept.Add(b); kept.Add(c); }
            }
            if (kept.Count == 0) throw new JobError(source, "the mesh has no triangles");
            return new TriangleMesh(_pos.ToArray(), kept.ToArray());
        }
    }
}
