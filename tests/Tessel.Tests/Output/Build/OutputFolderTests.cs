using System.Text;
using Tessel.Core.Jobs;
using Tessel.Output.Build;
using Tessel.Output.IO;

namespace Tessel.Tests.Output.Build;

public class OutputFolderTests
{
    /// <summary>A process id that no process has: above Linux's largest pid_max (2^22).</summary>
    private const int GonePid = 2_000_000_000;

    private static List<(string Path, byte[] Bytes)> Build(int sheets, string tag) =>
        Enumerable.Range(1, sheets).Select(i => ($"sheets/sheet-{i:00}.svg", Encoding.UTF8.GetBytes($"{tag} sheet {i}")))
            .Append(("summary.json", Encoding.UTF8.GetBytes($"{{\"build\": \"{tag}\", \"files\": []}}")))
            .ToList();

    private static SortedDictionary<string, string> Contents(string dir) => new(Directory
        .GetFiles(dir, "*", SearchOption.AllDirectories)
        .Where(f => new FileInfo(f).LinkTarget is null)
        .ToDictionary(f => Path.GetRelativePath(dir, f).Replace('\\', '/'), File.ReadAllText), StringComparer.Ordinal);

    private static string[] Leftovers(string parent) => Directory.GetFileSystemEntries(parent)
        .Select(Path.GetFileName).Where(n => n!.Contains(".tessel-", StringComparison.Ordinal)).ToArray()!;

    [Fact]
    public void ARebuildWithFewerSheetsLeavesExactlyTheNewFilesAndTheUsersOwn()
    {
        string parent = TestPaths.NewTempFolder();
        string dir = Path.Combine(parent, "out");
        OutputFolder.Replace(dir, Build(18, "a5"));
        Assert.Equal(18, Directory.GetFiles(Path.Combine(dir, "sheets")).Length);
        // The user's own files: beside the outputs, inside a folder of Tessel's, in a folder of their own,
        // and a symbolic link (kept as a link, not followed).
        File.WriteAllText(Path.Combine(dir, "notes.txt"), "glue order");
        File.WriteAllText(Path.Combine(dir, "sheets", "cutter-settings.txt"), "power 30");
        Directory.CreateDirectory(Path.Combine(dir, "photos", "empty"));
        File.WriteAllText(Path.Combine(dir, "photos", "site.jpg"), "jpeg");
        File.CreateSymbolicLink(Path.Combine(dir, "job-link"), "/nonexistent/job.json");

        OutputFolder.Replace(dir, Build(2, "a0"));

        var now = Contents(dir);
        Assert.Equal(["notes.txt", "photos/site.jpg", "sheets/cutter-settings.txt", "sheets/sheet-01.svg", "sheets/sheet-02.svg", "summary.json"],
            now.Keys.Where(k => k != OutputFolder.ManifestFile));
        Assert.Equal("a0 sheet 2", now["sheets/sheet-02.svg"]);
        Assert.Equal("glue order", now["notes.txt"]);
        Assert.True(Directory.Exists(Path.Combine(dir, "photos", "empty")));
        Assert.Equal("/nonexistent/job.json", new FileInfo(Path.Combine(dir, "job-link")).LinkTarget);
        Assert.Equal(["sheets/sheet-01.svg", "sheets/sheet-02.svg", "summary.json"],
            File.ReadAllLines(Path.Combine(dir, OutputFolder.ManifestFile)).Where(l => !l.StartsWith('#')));
        Assert.Empty(Leftovers(parent));
    }

    [Fact]
    public void AFolderOfTesselsThatNoLongerHoldsAnythingIsNotRecreated()
    {
        string dir = Path.Combine(TestPaths.NewTempFolder(), "out");
        OutputFolder.Replace(dir, Build(3, "with sheets"));
        OutputFolder.Replace(dir, [("summary.json", "{}"u8.ToArray())]);
        Assert.False(Directory.Exists(Path.Combine(dir, "sheets")));
        Assert.Equal([OutputFolder.ManifestFile, "summary.json"], Contents(dir).Keys);
    }

    [Fact]
    public void AFolderFromBeforeTheManifestIsReadFromItsSummary()
    {
        string dir = Path.Combine(TestPaths.NewTempFolder(), "out");
        Directory.CreateDirectory(Path.Combine(dir, "sheets"));
        File.WriteAllText(Path.Combine(dir, "summary.json"), """{ "files": [ { "path": "sheets/sheet-07.svg", "bytes": 3 } ] }""");
        File.WriteAllText(Path.Combine(dir, "sheets", "sheet-07.svg"), "old");
        File.WriteAllText(Path.Combine(dir, "sheets", ".sheet-08.svg." + GonePid + ".partial"), "half");
        File.WriteAllText(Path.Combine(dir, "readme-client.txt"), "mine");
        OutputFolder.Replace(dir, Build(1, "new"));
        Assert.Equal([OutputFolder.ManifestFile, "readme-client.txt", "sheets/sheet-01.svg", "summary.json"], Contents(dir).Keys);
    }

    [Fact]
    public void AUsersFileWhereTheBuildWritesIsRefusedAndNothingChanges()
    {
        string parent = TestPaths.NewTempFolder();
        string dir = Path.Combine(parent, "out");
        Directory.CreateDirectory(Path.Combine(dir, "sheets"));
        File.WriteAllText(Path.Combine(dir, "sheets", "sheet-01.svg"), "a drawing of the user's");
        var e = Assert.Throws<OutputFolderError>(() => OutputFolder.Replace(dir, Build(2, "new")));
        Assert.Contains("sheet-01.svg: this file was not written by Tessel", e.Message);
        Assert.Equal(["sheets/sheet-01.svg"], Contents(dir).Keys);
        Assert.Empty(Leftovers(parent));
    }

