using System.Diagnostics;
using Tessel.Cli;

namespace Tessel.Tests.Hardening;

/// <summary>Corpus cases that cannot live in the repository as files: devices, named pipes and links
/// to them as input files, and empty command-line arguments. Each must end in one line and exit 1.</summary>
public class SpecialInputTests
{
    private static string Job(string folder, string name, string target)
    {
        string path = Path.Combine(folder, name + ".json");
        File.WriteAllText(path, $$"""{ "name": "corpus", "target": {{target}}, "tessellation": { "cellsX": 4, "cellsY": 4 } }""");
        return path;
    }

    [Fact]
    public void DevicesAndPipesAsInputFilesAreRefusedWithOneLine()
    {
        string dir = TestPaths.NewTempFolder();
        using (var mk = Process.Start("mkfifo", [Path.Combine(dir, "pipe.obj"), Path.Combine(dir, "pipe.png")])) mk.WaitForExit();
        File.CreateSymbolicLink(Path.Combine(dir, "zeros.stl"), "/dev/zero");
        File.CreateSymbolicLink(Path.Combine(dir, "random.obj"), "/dev/urandom");
        var cases = new (string Name, string Target, string Says)[]
        {
            ("mesh-fifo", """{ "kind": "mesh", "mesh": "pipe.obj" }""", "is a named pipe (FIFO), not a regular file"),
            ("mesh-dev-zero", """{ "kind": "mesh", "mesh": "zeros.stl" }""", "is a character device, not a regular file"),
            ("mesh-dev-urandom", """{ "kind": "mesh", "mesh": "random.obj" }""", "is a character device, not a regular file"),
            ("image-fifo", """{ "kind": "height-map", "image": "pipe.png", "imageWidth": 4, "imageDepth": 3, "maxHeight": 1 }""", "is a named pipe (FIFO), not a regular file"),
        };
        var problems = new List<string>();
        foreach (var (name, target, says) in cases)
        {
            string file = Job(dir, name, target);
            var (found, valid) = CliHarness.Check(file, dir);
            problems.AddRange(found.Select(p => $"{name}: {p}"));
            if (valid) problems.Add($"{name}: accepted");
            var v = CliHarness.Run("validate", file);
            if (!v.Err.Contains(says, StringComparison.Ordinal)) problems.Add($"{name}: {v.Err.Trim()}");
        }
        // A job file that is itself a device or a pipe.
        foreach (var path in new[] { "/dev/zero", Path.Combine(dir, "pipe.obj") })
        {
            var v = CliHarness.Run("validate", path);
            if (v.Hung || v.Code != ExitCodes.BadInput || v.Err.Split('\n', StringSplitOptions.RemoveEmptyEntries).Length != 1)
                problems.Add($"validate {path}: exit {v.Code}, {v.Err.Trim()}");
        }
        Assert.True(problems.Count == 0, string.Join("\n", problems));
    }

    [Theory]
    [InlineData("the job argument is empty", "build", "")]
    [InlineData("the job argument is empty", "validate", "")]
    [InlineData("the job argument is empty", "validate", " ")]
    [InlineData("--out is empty", "build", "job.json", "--out", "")]
    [InlineData("--out is empty", "scaffold", "--target", "plane", "--family", "miura", "--out", "")]
    public void EmptyArgumentsAreUsageErrors(string says, params string[] args)
    {
        var r = CliHarness.Run(args);
        Assert.False(r.Hung);
        Assert.Null(r.Escaped);
        Assert.Equal(ExitCodes.BadInput, r.Code);
        Assert.Equal($"tessel: {says}", r.Err.Trim()[..($"tessel: {says}".Length)]);
        Assert.Single(r.Err.Split('\n', StringSplitOptions.RemoveEmptyEntries));
    }
}
