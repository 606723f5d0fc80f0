using System.Text.Json;
using Tessel.Cli;
using Tessel.Core.Composition;
using Tessel.Core.Jobs;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

using Tessel.Tests.Cli;

namespace Tessel.Tests.Jobs;

/// <summary>Every registered target kind and family reaches each place a user meets it: the catalog,
/// a scaffold that validates, and the JSON Schema; and each family's vertex count estimate (used to
/// refuse jobs too large for the machine) is close to what its generator makes.</summary>
public class ExtensionTablesTests
{
    private static readonly string SchemaPath = Path.Combine(TestPaths.Patterns, "tessel-job.schema.json");

    private static (int Code, string Out, string Err) Run(params string[] args) => InProcessCli.Run(args);

    [Fact]
    public void TheLoaderReadsTheStagesOwnTables()
    {
        var v = JobVocabulary.Registered;
        Assert.Equal(TargetKinds.All.Select(k => k.Name), v.TargetKinds.Select(k => k.Name));
        Assert.Equal(TessellationFamilies.Names, v.Families.Select(f => f.Name));
        Assert.Equal(TargetKinds.All.Count, TargetKinds.All.Select(k => k.Name).Distinct().Count());
        Assert.Equal(TessellationFamilies.Names.Count, TessellationFamilies.Names.Distinct().Count());
    }

    [Fact]
    public void EveryTargetKindIsInTheCatalogAScaffoldThatValidatesAndTheSchema()
    {
        var (code, catalog, _) = Run("catalog", "targets");
        Assert.Equal(ExitCodes.Ok, code);
        using var schema = JsonDocument.Parse(File.ReadAllText(SchemaPath));
        var target = schema.RootElement.GetProperty("properties").GetProperty("target").GetProperty("properties");
        var kindsInSchema = target.GetProperty("kind").GetProperty("enum").EnumerateArray().Select(e => e.GetString()).ToList();
        foreach (var kind in TargetKinds.All)
        {
            Assert.Contains(catalog.Split('\n'), line => line.StartsWith(kind.Name + " ") && line.EndsWith(kind.Summary));
            Assert.Contains(kind.Name, kindsInSchema);
            foreach (var p in kind.Parameters)
                Assert.True(target.TryGetProperty(p.Name, out _), $"schema lacks target.{p.Name} of kind {kind.Name}");
            // The free net suits every shape, so every kind's scaffold accepts it.
            string dir = TestPaths.NewTempFolder();
            string job = Path.Combine(dir, $"{kind.Name}.json");
            var (made, _, madeErr) = Run("scaffold", "--target", kind.Name, "--family", "free-triangulated", "--out", job);
            Assert.True(made == ExitCodes.Ok, $"scaffold {kind.Name}: {madeErr}");
            var (valid, validOut, validErr) = Run("validate", job);
            Assert.True(valid == ExitCodes.Ok, $"validate {kind.Name}: {validErr}");
            Assert.StartsWith($"OK {kind.Name}-free-triangulated:", validOut);
        }
    }

    [Fact]
    public void EveryFamilyIsInTheCatalogAScaffoldThatValidatesAndTheSchema()
    {
        var (code, catalog, _) = Run("catalog", "families");
        Assert.Equal(ExitCodes.Ok, code);
        using var schema = JsonDocument.Parse(File.ReadAllText(SchemaPath));
        var familiesInSchema = schema.RootElement.GetProperty("properties").GetProperty("tessellation").GetProperty("properties")
            .GetProperty("family").GetProperty("enum").EnumerateArray().Select(e => e.GetString()).ToList();
        foreach (var family in TessellationFamilies.All)
        {
            Assert.Contains(catalog.Split('\n'), line => line.StartsWith(family.Name + " ") && line.EndsWith(family.Summary));
            Assert.Contains(family.Name, familiesInSchema);
            Assert.Contains(family.Name, JobScaffold.Text("plane", family.Name));
            // The first scaffold target the family suits: every family suits at least one.
            string dir = TestPaths.NewTempFolder();
            string? built = null;
            foreach (var kind in TargetKinds.All)
            {
                string job = Path.Combine(dir, $"{kind.Name}-{family.Name}.json");
                if (Run("scaffold", "--target", kind.Name, "--family", family.Name, "--out", job).Code != ExitCodes.Ok) continue;
                var (valid, validOut, validErr) = Run("validate", job);
                Assert.True(valid == ExitCodes.Ok, $"validate {kind.Name}-{family.Name}: {validErr}");
                Assert.EndsWith($"family {family.Name}", validOut.Split('\n')[0].TrimEnd());
                built = job;
                break;
            }
            Assert.True(built is not null, $"no scaffold target suits {family.Name}");
        }
    }

