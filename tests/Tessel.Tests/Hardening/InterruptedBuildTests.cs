using System.Diagnostics;
using System.Text.Json;
using Tessel.Output.Build;

namespace Tessel.Tests.Hardening;

/// <summary>A build killed or interrupted at any point leaves the output folder holding either the
/// complete previous build or the complete new one; two builds into one folder do not mix. The
/// command line runs as a Release child process; every wait is a guard against a hang, many times
/// the time the step takes here.</summary>
public class InterruptedBuildTests
{
    private static readonly TimeSpan Guard = TimeSpan.FromMinutes(10);

    /// <summary>The bundled saddle canopy: seeds 7 and 8 both build completely, in about 15 s each here.</summary>
    private static string SmallJob(string folder)
    {
        string path = Path.Combine(folder, "saddle-canopy.json");
        File.Copy(Path.Combine(TestPaths.Patterns, "saddle-canopy.json"), path);
        return path;
    }

    private static Dictionary<string, byte[]> Snapshot(string dir) => Directory
        .GetFiles(dir, "*", SearchOption.AllDirectories)
        .ToDictionary(f => Path.GetRelativePath(dir, f), File.ReadAllBytes);

    private static string[] Leftovers(string parent) => Directory.GetFileSystemEntries(parent)
        .Select(p => Path.GetFileName(p)!).Where(n => n.Contains(".tessel-", StringComparison.Ordinal)).ToArray();

    private static string[] BuildArgs(string job, string outDir, string seed, bool quiet = true) =>
        ["build", job, "--out", outDir, "--seed", seed, .. quiet ? new[] { "--quiet" } : []];

    private static void AssertSame(Dictionary<string, byte[]> expected, Dictionary<string, byte[]> actual, string when)
    {
        Assert.Equal(expected.Keys.Order(), actual.Keys.Order());
        foreach (var (name, bytes) in expected) Assert.True(bytes.AsSpan().SequenceEqual(actual[name]), $"{name} changed {when}");
    }

    /// <summary>The folder holds exactly what its summary and manifest list (plus the manifest), each file of the listed size.</summary>
    private static void AssertComplete(string dir)
    {
        var now = Snapshot(dir);
        using var summary = JsonDocument.Parse(now["summary.json"]);
        var listed = summary.RootElement.GetProperty("files").EnumerateArray()
            .ToDictionary(f => f.GetProperty("path").GetString()!, f => f.GetProperty("bytes").GetInt64());
        foreach (var (path, bytes) in listed) Assert.Equal(bytes, now[path.Replace('/', Path.DirectorySeparatorChar)].LongLength);
        Assert.Equal(listed.Keys.Append("summary.json").Append(OutputFolder.ManifestFile).Order(), now.Keys.Select(k => k.Replace('\\', '/')).Order());
    }

    [Fact]
    public void KilledBuildsLeaveThePreviousOutputsIntact()
    {
        string root = TestPaths.NewTempFolder();
        string job = SmallJob(root);
        string outDir = Path.Combine(root, "out");
        using (var first = ReleaseCli.Start(BuildArgs(job, outDir, "7"))) Assert.Equal(0, first.Exit(Guard));
        var previous = Snapshot(outDir);

        // Rebuild with another seed and kill it at several points of the run.
        int untouched = 0;
        foreach (int ms in new[] { 300, 1500, 4000 })
        {
            using (var run = ReleaseCli.Start(BuildArgs(job, outDir, "8")))
            {
                if (!run.Process.WaitForExit(ms)) run.Process.Kill(entireProcessTree: true);
                run.Exit(Guard);
            }
            var now = Snapshot(outDir);
            if (now["summary.json"].AsSpan().SequenceEqual(previous["summary.json"]))
            {
                AssertSame(previous, now, $"after a kill at {ms} ms");
                untouched++;
            }
            else
            {
                AssertComplete(outDir);
                previous = now;
            }
        }
        // At least the earliest kill lands before the write phase (starting the runtime alone takes longer).
        Assert.True(untouched >= 1);
    }

