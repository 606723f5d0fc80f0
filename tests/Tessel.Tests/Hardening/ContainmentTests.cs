using System.Text.Json;
using Tessel.Cli;
using Tessel.Output.Build;

namespace Tessel.Tests.Hardening;

/// <summary>Paths in job files never lead outside the output folder, and text in job files is never
/// run as code.</summary>
public class ContainmentTests
{
    private static string Job(string name, string target, string? description = null) => $$"""
        {
          "name": {{JsonSerializer.Serialize(name)}},
          {{(description is null ? "" : $"\"description\": {JsonSerializer.Serialize(description)},")}}
          "target": {{target}},
          "tessellation": { "family": "miura", "cellsX": 4, "cellsY": 4 },
          "outputs": { "obj": true, "png": false }
        }
        """;

    private static Dictionary<string, long> Snapshot(string dir) => Directory.GetFiles(dir, "*", SearchOption.AllDirectories)
        .ToDictionary(f => f, f => new FileInfo(f).Length);

    [Theory]
    [InlineData("../x")]
    [InlineData("../../etc/passwd")]
    [InlineData("/tmp/tessel-escape")]
    [InlineData("..")]
    [InlineData("a/b")]
    [InlineData("a\\b")]
    [InlineData("C:x")]
    [InlineData("NUL")]
    [InlineData("")]
    public void UnsafeNamesAreRefusedBeforeAnythingIsWritten(string name)
    {
        string dir = TestPaths.NewTempFolder();
        string file = Path.Combine(dir, "job.json");
        File.WriteAllText(file, Job(name, """{ "kind": "plane", "footprint": { "width": 4, "depth": 3 } }"""));
        var before = Snapshot(dir);
        var r = CliHarness.Run("build", file, "--out", Path.Combine(dir, "out"), "--quiet");
        Assert.Equal(ExitCodes.BadInput, r.Code);
        Assert.StartsWith("tessel: name: must be a safe file name", r.Err);
        Assert.Equal(before, Snapshot(dir));
        Assert.False(File.Exists("/tmp/tessel-escape"));
    }

    [Fact]
    public void InputsOutsideTheJobFolderAreReadButOutputsStayInTheOutputFolder()
    {
        string root = TestPaths.NewTempFolder();
        string jobs = Directory.CreateDirectory(Path.Combine(root, "studio", "jobs")).FullName;
        string inputs = Directory.CreateDirectory(Path.Combine(root, "inputs")).FullName;
        File.Copy(Path.Combine(CorpusFileTests.CorpusDir, "good.png"), Path.Combine(inputs, "site.png"));
        File.WriteAllText(Path.Combine(inputs, "roof.obj"), "v -3 -3 0\nv 3 -3 0\nv 3 3 1\nv -3 3 1\nf 1 2 3 4\n");
        string viaParent = Path.Combine(jobs, "parent.json");
        File.WriteAllText(viaParent, Job("from-parent", """{ "kind": "height-map", "image": "../../inputs/site.png", "imageWidth": 4, "imageDepth": 3, "maxHeight": 1 }"""));
        string viaAbsolute = Path.Combine(jobs, "absolute.json");
        File.WriteAllText(viaAbsolute, Job("from-absolute", $$"""{ "kind": "mesh", "mesh": {{JsonSerializer.Serialize(Path.Combine(inputs, "roof.obj"))}} }"""));

        foreach (var (file, name) in new[] { (viaParent, "from-parent"), (viaAbsolute, "from-absolute") })
        {
            string outDir = Path.Combine(root, "out-" + name);
            var before = Snapshot(root);
            var r = CliHarness.Run("build", file, "--out", outDir, "--quiet");
            // A fit that does not converge on this small test roof still writes its target files and
            // summary (exit 2); either way every file must land in the output folder.
            Assert.True(r.Code is ExitCodes.Ok or ExitCodes.NotConverged, r.Err);
            var after = Snapshot(root);
            var added = after.Keys.Except(before.Keys).Order(StringComparer.Ordinal).ToList();
            Assert.NotEmpty(added);
            Assert.All(added, f => Assert.StartsWith(outDir + Path.DirectorySeparatorChar, f));
            Assert.Contains(Path.Combine(outDir, "summary.json"), added);
            Assert.Contains(Path.Combine(outDir, "target.obj"), added);
            Assert.DoesNotContain(Path.Combine(outDir, "target.png"), added); // outputs.png is false
            // Nothing that existed before was changed.
            Assert.All(before, kv => Assert.Equal(kv.Value, after[kv.Key]));
        }
    }