    [Fact]
    public void TheSchemaFileIsWhatTheTablesWrite()
    {
        string text = File.ReadAllText(SchemaPath);
        string written = JobSchema.Update(text, JobVocabulary.Registered);
        // After adding a kind or family: TESSEL_WRITE_SCHEMA=1 dotnet test --filter TheSchemaFileIsWhatTheTablesWrite
        if (Environment.GetEnvironmentVariable("TESSEL_WRITE_SCHEMA") == "1" && written != text) File.WriteAllText(SchemaPath, written);
        else Assert.True(written == text, "patterns/tessel-job.schema.json differs from the kind and family tables; rewrite it with TESSEL_WRITE_SCHEMA=1 dotnet test --filter TheSchemaFileIsWhatTheTablesWrite");
    }

    [Fact]
    public void AKindTheTablesDropLeavesTheSchemaAndANewOneIsAdded()
    {
        string text = File.ReadAllText(SchemaPath);
        var v = JobVocabulary.Registered;
        var withoutMesh = v with { TargetKinds = v.TargetKinds.Where(k => k.Name != "mesh").ToArray() };
        using var doc = JsonDocument.Parse(JobSchema.Update(text, withoutMesh));
        var target = doc.RootElement.GetProperty("properties").GetProperty("target").GetProperty("properties");
        Assert.False(target.TryGetProperty("mesh", out _));
        Assert.DoesNotContain("mesh", target.GetProperty("kind").GetProperty("enum").EnumerateArray().Select(e => e.GetString()));
        var names = target.EnumerateObject().Select(p => p.Name).ToList();
        Assert.Equal("footprint", names[^1]);
        // Writing the full table back restores the file exactly.
        Assert.Equal(JobSchema.Update(text, v), JobSchema.Update(JobSchema.Update(text, withoutMesh), v));
    }

    // Each family's estimate against the vertices its generator makes on a flat 12 x 10 m rectangle.
    // The estimate sizes the memory check before the pattern exists, so it may err high but not low;
    // the band (0.9 to 1.3 of the real count) is our own choice: the memory model's own margin is 15 %
    // (MemoryEstimate remarks), and a count 30 % high refuses jobs that would fit.
    [Theory]
    [InlineData(6, 6)]
    [InlineData(10, 7)]
    public void EveryFamilysVertexEstimateIsNearItsGeneratedCount(int cellsX, int cellsY)
    {
        var plane = new PlaneSurface(Footprint.Rectangle(12, 10), 0);
        var vault = new CylinderSurface(Footprint.Rectangle(12, 10), 12, 3);
        var dome = new SphericalCapSurface(Footprint.Rectangle(12, 10), 30, 2.5);
        var rows = new List<string>();
        foreach (var family in TessellationFamilies.All)
        {
            // Each family on a target it is built for (a Yoshimura pattern needs a vault).
            var target = family.Name switch { "yoshimura" => (ITargetSurface)vault, "reverse-curvature" or "waterbomb" => dome, _ => plane };
            var p = new FamilyParameters(CellsX: cellsX, CellsY: cellsY, FoldDepth: 0.2);
            int real = family.Generate(target, p).Mesh.VertexCount;
            double estimate = family.Vertices(cellsX, cellsY);
            Assert.Equal(estimate, MemoryEstimate.Vertices(family.Name, cellsX, cellsY));
            rows.Add($"{family.Name}: estimate {estimate}, generated {real}, ratio {estimate / real:0.###}");
        }
        foreach (var row in rows)
        {
            double ratio = double.Parse(row[(row.LastIndexOf(' ') + 1)..], System.Globalization.CultureInfo.InvariantCulture);
            Assert.True(ratio >= 0.9 && ratio <= 1.3, string.Join("; ", rows));
        }
    }
}
