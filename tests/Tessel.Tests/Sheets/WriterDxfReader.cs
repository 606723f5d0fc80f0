using System.Globalization;

namespace Tessel.Tests.Sheets;

/// <summary>A tiny DXF reader for the tests: splits an ASCII DXF into group code / value pairs and
/// walks the ENTITIES section (Autodesk DXF Reference: code on one line, value on the next).</summary>
internal sealed class WriterDxfReader
{
    public List<(int Code, string Value)> Pairs { get; } = [];

    public WriterDxfReader(string text)
    {
        string[] lines = text.Split('\n');
        Assert.True(lines.Length % 2 == 1 && lines[^1] == "", "DXF must be pairs of lines ending in a newline");
        for (int i = 0; i + 1 < lines.Length; i += 2)
            Pairs.Add((int.Parse(lines[i].Trim(), CultureInfo.InvariantCulture), lines[i + 1]));
    }

    /// <summary>Value of a header variable's first group after "9 / name".</summary>
    public List<(int Code, string Value)> HeaderVariable(string name)
    {
        int at = Pairs.FindIndex(p => p.Code == 9 && p.Value == name);
        Assert.True(at >= 0, $"header variable {name} missing");
        return Pairs.Skip(at + 1).TakeWhile(p => p.Code != 9 && p.Code != 0).ToList();
    }

    /// <summary>Names (group 2) of the table entries of type <paramref name="entryType"/> (LAYER, LTYPE).</summary>
    public List<Dictionary<int, string>> TableEntries(string entryType) =>
        Records().Where(r => r.Type == entryType).Select(r => r.Groups).ToList();

    /// <summary>Every "0 / TYPE" record with its first value per group code.</summary>
    public IEnumerable<(string Type, Dictionary<int, string> Groups)> Records()
    {
        for (int i = 0; i < Pairs.Count; i++)
        {
            if (Pairs[i].Code != 0) continue;
            var groups = new Dictionary<int, string>();
            for (int j = i + 1; j < Pairs.Count && Pairs[j].Code != 0; j++) groups.TryAdd(Pairs[j].Code, Pairs[j].Value);
            yield return (Pairs[i].Value, groups);
        }
    }

    /// <summary>Entities of the ENTITIES section as (layer, polyline points, closed).</summary>
    public List<(string Layer, List<(double X, double Y)> Points, bool Closed)> Entities()
    {
        var result = new List<(string, List<(double, double)>, bool)>();
        var records = Records().ToList();
        int start = records.FindIndex(r => r.Type == "SECTION" && r.Groups.GetValueOrDefault(2) == "ENTITIES");
        Assert.True(start >= 0, "no ENTITIES section");
        for (int i = start + 1; i < records.Count && records[i].Type != "ENDSEC"; i++)
        {
            var (type, g) = records[i];
            if (type == "LINE")
                result.Add((g[8], [(D(g[10]), D(g[20])), (D(g[11]), D(g[21]))], false));
            else if (type == "POLYLINE")
            {
                bool closed = (int.Parse(g[70], CultureInfo.InvariantCulture) & 1) == 1;
                var pts = new List<(double, double)>();
                for (i++; records[i].Type == "VERTEX"; i++) pts.Add((D(records[i].Groups[10]), D(records[i].Groups[20])));
                Assert.Equal("SEQEND", records[i].Type);
                result.Add((g[8], pts, closed));
            }
            else Assert.Fail($"unexpected entity {type}");
        }
        return result;
    }

    /// <summary>Straight segments per layer: n - 1 per open polyline, n per closed one.</summary>
    public Dictionary<string, int> SegmentsPerLayer() =>
        Entities().GroupBy(e => e.Layer).ToDictionary(g => g.Key, g => g.Sum(e => e.Points.Count - 1 + (e.Closed ? 1 : 0)));

    private static double D(string s) => double.Parse(s, NumberStyles.Float, CultureInfo.InvariantCulture);
}
