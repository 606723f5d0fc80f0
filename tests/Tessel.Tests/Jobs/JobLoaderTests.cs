using System.Text.Json;
using Tessel.Core.Jobs;

namespace Tessel.Tests.Jobs;

public class JobLoaderTests
{
    private const string Minimal = """{ "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3 } } }""";

    private static Job Parse(string json) => JobLoader.Parse(json, "test.json", Path.GetTempPath());

    private static JobError Fails(string json) => Assert.Throws<JobError>(() => Parse(json));

    [Theory]
    [InlineData("saddle-canopy.json", "hyperbolic-paraboloid", "miura")]
    [InlineData("shallow-dome.json", "spherical-cap", "waterbomb")]
    [InlineData("barrel-vault.json", "cylinder", "yoshimura")]
    [InlineData("garden-dome.json", "spherical-cap", "reverse-curvature")]
    public void PatternsLoad(string file, string kind, string family)
    {
        var job = JobLoader.Load(Path.Combine(TestPaths.Patterns, file));
        Assert.Equal(kind, job.Target.Kind);
        Assert.Equal(family, job.Tessellation.Family);
        Assert.Equal(Path.GetFileNameWithoutExtension(file), job.Name);
    }

    [Fact]
    public void DefaultsFillEverySection()
    {
        var job = Parse(Minimal);
        Assert.Equal("tessel-model", job.Name);
        Assert.Equal(1, job.Seed);
        Assert.Equal("m", job.Target.Units);
        Assert.Equal("miura", job.Tessellation.Family);
        Assert.Equal(8, job.Tessellation.CellsX);
        Assert.Equal(60, job.Tessellation.SectorAngleDeg);
        Assert.Equal(0, job.Fitting.EpsilonDeg);
        Assert.Equal("none", job.Fitting.Anchors);
        Assert.Equal(100, job.Fabrication.Scale);
        // ISO 216 A3 is 297 x 420 mm (docs/reference/fabrication.md).
        Assert.Equal(297, job.Fabrication.Sheet.WidthMm);
        Assert.Equal(420, job.Fabrication.Sheet.HeightMm);
        Assert.Equal(8, job.Fabrication.Layers.Count);
        Assert.True(job.Outputs.Obj && job.Outputs.Png && !job.Outputs.Stl);
    }

    [Fact]
    public void CommentsAndTrailingCommasAreAllowed()
    {
        var job = Parse("""
            // a comment
            { "name": "x1", /* inline */ "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3, }, }, }
            """);
        Assert.Equal("x1", job.Name);
    }

    [Fact]
    public void SheetNamesResolveCaseInsensitively()
    {
        var job = Parse("""{ "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3 } }, "fabrication": { "sheet": { "name": "letter" } } }""");
        // US Letter 215.9 x 279.4 mm (ANSI/ASME Y14.1, as listed in docs/reference/fabrication.md).
        Assert.Equal("Letter", job.Fabrication.Sheet.Name);
        Assert.Equal(215.9, job.Fabrication.Sheet.WidthMm);
        Assert.Equal(279.4, job.Fabrication.Sheet.HeightMm);
    }

    [Fact]
    public void UnknownFieldNamesItsPathAndTheNearestKnownField()
    {
        var e = Fails("""{ "target": { "kind": "cylinder", "radus": 3, "rise": 1, "footprint": { "width": 4, "depth": 3 } } }""");
        Assert.Equal("target.radus", e.Where);
        Assert.Contains("did you mean 'radius'?", e.Message);
    }

    [Fact]
    public void UnknownNestedFieldNamesTheFullPath()
    {
        var e = Fails("""{ "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3 } }, "fabrication": { "layers": { "valley": { "color": "#123456" } } } }""");
        Assert.Equal("fabrication.layers.valley.color", e.Where);
        Assert.Contains("'colour'", e.Message);
    }