    [Fact]
    public void AKillAtTheSwapLeavesThePreviousBuildAndTheNextBuildCleansUp()
    {
        string root = TestPaths.NewTempFolder();
        string job = SmallJob(root);
        string outDir = Path.Combine(root, "out");
        using (var first = ReleaseCli.Start(BuildArgs(job, outDir, "7"))) Assert.Equal(0, first.Exit(Guard));
        File.WriteAllText(Path.Combine(outDir, "cutting-log.txt"), "sheet 1 cut at 30 % power");
        var previous = Snapshot(outDir);

        using (var paused = ReleaseCli.Start(BuildArgs(job, outDir, "8"), new Dictionary<string, string> { [OutputFolder.TestPauseVariable] = "swap" }))
        {
            Assert.True(paused.WaitForPause(Guard), "the build reached its swap");
            // Everything is staged: the new build is complete beside the target, the target untouched.
            Assert.Single(Leftovers(root));
            paused.Process.Kill(entireProcessTree: true);
            paused.Exit(Guard);
        }
        AssertSame(previous, Snapshot(outDir), "after a kill at the swap");
        Assert.Single(Leftovers(root)); // the killed build's staging folder, whose owner is gone

        using (var next = ReleaseCli.Start(BuildArgs(job, outDir, "8"))) Assert.Equal(0, next.Exit(Guard));
        Assert.Empty(Leftovers(root));
        Assert.Equal("sheet 1 cut at 30 % power", File.ReadAllText(Path.Combine(outDir, "cutting-log.txt")));
        File.Delete(Path.Combine(outDir, "cutting-log.txt"));
        AssertComplete(outDir);
    }

    [Fact]
    public void CtrlCAtTheSwapRemovesTheStagingFolderAndExits130WithOneLine()
    {
        string root = TestPaths.NewTempFolder();
        string job = SmallJob(root);
        string outDir = Path.Combine(root, "out");
        using (var first = ReleaseCli.Start(BuildArgs(job, outDir, "7"))) Assert.Equal(0, first.Exit(Guard));
        var previous = Snapshot(outDir);

        using var paused = ReleaseCli.Start(BuildArgs(job, outDir, "8"), new Dictionary<string, string> { [OutputFolder.TestPauseVariable] = "swap" });
        Assert.True(paused.WaitForPause(Guard), "the build reached its swap");
        ReleaseCli.Signal(paused.Process.Id, "INT");
        Assert.Equal(130, paused.Exit(Guard));
        Assert.Equal(["tessel: interrupted; the output folder was left as it was"],
            paused.ErrLines.Where(l => !l.Contains("test pause", StringComparison.Ordinal)));
        AssertSame(previous, Snapshot(outDir), "after Ctrl-C at the swap");
        Assert.Empty(Leftovers(root));
    }

    [Fact]
    public void CtrlCBeforeTheWritePhaseWritesNothing()
    {
        string root = TestPaths.NewTempFolder();
        string job = SmallJob(root);
        string outDir = Path.Combine(root, "out");
        using var run = ReleaseCli.Start(BuildArgs(job, outDir, "7", quiet: false));
        // The first progress line shows the build has started its stages; the fit takes seconds more.
        var sw = Stopwatch.StartNew();
        while (run.ErrLines.Length == 0 && !run.Process.HasExited && sw.Elapsed < Guard) Thread.Sleep(20);
        ReleaseCli.Signal(run.Process.Id, "INT");
        int code = run.Exit(Guard);
        if (code == 0) return; // the whole build finished before the signal arrived: nothing to check
        Assert.Equal(130, code);
        Assert.Equal(["tessel: interrupted; nothing was written"], run.ErrLines.Where(l => l.StartsWith("tessel:", StringComparison.Ordinal)));
        Assert.False(Directory.Exists(outDir));
        Assert.Empty(Leftovers(root));
    }

    [Fact]
    public void TwoConcurrentBuildsIntoOneFolderBothFinishAndTheFolderHoldsOneCompleteBuild()
    {
        string root = TestPaths.NewTempFolder();
        string job = SmallJob(root);
        string outDir = Path.Combine(root, "out");
        using var a = ReleaseCli.Start(BuildArgs(job, outDir, "7"));
        using var b = ReleaseCli.Start(BuildArgs(job, outDir, "8"));
        Assert.Equal(0, a.Exit(Guard));
        Assert.Equal(0, b.Exit(Guard));
        Assert.Empty(Leftovers(root));
        AssertComplete(outDir);
        using var summary = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(outDir, "summary.json")));
        Assert.Contains(summary.RootElement.GetProperty("figures").GetProperty("job").GetProperty("seed").GetInt64(), new long[] { 7, 8 });
    }
}
