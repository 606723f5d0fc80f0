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
            // ASCII STL never holds a NUL byte; a binary file whose size does not match its count is
            // cut short or corrupt, whatever its header says (many begin "solid").
            if (bytes.AsSpan(0, Math.Min(bytes.Length, 4096)).Contains((byte)0))
                throw new JobError(sourceName, $"binary STL declares {count} facets ({84L + 50L * count} bytes) but the file has {bytes.Length} bytes; it is truncated or corrupt, export it again");
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

    /// <summary>ASCII STL: "solid name", then per facet "facet normal nx ny nz / outer loop / vertex x y z
    /// (three times) / endloop / endfacet", then "endsolid". The structure is checked, so a file cut short
    /// or missing a keyword is refused instead of being read as a different mesh.</summary>
    private static TriangleMesh ParseAscii(string text, string source)
    {
        var welder = new Welder();
        var tokens = text.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries);
        int i = 1; // tokens[0] is "solid"
        while (i < tokens.Length && tokens[i] is not ("facet" or "endsolid")) i++; // the solid's name
        int facet = 0;
        string Next(string want)
        {
            if (i >= tokens.Length)
                throw new JobError(source, $"the file ends inside facet {facet} where '{want}' was expected (is it truncated?)");
            return tokens[i++];
        }
        void Expect(string want)
        {
            string got = Next(want);
            if (got != want) throw new JobError(source, $"facet {facet}: expected '{want}', found '{Clip(got)}'");
        }
        void Normal()
        {
            // Normals are recomputed from the corners; exporters write "nan" for degenerate facets.
            string t = Next("a number");
            if (!float.TryParse(t, NumberStyles.Float, CultureInfo.InvariantCulture, out _))
                throw new JobError(source, $"facet {facet}: '{Clip(t)}' is not a number");
        }
        float Number()
        {
            string t = Next("a number");
            if (!float.TryParse(t, NumberStyles.Float, CultureInfo.InvariantCulture, out float v) || !float.IsFinite(v))
                throw new JobError(source, $"facet {facet}: '{Clip(t)}' is not a finite number");
            return v;
        }
        while (true)
        {
            if (i >= tokens.Length) throw new JobError(source, "the file ends without 'endsolid' (is it truncated?)");
            string t = tokens[i++];
            if (t == "endsolid") break;
            facet++;
            if (t != "facet") throw new JobError(source, $"facet {facet}: expected 'facet' or 'endsolid', found '{Clip(t)}'");
            Expect("normal");
            for (int k = 0; k < 3; k++) Normal();
            Expect("outer");
            Expect("loop");
            for (int k = 0; k < 3; k++)
            {
                Expect("vertex");
                float x = Number(), y = Number(), z = Number();
                welder.Add(x, y, z);
            }
            Expect("endloop");
            Expect("endfacet");
        }
        return welder.Finish(source);
    }

    private static string Clip(string s) => s.Length <= 40 ? s : s[..40] + "...";

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