    [Fact]
    public void MalformedJsonGivesLineAndColumn()
    {
        // Line 3 is missing the comma after "plane"; the parser notices at the next property.
        var e = Fails("{\n  \"target\": {\n    \"kind\": \"plane\"\n    \"units\": \"m\"\n  }\n}");
        Assert.StartsWith("test.json:4:5", e.Where);
        Assert.Contains("malformed JSON", e.Message);
    }

    [Fact]
    public void NegativeRadiusIsRejectedWithTheFix()
    {
        var e = Fails("""{ "target": { "kind": "cylinder", "radius": -3, "rise": 1, "footprint": { "width": 4, "depth": 3 } } }""");
        Assert.Equal("target.radius: must be a positive length in m (got -3)", e.Message);
    }

    [Theory]
    [InlineData("\"NaN\"", "must be a number")]
    [InlineData("1e999", "must be a finite number")]
    [InlineData("-2", "must be a positive length in m (got -2)")]
    [InlineData("0", "must be a positive length in m (got 0)")]
    public void BadFootprintSizesAreRejected(string width, string expected)
    {
        var e = Fails($$"""{ "target": { "kind": "plane", "footprint": { "width": {{width}}, "depth": 3 } } }""");
        Assert.Equal("target.footprint.width", e.Where);
        Assert.Contains(expected, e.Message);
    }

    [Fact]
    public void NaNLiteralIsMalformedJson()
    {
        var e = Fails("""{ "target": { "kind": "plane", "footprint": { "width": NaN, "depth": 3 } } }""");
        Assert.StartsWith("test.json:1:", e.Where);
    }

    [Theory]
    [InlineData("../escape")]
    [InlineData("a/b")]
    [InlineData("")]
    [InlineData("CON")]
    [InlineData(".hidden")]
    public void UnsafeNamesAreRejected(string name)
    {
        var e = Fails($$"""{ "name": "{{name}}", "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3 } } }""");
        Assert.Equal("name", e.Where);
    }

    [Fact]
    public void EggBoxIsNeverOffered()
    {
        var e = Fails("""{ "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3 } }, "tessellation": { "family": "egg-box" } }""");
        Assert.Equal("tessellation.family", e.Where);
        Assert.Contains("not developable", e.Message);
    }

    [Fact]
    public void MisspelledKindSuggestsTheNearestKind()
    {
        var e = Fails("""{ "target": { "kind": "cylindre", "footprint": { "width": 4, "depth": 3 } } }""");
        Assert.Contains("did you mean \"cylinder\"?", e.Message);
    }

    [Fact]
    public void MissingFootprintIsAnError()
    {
        var e = Fails("""{ "target": { "kind": "spherical-cap", "radius": 10, "rise": 2 } }""");
        Assert.Equal("target.footprint", e.Where);
    }

    [Fact]
    public void MissingJobFileIsAClearError()
    {
        var e = Assert.Throws<JobError>(() => JobLoader.Load("/nonexistent/folder/job.json"));
        Assert.Contains("not found", e.Message);
    }

    [Fact]
    public void BadLayerColourIsRejected()
    {
        var e = Fails("""{ "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3 } }, "fabrication": { "layers": { "mountain": { "colour": "red" } } } }""");
        Assert.Equal("fabrication.layers.mountain.colour", e.Where);
    }