    [Theory]
    [InlineData("../escape.txt")]
    [InlineData("/tmp/escape.txt")]
    [InlineData("sub/../../escape.txt")]
    [InlineData("sub\\..\\..\\escape.txt")]
    [InlineData("")]
    public void BuildOutputRefusesPathsThatLeaveTheFolder(string path)
    {
        var output = new BuildOutput();
        Assert.Throws<ArgumentException>(() => output.AddFile(path, [1, 2, 3]));
        Assert.Empty(output.Files);
    }

    [Theory]
    [InlineData("System.IO.File.Delete(\"{canary}\")", 1)]
    [InlineData("x + File.Delete(\"{canary}\")", 5)]
    [InlineData("x; rm {canary}", 2)]
    [InlineData("$(rm {canary})", 1)]
    [InlineData("`rm {canary}`", 1)]
    [InlineData("__import__('os').remove('{canary}')", 1)]
    public void CodeInAFormulaIsASyntaxError(string formula, int column)
    {
        string dir = TestPaths.NewTempFolder();
        string canary = Path.Combine(dir, "canary.txt");
        File.WriteAllText(canary, "still here");
        string file = Path.Combine(dir, "job.json");
        File.WriteAllText(file, Job("code", $$"""{ "kind": "formula", "formula": {{JsonSerializer.Serialize(formula.Replace("{canary}", canary))}}, "footprint": { "width": 4, "depth": 3 } }"""));
        foreach (var verb in new[] { "validate", "build" })
        {
            var r = verb == "validate" ? CliHarness.Run(verb, file) : CliHarness.Run(verb, file, "--out", Path.Combine(dir, "out"), "--quiet");
            Assert.Equal(ExitCodes.BadInput, r.Code);
            Assert.StartsWith($"tessel: target.formula: column {column}: expected ", r.Err);
        }
        Assert.Equal("still here", File.ReadAllText(canary));
        Assert.False(Directory.Exists(Path.Combine(dir, "out")));
    }

    [Fact]
    public void ScriptTextInAJobIsInertText()
    {
        string dir = TestPaths.NewTempFolder();
        string file = Path.Combine(dir, "job.json");
        const string script = "<script>alert(1)</script> $(rm -rf ~) `reboot` {{7*7}} ${jndi:ldap://x}";
        File.WriteAllText(file, Job("inert", """{ "kind": "plane", "footprint": { "width": 4, "depth": 3 } }""", script));
        string outDir = Path.Combine(dir, "out");
        var r = CliHarness.Run("build", file, "--out", outDir, "--quiet");
        Assert.True(r.Code == ExitCodes.Ok, r.Err);
        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "summary.json")));
        Assert.Equal(script, summary.RootElement.GetProperty("description").GetString());
        // Written escaped, so the summary cannot smuggle markup into a page that shows it.
        Assert.DoesNotContain("<script>", File.ReadAllText(Path.Combine(outDir, "summary.json")));

        File.WriteAllText(file, Job("inert", """{ "kind": "plane", "footprint": { "width": 4, "depth": 3 }, "onload": "<script>alert(1)</script>" }"""));
        var bad = CliHarness.Run("validate", file);
        Assert.Equal(ExitCodes.BadInput, bad.Code);
        Assert.StartsWith("tessel: target.onload: unknown field", bad.Err);
    }
}

/// <summary>Job paths that are not ordinary small files.</summary>
public class OddJobFileTests
{
    [Fact]
    public void AnOversizedJobFileIsRefusedWithoutReadingItAll()
    {
        string dir = TestPaths.NewTempFolder();
        string file = Path.Combine(dir, "big.json");
        using (var f = File.Create(file)) f.SetLength(Tessel.Core.Jobs.JobLoader.MaxJobFileBytes + 1L);
        var r = CliHarness.Run("validate", file);
        Assert.Equal(ExitCodes.BadInput, r.Code);
        Assert.Equal($"tessel: {file}: is larger than 4 MB, which no job file is; check that this is the job file", r.Err.TrimEnd());
    }

    [Fact]
    public void AnEndlessDeviceIsRefusedNotReadForever()
    {
        if (!File.Exists("/dev/zero")) return; // not a Unix-like system
        var r = CliHarness.Run("validate", "/dev/zero");
        Assert.False(r.Hung);
        Assert.Equal(ExitCodes.BadInput, r.Code);
        Assert.StartsWith("tessel: /dev/zero: is a character device, not a job file", r.Err);
    }

    [Fact]
    public void AFolderGivenAsTheJobIsAClearError()
    {
        string dir = TestPaths.NewTempFolder();
        var r = CliHarness.Run("validate", dir);
        Assert.Equal(ExitCodes.BadInput, r.Code);
        Assert.Single(r.Err.Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.StartsWith($"tessel: {dir}: ", r.Err);
    }
}
