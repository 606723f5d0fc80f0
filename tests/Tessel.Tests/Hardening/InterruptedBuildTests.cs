using System.Diagnostics;
using System.Text.Json;

namespace Tessel.Tests.Hardening;

/// <summary>A build killed part way must leave the previous build's files as they were (or, if it got
/// to the end, a complete new set): outputs are written to temporary names and renamed at the end.</summary>
public class InterruptedBuildTests
{
    private static Dictionary<string, byte[]> Snapshot(string dir) => Directory
        .GetFiles(dir, "*", SearchOption.AllDirectories)
        .Where(f => !Path.GetFileName(f).EndsWith(".partial", StringComparison.Ordinal))
        .ToDictionary(f => Path.GetRelativePath(dir, f), File.ReadAllBytes);

    [Fact]
    public void KilledBuildsLeaveThePreviousOutputsIntact()
    {
        string root = TestPaths.NewTempFolder();
        string job = Path.Combine(TestPaths.Patterns, "saddle-canopy.json");
        string outDir = Path.Combine(root, "out");
        string cli = Path.Combine(AppContext.BaseDirectory, "tessel.dll");
        Assert.True(File.Exists(cli), "the command line is copied beside the tests");

        // The previous outputs: the demo with seed 7 (its own).
        Assert.Equal(0, Run(cli, job, outDir, "7", killAfter: null));
        var previous = Snapshot(outDir);
        Assert.Contains("summary.json", previous.Keys);

        // Rebuild with another seed and kill it at several points of the run.
        int untouched = 0;
        foreach (int ms in new[] { 300, 1500, 4000 })
        {
            Run(cli, job, outDir, "8", killAfter: TimeSpan.FromMilliseconds(ms));
            var now = Snapshot(outDir);
            if (now["summary.json"].AsSpan().SequenceEqual(previous["summary.json"]))
            {
                // Not finished: every previous file exactly as it was, and nothing new.
                Assert.Equal(previous.Keys.Order(), now.Keys.Order());
                foreach (var (name, bytes) in previous) Assert.True(bytes.AsSpan().SequenceEqual(now[name]), $"{name} changed after a kill at {ms} ms");
                untouched++;
            }
            else
            {
                // Finished before the kill: the new summary lists a complete set of new files.
                using var summary = JsonDocument.Parse(now["summary.json"]);
                foreach (var f in summary.RootElement.GetProperty("files").EnumerateArray())
                    Assert.Equal(f.GetProperty("bytes").GetInt64(), now[f.GetProperty("path").GetString()!].LongLength);
                previous = now;
            }
        }
        // At least the earliest kill lands before the write phase (the fit alone takes longer).
        Assert.True(untouched >= 1);
    }

    private static int Run(string cli, string job, string outDir, string seed, TimeSpan? killAfter)
    {
        var start = new ProcessStartInfo("dotnet") { RedirectStandardError = true, RedirectStandardOutput = true };
        foreach (var a in new[] { cli, "build", job, "--out", outDir, "--quiet", "--seed", seed }) start.ArgumentList.Add(a);
        using var p = Process.Start(start)!;
        p.OutputDataReceived += (_, _) => { };
        p.ErrorDataReceived += (_, _) => { };
        p.BeginOutputReadLine();
        p.BeginErrorReadLine();
        if (killAfter is { } wait && !p.WaitForExit(wait)) p.Kill(entireProcessTree: true);
        p.WaitForExit();
        return p.ExitCode;
    }
}