    [Fact]
    public void SchemaListsExactlyTheFieldsTheLoaderKnows()
    {
        var known = JobLoader.KnownFieldPaths();
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(TestPaths.Patterns, "tessel-job.schema.json")));
        var inSchema = new SortedSet<string>(StringComparer.Ordinal);
        Walk(doc.RootElement, "", inSchema);
        Assert.Equal(known.ToArray(), inSchema.ToArray());
        Assert.Contains("fabrication.layers.tabFold.operation", known);
        Assert.Contains("target.footprint.corners", known);
    }

    [Fact]
    public void EverySchemaFieldIsDescribed()
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(TestPaths.Patterns, "tessel-job.schema.json")));
        Assert.Equal("https://json-schema.org/draft/2020-12/schema", doc.RootElement.GetProperty("$schema").GetString());
        var missing = new List<string>();
        void Check(JsonElement e, string path)
        {
            if (!e.TryGetProperty("properties", out var props)) return;
            foreach (var p in props.EnumerateObject())
            {
                string child = path == "" ? p.Name : path + "." + p.Name;
                if (!p.Value.TryGetProperty("description", out var d) || string.IsNullOrWhiteSpace(d.GetString())) missing.Add(child);
                Check(p.Value, child);
            }
        }
        Check(doc.RootElement, "");
        Assert.Empty(missing);
    }

    private static void Walk(JsonElement e, string path, ISet<string> paths)
    {
        if (!e.TryGetProperty("properties", out var props)) return;
        foreach (var p in props.EnumerateObject())
        {
            string child = path == "" ? p.Name : path + "." + p.Name;
            paths.Add(child);
            Walk(p.Value, child, paths);
        }
    }

    [Fact]
    public void ScaffoldsOfEveryKindAndFamilyLoad()
    {
        foreach (var kind in Catalog.TargetKinds)
            foreach (var family in Catalog.Families)
            {
                var job = Parse(JobScaffold.Text(kind.Name, family.Name));
                Assert.Equal(kind.Name, job.Target.Kind);
                Assert.Equal(family.Name, job.Tessellation.Family);
            }
    }

    [Fact]
    public void EditDistanceCountsEdits()
    {
        // Classic textbook pair: kitten -> sitting needs 3 edits (Levenshtein 1966; common example, no single source).
        Assert.Equal(3, EditDistance.Between("kitten", "sitting"));
        Assert.Equal(0, EditDistance.Between("Radius", "radius"));
        Assert.Null(EditDistance.Nearest("zzzzzz", ["radius", "rise"]));
    }
}

public class FootprintValidationTests
{
    [Fact]
    public void SelfCrossingPolygonIsRejected()
    {
        // A bow tie: edge 1 (0,0)-(4,3) and edge 3 (4,0)-(0,4) cross.
        var e = Assert.Throws<JobError>(() => JobLoader.Parse(
            """{ "target": { "kind": "plane", "footprint": { "corners": [[0, 0], [4, 3], [4, 0], [0, 4]] } } }""", "t.json", Path.GetTempPath()));
        Assert.Equal("target.footprint.corners", e.Where);
        Assert.Contains("edges 1 and 3 cross", e.Message);
    }

    [Fact]
    public void SimplePolygonIsAccepted()
    {
        var job = JobLoader.Parse("""{ "target": { "kind": "plane", "footprint": { "corners": [[0, 0], [4, 0], [5, 2], [2, 4], [-1, 2]] } } }""", "t.json", Path.GetTempPath());
        Assert.Equal(5, job.Target.Footprint!.Corners!.Length);
    }

    [Fact]
    public void WidthWithCornersIsAmbiguous()
    {
        var e = Assert.Throws<JobError>(() => JobLoader.Parse(
            """{ "target": { "kind": "plane", "footprint": { "width": 3, "corners": [[0, 0], [4, 0], [0, 3]] } } }""", "t.json", Path.GetTempPath()));
        Assert.Contains("not both", e.Message);
    }
}

public class KindParameterTests
{
    [Fact]
    public void ParameterOfAnotherKindIsReported()
    {
        var e = Assert.Throws<JobError>(() => JobLoader.Parse(
            """{ "target": { "kind": "formula", "formula": "x*y", "radius": 3, "footprint": { "width": 4, "depth": 3 } } }""", "t.json", Path.GetTempPath()));
        Assert.Equal("target.radius: is not used by kind \"formula\"; remove it (that kind takes formula)", e.Message);
    }
}

public class DuplicateFieldTests
{
    [Fact]
    public void RepeatedFieldIsReported()
    {
        var e = Assert.Throws<JobError>(() => JobLoader.Parse(
            """{ "target": { "kind": "plane", "rise": 1, "rise": 2, "footprint": { "width": 4, "depth": 3 } } }""", "t.json", Path.GetTempPath()));
        Assert.Equal("target.rise", e.Where);
        Assert.Contains("appears twice", e.Message);
    }
}
