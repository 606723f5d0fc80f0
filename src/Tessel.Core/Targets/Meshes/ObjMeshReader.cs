using System.Globalization;
using Tessel.Core.Jobs;

namespace Tessel.Core.Targets.Meshes;

/// <summary>Reads the geometry of a Wavefront OBJ file: <c>v</c> and <c>f</c> records. Polygons are
/// fan-triangulated from their first corner; negative indices count back from the latest vertex;
/// texture and normal indices (i/t/n) and every other record are ignored.</summary>
public static class ObjMeshReader
{
    /// <summary>Parses OBJ text; <paramref name="sourceName"/> names the file in errors ("site.obj:12: ...").</summary>
    /// <exception cref="JobError">Malformed record, index out of range, or no triangles.</exception>
    public static TriangleMesh Parse(string text, string sourceName)
    {
        var pos = new List<double>();
        var tris = new List<int>();
        var corners = new List<int>();
        int lineNo = 0;
        foreach (var raw in text.Split('\n'))
        {
            lineNo++;
            string line = raw;
            int hash = line.IndexOf('#');
            if (hash >= 0) line = line[..hash];
            var parts = line.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries);
            if (parts.Length == 0) continue;
            if (parts[0] == "v")
            {
                if (parts.Length < 4) throw Bad(sourceName, lineNo, "a vertex needs x y z");
                for (int k = 1; k <= 3; k++)
                {
                    if (!double.TryParse(parts[k], NumberStyles.Float, CultureInfo.InvariantCulture, out double d) || !double.IsFinite(d))
                        throw Bad(sourceName, lineNo, $"'{parts[k]}' is not a finite number");
                    pos.Add(d);
                }
            }
            else if (parts[0] == "f")
            {
                if (parts.Length < 4) throw Bad(sourceName, lineNo, "a face needs at least 3 corners");
                corners.Clear();
                int count = pos.Count / 3;
                for (int k = 1; k < parts.Length; k++)
                {
                    string idx = parts[k].Split('/')[0];
                    if (!int.TryParse(idx, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out int i) || i == 0)
                        throw Bad(sourceName, lineNo, $"'{parts[k]}' is not a vertex index");
                    int zeroBased = i > 0 ? i - 1 : count + i;
                    if (zeroBased < 0 || zeroBased >= count)
                        throw Bad(sourceName, lineNo, $"vertex index {i} is out of range (the file has {count} vertices so far)");
                    corners.Add(zeroBased);
                }
                for (int k = 1; k + 1 < corners.Count; k++)
                {
                    tris.Add(corners[0]); tris.Add(corners[k]); tris.Add(corners[k + 1]);
                }
            }
        }
        if (tris.Count == 0) throw new JobError(sourceName, "the mesh has no triangles (no 'f' records); export the surface as faces");
        return new TriangleMesh(pos.ToArray(), tris.ToArray());
    }

    private static JobError Bad(string source, int line, string what) => new($"{source}:{line}", what);
}