    [Fact]
    public void ACancelledWriteRemovesItsStagingFolderAndLeavesTheOldBuild()
    {
        string parent = TestPaths.NewTempFolder();
        string dir = Path.Combine(parent, "out");
        OutputFolder.Replace(dir, Build(4, "old"));
        var before = Contents(dir);
        using var cancel = new CancellationTokenSource();
        int written = 0;
        Assert.Throws<OperationCanceledException>(() =>
            OutputFolder.Replace(dir, Build(9, "new"), _ => { if (++written == 3) cancel.Cancel(); }, cancel.Token));
        Assert.Equal(before, Contents(dir));
        Assert.Empty(Leftovers(parent));
    }

    [Fact]
    public void ABuildKilledBetweenTheTwoRenamesIsRepairedByTheNext()
    {
        // The state a kill leaves between "rename the target aside" and "rename staging in" (the
        // fallback where the atomic exchange is not available): no target, the complete old build
        // aside, the complete new one in staging.
        string parent = TestPaths.NewTempFolder();
        string dir = Path.Combine(parent, "out");
        OutputFolder.Replace(dir, Build(5, "old"));
        File.WriteAllText(Path.Combine(dir, "notes.txt"), "mine");
        var before = Contents(dir);
        string old = Path.Combine(parent, $".out.tessel-old-{GonePid}");
        string staging = Path.Combine(parent, $".out.tessel-staging-{GonePid}");
        Directory.Move(dir, old);
        Directory.CreateDirectory(Path.Combine(staging, "sheets"));
        File.WriteAllText(Path.Combine(staging, "sheets", "sheet-01.svg"), "the killed build's");

        // The next build first puts the old build back, then replaces it; the user's file survives.
        OutputFolder.Replace(dir, Build(2, "next"));
        var now = Contents(dir);
        Assert.Equal("mine", now["notes.txt"]);
        Assert.Equal("next sheet 2", now["sheets/sheet-02.svg"]);
        Assert.False(now.ContainsKey("sheets/sheet-05.svg"));
        Assert.Empty(Leftovers(parent));
        Assert.Equal(8, before.Count); // 5 sheets, summary, manifest, notes
    }

    [Fact]
    public void ABuildKilledAfterTheExchangeLeavesOnlyAnOldCopyThatTheNextBuildRemoves()
    {
        string parent = TestPaths.NewTempFolder();
        string dir = Path.Combine(parent, "out");
        OutputFolder.Replace(dir, Build(1, "current"));
        string leftover = Path.Combine(parent, $".out.tessel-staging-{GonePid}");
        Directory.CreateDirectory(leftover);
        File.WriteAllText(Path.Combine(leftover, "summary.json"), "previous");
        OutputFolder.Replace(dir, Build(1, "next"));
        Assert.Empty(Leftovers(parent));
        Assert.Equal("next sheet 1", Contents(dir)["sheets/sheet-01.svg"]);
    }

    [Fact]
    public void TemporariesOfARunningProcessAreLeftAlone()
    {
        string parent = TestPaths.NewTempFolder();
        string dir = Path.Combine(parent, "out");
        // Process 1 (init) is always running: its staging folder is not ours to remove.
        string living = Path.Combine(parent, ".out.tessel-staging-1");
        Directory.CreateDirectory(living);
        OutputFolder.Replace(dir, Build(1, "mine"));
        Assert.True(Directory.Exists(living));
    }

    [Fact]
    public void ASecondBuildWaitsForTheLockAndThenRefusesWithOneLine()
    {
        string parent = TestPaths.NewTempFolder();
        string dir = Path.Combine(parent, "out");
        OutputFolder.Replace(dir, Build(3, "first"));
        var before = Contents(dir);
        using (var held = FolderLock.TryAcquire(dir, TimeSpan.Zero))
        {
            Assert.NotNull(held);
            var e = Assert.Throws<OutputFolderError>(() => OutputFolder.Replace(dir, Build(1, "second"), lockWait: TimeSpan.FromMilliseconds(400)));
            Assert.Equal($"{dir}: another Tessel build is writing this output folder; wait for it to finish or choose another --out", e.Message);
            Assert.Equal(before, Contents(dir));
        }
        // Released: the next build goes ahead.
        OutputFolder.Replace(dir, Build(1, "third"));
        Assert.Equal("third sheet 1", Contents(dir)["sheets/sheet-01.svg"]);
    }

    [Fact]
    public void FoldersThatMustNotBeReplacedWholeAreRefused()
    {
        Assert.Equal("--out", Assert.Throws<JobError>(() => OutputFolder.Replace("/", Build(1, "x"))).Where);
        Assert.Equal("--out", Assert.Throws<JobError>(() => OutputFolder.Replace(Directory.GetCurrentDirectory(), Build(1, "x"))).Where);
        string home = Environment.GetFolderPath(Environment.SpecialFolder.UserProfile);
        Assert.Contains("home folder", Assert.Throws<JobError>(() => OutputFolder.Replace(home, Build(1, "x"))).Message);
    }

    [Fact]
    public void ALinkToAFolderReplacesTheFolderItNames()
    {
        string parent = TestPaths.NewTempFolder();
        string real = Path.Combine(parent, "real");
        Directory.CreateDirectory(real);
        string link = Path.Combine(parent, "link");
        Directory.CreateSymbolicLink(link, real);
        OutputFolder.Replace(link, Build(1, "via link"));
        Assert.Equal(real, new DirectoryInfo(link).LinkTarget);
        Assert.Contains("via link", Contents(real)["summary.json"]);
    }
}
