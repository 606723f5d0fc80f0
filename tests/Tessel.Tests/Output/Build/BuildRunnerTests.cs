using Tessel.Core.Sheets;
using System.Text.Json;
using Tessel.Core.Jobs;
using Tessel.Core.Pipeline;
using Tessel.Output.Build;

namespace Tessel.Tests.Output.Build;

public class BuildRunnerTests
{
    private static Job Small(string name = "small-test") => JobLoader.Parse($$"""
        { "name": "{{name}}", "target": { "kind": "hyperbolic-paraboloid", "c": 4, "rise": 1, "footprint": { "width": 4, "depth": 3 } } }
        """, "small.json", Path.GetTempPath());

    [Fact]
    public void WritesTargetFilesAndASummaryListingThem()
    {
        string dir = Path.Combine(TestPaths.NewTempFolder(), "out");
        var result = BuildRunner.Run(Small(), dir, ProgressReporter.Silent);
        var paths = result.Files.Select(f => f.Path).ToArray();
        Assert.Equal(["target.obj", "target.png"], paths[..2]);
        Assert.Equal("summary.json", paths[^1]);
        foreach (var (path, bytes) in result.Files) Assert.Equal(bytes, new FileInfo(Path.Combine(dir, path)).Length);
        // No temporary files left behind: the files and the manifest of what Tessel wrote.
        Assert.Equal(paths.Length + 1, Directory.GetFiles(dir, "*", SearchOption.AllDirectories).Length);
        Assert.True(File.Exists(Path.Combine(dir, OutputFolder.ManifestFile)));

        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(dir, "summary.json")));
        var files = summary.RootElement.GetProperty("files").EnumerateArray().ToList();
        Assert.Equal(paths.Length - 1, files.Count);
        Assert.Equal(new FileInfo(Path.Combine(dir, "target.png")).Length, files[1].GetProperty("bytes").GetInt64());
        var t = summary.RootElement.GetProperty("figures").GetProperty("target");
        // z = 1 + x*y/4 over 4 x 3: corners at 1 +- 2*1.5/4 = 0.25 and 1.75.
        Assert.Equal(0.25, t.GetProperty("minHeightM").GetDouble(), 12);
        Assert.Equal(1.75, t.GetProperty("maxHeightM").GetDouble(), 12);
        // Saddle K = -c^2/(c^2+x^2+y^2)^2 (do Carmo 3-3): most negative at the origin, -1/16.
        Assert.Equal(-1.0 / 16, t.GetProperty("minGaussianCurvaturePerM2").GetDouble(), 12);
        Assert.Equal(4, t.GetProperty("extentXM").GetDouble(), 12);
    }

    [Fact]
    public void SameJobGivesByteIdenticalFiles()
    {
        string a = TestPaths.NewTempFolder(), b = TestPaths.NewTempFolder();
        var first = BuildRunner.Run(Small(), a, ProgressReporter.Silent);
        BuildRunner.Run(Small(), b, ProgressReporter.Silent);
        Assert.True(first.Files.Count >= 3);
        foreach (var (name, _) in first.Files)
            Assert.Equal(File.ReadAllBytes(Path.Combine(a, name)), File.ReadAllBytes(Path.Combine(b, name)));
    }

    [Fact]
    public void BadInputWritesNothing()
    {
        string dir = Path.Combine(TestPaths.NewTempFolder(), "never");
        var job = JobLoader.Parse("""{ "target": { "kind": "formula", "formula": "sqrt(x)", "footprint": { "width": 4, "depth": 3 } } }""", "bad.json", Path.GetTempPath());
        Assert.Throws<JobError>(() => BuildRunner.Run(job, dir, ProgressReporter.Silent));
        Assert.False(Directory.Exists(dir));
    }

    [Fact]
    public void UnwritableOutputFolderIsReported()
    {
        // A folder cannot be created beneath a regular file, whatever the user's permissions.
        string blocker = Path.Combine(TestPaths.NewTempFolder(), "a-file");
        File.WriteAllText(blocker, "x");
        var e = Assert.Throws<OutputNotWritableError>(() => BuildRunner.Run(Small(), Path.Combine(blocker, "out"), ProgressReporter.Silent));
        Assert.Contains("not writable", e.Message);
        Assert.Throws<OutputNotWritableError>(() => BuildRunner.Run(Small(), blocker, ProgressReporter.Silent));
    }

    [Fact]
    public void OutputPathsMustStayInsideTheFolder()
    {
        var o = new BuildOutput();
        Assert.Throws<ArgumentException>(() => o.AddFile("../x.txt", [1]));
        Assert.Throws<ArgumentException>(() => o.AddFile("/etc/x", [1]));
        Assert.Throws<ArgumentException>(() => o.AddFile("summary.json", [1]));
        o.AddFile("sheets/a.svg", [1]);
        Assert.Throws<ArgumentException>(() => o.AddFile("sheets/a.svg", [2]));
    }

    [Theory]
    [InlineData("saddle-canopy.json")]
    [InlineData("shallow-dome.json")]
    [InlineData("barrel-vault.json")]
    [InlineData("garden-dome.json")]
    public void EveryPatternBuildsCompletelyAndRepeatsByteForByte(string file)
    {
        var job = JobLoader.Load(Path.Combine(TestPaths.Patterns, file));
        string a = TestPaths.NewTempFolder(), b = TestPaths.NewTempFolder();
        var first = BuildRunner.Run(job, a, ProgressReporter.Silent);
        var second = BuildRunner.Run(job, b, ProgressReporter.Silent);
        Assert.Null(first.Problem);
        Assert.Equal(first.Files.Select(f => f.Path), second.Files.Select(f => f.Path));
        foreach (var (name, _) in first.Files)
            Assert.True(File.ReadAllBytes(Path.Combine(a, name)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(b, name))), $"{file}: {name} differs between two builds");
        foreach (var expected in new[] { "folded.obj", "fold-angles.csv", "crease-pattern.svg", "sheets/sheets.pdf", "sheets/sheet-01.svg", "sheets/sheet-01.dxf", "report.html", "summary.md" })
            Assert.Contains(expected, first.Files.Select(f => f.Path));

        // The standalone crease pattern carries its own legend: notes (title, print check, legend text) are
        // drawn, and the 100 mm print-check bar needs a drawing at least that wide.
        var creases = System.Xml.Linq.XDocument.Load(Path.Combine(a, "crease-pattern.svg"));
        System.Xml.Linq.XNamespace svg = "http://www.w3.org/2000/svg";
        var notes = creases.Descendants(svg + "g").Single(g => (string?)g.Attribute("id") == "TS-NOTE-PRINT");
        Assert.True(notes.Elements(svg + "path").Count() > 20, "the crease pattern has no legend");
        Assert.True(double.Parse(creases.Root!.Attribute("viewBox")!.Value.Split(' ')[2], System.Globalization.CultureInfo.InvariantCulture) > SheetAnnotations.ScaleBarLengthMm);

        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(a, "summary.json")));
        var fit = summary.RootElement.GetProperty("figures").GetProperty("fit");
        Assert.True(fit.GetProperty("converged").GetBoolean());
        // Developability, Kawasaki and planarity at epsilon = 0 (docs/reference/geometry.md section 1: Hull 2020;
        // Kawasaki 1989; Justin 1986), all to 1e-9.
        Assert.True(fit.GetProperty("maxDevelopabilityRad").GetDouble() <= 1e-9);
        Assert.True(fit.GetProperty("maxKawasakiRad").GetDouble() <= 1e-9);
        Assert.True(fit.GetProperty("maxPlanarityScaled").GetDouble() <= 1e-9);
        var checks = summary.RootElement.GetProperty("figures").GetProperty("checks");
        Assert.Equal(0, checks.GetProperty("collisions").GetInt64());
        // Each bundled pattern folds rigidly from near-flat to its fitted state (docs/reference/geometry.md section 4).
        Assert.True(checks.GetProperty("pathReachedNearFlat").GetBoolean(), checks.GetProperty("pathStopTowardFlat").GetString());
        if (job.Tessellation.Family == "reverse-curvature")
        {
            // The family's acceptance (docs/reference/geometry.md section 3): a positive angle defect at every interior
            // vertex of the envelope through the top layer.
            long interior = checks.GetProperty("envelopeInteriorVertices").GetInt64();
            Assert.True(interior > 0);
            Assert.Equal(interior, checks.GetProperty("envelopePositiveVertices").GetInt64());
            Assert.True(checks.GetProperty("envelopeMinDefectRad").GetDouble() > 0);
        }
    }
}
