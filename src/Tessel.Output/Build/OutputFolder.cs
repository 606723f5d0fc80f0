using System.Diagnostics;
using System.Text;
using System.Text.Json;
using Tessel.Core.Jobs;
using Tessel.Output.IO;

namespace Tessel.Output.Build;

/// <summary>The output folder could not be replaced for a reason the user can act on: another build
/// holds it, or one of the user's own files sits where the new build writes. One line; the command
/// line maps it to the "output not writable" exit code.</summary>
public sealed class OutputFolderError(string message) : Exception(message);

/// <summary>Replaces the files of one build in an output folder so that the folder holds exactly the
/// new build's files plus whatever Tessel did not write, and so that at every moment the folder shows
/// either the complete old build or the complete new one.</summary>
/// <remarks>
/// How: under a <see cref="FolderLock"/>, the new files are written into a staging folder beside the
/// target (<c>.NAME.tessel-staging-PID</c>, same file system, so renames are metadata operations), the
/// user's own files and folders are carried into it (hard links, so nothing is copied and nothing of
/// the user's is moved), and then the two folders are exchanged in one step with Linux
/// renameat2(RENAME_EXCHANGE). The staging name then holds the old build, which is deleted. Where the
/// exchange is not available the swap is two renames, target to <c>.NAME.tessel-old-PID</c> and
/// staging to target; a build killed between them leaves no target, and the next build renames the
/// old folder back before it starts. Which files are Tessel's comes from the manifest
/// <see cref="ManifestFile"/> written into every build (for a folder from before the manifest:
/// summary.json's file list).
/// </remarks>
public static class OutputFolder
{
    /// <summary>The manifest: every path the last build wrote, one per line, after comment lines.</summary>
    public const string ManifestFile = ".tessel-files";

    /// <summary>How long a build waits for another build that is writing the same folder.</summary>
    public static readonly TimeSpan DefaultLockWait = TimeSpan.FromSeconds(20);

    private const string StagingTag = ".tessel-staging-";
    private const string OldTag = ".tessel-old-";

    /// <summary>Environment variable that makes a build stop before its swap (value "swap") and wait
    /// there for a minute, announcing it on stderr: only for the interruption tests.</summary>
    public const string TestPauseVariable = "TESSEL_TEST_PAUSE";

    /// <summary>Replaces the contents of <paramref name="folder"/> with <paramref name="files"/>
    /// ('/'-separated relative paths) and returns its absolute path.</summary>
    /// <exception cref="JobError">The folder is one that must never be replaced whole.</exception>
    /// <exception cref="OutputNotWritableError">The folder or its parent cannot be written.</exception>
    /// <exception cref="OutputFolderError">Another build holds the folder, or a user's file is in the way.</exception>
    /// <exception cref="OperationCanceledException"><paramref name="cancel"/> fired before the swap;
    /// the staging folder is removed and the target is as it was.</exception>
    public static string Replace(string folder, IReadOnlyList<(string Path, byte[] Bytes)> files, Action<string>? step = null,
        CancellationToken cancel = default, TimeSpan? lockWait = null)
    {
        string root = Target(folder);
        string parent = Path.GetDirectoryName(root)!;
        string name = Path.GetFileName(root);
        Guard(() =>
        {
            if (File.Exists(root)) throw new OutputNotWritableError(root, "a file with that name exists");
            Directory.CreateDirectory(parent);
        }, root);

        using var held = FolderLock.TryAcquire(root, lockWait ?? DefaultLockWait, cancel)
            ?? throw new OutputFolderError($"{root}: another Tessel build is writing this output folder; wait for it to finish or choose another --out");
        Guard(() => Recover(parent, name, root), root);

        string staging = Path.Combine(parent, $".{name}{StagingTag}{Environment.ProcessId}");
        try
        {
            Guard(() =>
            {
                DeleteTree(staging);
                Directory.CreateDirectory(staging);
                if (!OperatingSystem.IsWindows() && Directory.Exists(root))
                    File.SetUnixFileMode(staging, File.GetUnixFileMode(root));
                foreach (var (rel, bytes) in files)
                {
                    cancel.ThrowIfCancellationRequested();
                    WriteFile(Path.Combine(staging, Native(rel)), bytes);
                    step?.Invoke($"{rel} ({bytes.Length} bytes)");
                }
                WriteFile(Path.Combine(staging, ManifestFile), Manifest(files.Select(f => f.Path)));
                if (Directory.Exists(root))
                {
                    var ours = TesselPaths(root);
                    var dirsOfOurs = new HashSet<string>(ours.SelectMany(Ancestors), StringComparer.Ordinal);
                    CarryOver(root, staging, "", ours, dirsOfOurs, cancel);
                }
            }, root);
            PauseForTests(cancel);
            cancel.ThrowIfCancellationRequested();
            Guard(() => Swap(root, staging, parent, name), root);
        }
        catch
        {
            DeleteTree(staging);
            throw;
        }
        return root;
    }

    /// <summary>Checks before any work that <paramref name="folder"/> is one a build may replace
    /// (not a file-system root, the home folder or the current folder); returns its absolute path.</summary>
    /// <exception cref="JobError">It is not.</exception>
    public static string CheckTarget(string folder) => Target(folder);

    /// <summary>The absolute target folder; a symbolic link to a folder stands for the folder it names.</summary>
    private static string Target(string folder)
    {
        string root = Path.TrimEndingDirectorySeparator(Path.GetFullPath(folder));
        if (Directory.Exists(root) && new DirectoryInfo(root).ResolveLinkTarget(returnFinalTarget: true) is { } real)
            root = Path.TrimEndingDirectorySeparator(real.FullName);
        string home = Path.TrimEndingDirectorySeparator(Environment.GetFolderPath(Environment.SpecialFolder.UserProfile));
        string cwd = Path.TrimEndingDirectorySeparator(Directory.GetCurrentDirectory());
        if (Path.GetPathRoot(root) == root || Path.GetFileName(root).Length == 0)
            throw new JobError("--out", $"\"{root}\" is a file-system root; Tessel replaces its output folder whole, so name a folder inside it");
        if (root == home)
            throw new JobError("--out", $"\"{root}\" is your home folder; Tessel replaces its output folder whole, so name a folder inside it");
        if (cwd == root || cwd.StartsWith(root + Path.DirectorySeparatorChar, StringComparison.Ordinal))
            throw new JobError("--out", $"\"{root}\" is or contains the current folder; Tessel replaces its output folder whole, so name a folder inside it, e.g. --out out");
        return root;
    }

    /// <summary>Cleans up after builds that were killed: a staging folder is removed; an old folder is
    /// renamed back when the target is missing (killed between the two renames) and removed otherwise.
    /// Only entries whose process is gone are touched.</summary>
    private static void Recover(string parent, string name, string root)
    {
        foreach (var dir in Directory.EnumerateDirectories(parent, $".{name}.tessel-*"))
        {
            string leaf = Path.GetFileName(dir);
            bool old = leaf.StartsWith($".{name}{OldTag}", StringComparison.Ordinal);
            bool staging = leaf.StartsWith($".{name}{StagingTag}", StringComparison.Ordinal);
            if (!old && !staging) continue;
            string pidText = leaf[(leaf.LastIndexOf('-') + 1)..];
            if (!int.TryParse(pidText, out int pid)) continue;
            if (pid != Environment.ProcessId && IsRunning(pid))
            {
                if (old && !Directory.Exists(root))
                    throw new OutputFolderError($"{root}: a Tessel build (process {pid}) is replacing this output folder; wait for it to finish or choose another --out");
                continue;
            }
            if (old && !Directory.Exists(root)) Directory.Move(dir, root);
            else DeleteTree(dir);
        }
    }

    private static bool IsRunning(int pid)
    {
        try
        {
            using var p = Process.GetProcessById(pid);
            return !p.HasExited;
        }
        catch (ArgumentException) { return false; }
        catch (InvalidOperationException) { return false; }
    }

    /// <summary>Puts staging in the target's place. Afterwards the old build is deleted; a failure to
    /// delete it is left for the next build's <see cref="Recover"/>.</summary>
    private static void Swap(string root, string staging, string parent, string name)
    {
        if (!Directory.Exists(root))
        {
            Directory.Move(staging, root);
            return;
        }
        if (NativeFiles.TryExchange(staging, root))
        {
            TryDeleteTree(staging);
            return;
        }
        string old = Path.Combine(parent, $".{name}{OldTag}{Environment.ProcessId}");
        DeleteTree(old);
        Directory.Move(root, old);
        try { Directory.Move(staging, root); }
        catch
        {
            Directory.Move(old, root);
            throw;
        }
        TryDeleteTree(old);
    }

    /// <summary>The paths the build that wrote <paramref name="root"/> owns: its manifest's, or for a
    /// folder from before the manifest, summary.json and the files it lists.</summary>
    private static HashSet<string> TesselPaths(string root)
    {
        var ours = new HashSet<string>(StringComparer.Ordinal) { ManifestFile };
        string manifest = Path.Combine(root, ManifestFile);
        string summary = Path.Combine(root, BuildRunner.SummaryFile);
        if (IsRegularFile(manifest))
        {
            foreach (var line in File.ReadLines(manifest))
                if (line.Length > 0 && !line.StartsWith('#') && IsPlainRelative(line)) ours.Add(line);
        }
        else if (IsRegularFile(summary) && new FileInfo(summary).Length < 16 * 1024 * 1024)
        {
            try
            {
                using var doc = JsonDocument.Parse(File.ReadAllBytes(summary));
                if (doc.RootElement.TryGetProperty("files", out var list) && list.ValueKind == JsonValueKind.Array)
                {
                    ours.Add(BuildRunner.SummaryFile);
                    foreach (var f in list.EnumerateArray())
                        if (f.ValueKind == JsonValueKind.Object && f.TryGetProperty("path", out var p) && p.ValueKind == JsonValueKind.String
                            && IsPlainRelative(p.GetString()!))
                            ours.Add(p.GetString()!);
                }
            }
            catch (JsonException) { }
        }
        return ours;
    }

    private static bool IsRegularFile(string path)
    {
        var info = new FileInfo(path);
        return info.Exists && info.LinkTarget is null;
    }

    private static bool IsPlainRelative(string rel) =>
        !Path.IsPathRooted(rel) && !rel.Contains('\\') && rel.Split('/').All(p => p is not ("" or "." or ".."));

    private static IEnumerable<string> Ancestors(string rel)
    {
        for (int i = rel.IndexOf('/'); i >= 0; i = rel.IndexOf('/', i + 1)) yield return rel[..i];
    }

    /// <summary>Links every entry of <paramref name="from"/> that Tessel did not write into the same
    /// place under <paramref name="to"/>: folders are recreated, everything else (files, symbolic
    /// links, pipes) gets a second name, never a copy that could diverge.</summary>
    private static void CarryOver(string from, string to, string prefix, HashSet<string> ours, HashSet<string> dirsOfOurs, CancellationToken cancel)
    {
        foreach (var entry in new DirectoryInfo(from).EnumerateFileSystemInfos())
        {
            cancel.ThrowIfCancellationRequested();
            string rel = prefix + entry.Name;
            if (ours.Contains(rel) || IsOrphanTemporary(entry.Name)) continue;
            string dest = Path.Combine(to, entry.Name);
            bool realDirectory = entry is DirectoryInfo && entry.LinkTarget is null;
            if (realDirectory)
            {
                if (File.Exists(dest)) throw InTheWay(from, entry.Name, rel);
                bool existed = Directory.Exists(dest);
                if (!existed && !dirsOfOurs.Contains(rel))
                {
                    Directory.CreateDirectory(dest);
                    if (!OperatingSystem.IsWindows()) File.SetUnixFileMode(dest, entry.UnixFileMode);
                }
                // A folder of Tessel's (sheets/) is recreated only if the user keeps something in it.
                CarryOver(entry.FullName, dest, rel + "/", ours, dirsOfOurs, cancel);
                continue;
            }
            if (Path.Exists(dest) || new FileInfo(dest).LinkTarget is not null) throw InTheWay(from, entry.Name, rel);
            Directory.CreateDirectory(to);
            if (NativeFiles.TryHardLink(entry.FullName, dest)) continue;
            if (entry.LinkTarget is { } link) File.CreateSymbolicLink(dest, link);
            else if (entry is FileInfo { Exists: true } file && (file.Attributes & FileAttributes.Device) == 0) file.CopyTo(dest);
            else throw new IOException($"cannot carry {Path.Combine(from, entry.Name)} over into the new build");
        }
    }

    private static OutputFolderError InTheWay(string from, string leaf, string rel) =>
        new($"{Path.Combine(from, leaf)}: this file was not written by Tessel and the new build writes {rel}; move it away or choose another --out");

    /// <summary>A temporary ".NAME.PID.partial" left by a killed build of an earlier version.</summary>
    private static bool IsOrphanTemporary(string leaf)
    {
        if (!leaf.StartsWith('.') || !leaf.EndsWith(".partial", StringComparison.Ordinal)) return false;
        string stem = leaf[..^".partial".Length];
        int dot = stem.LastIndexOf('.');
        return dot > 0 && int.TryParse(stem[(dot + 1)..], out int pid) && !IsRunning(pid);
    }

    private static byte[] Manifest(IEnumerable<string> paths)
    {
        var sb = new StringBuilder();
        sb.Append("# Files written by the last Tessel build into this folder, one per line. The next build\n");
        sb.Append("# into this folder replaces exactly these; every other file here is kept.\n");
        foreach (var p in paths) sb.Append(p).Append('\n');
        return Encoding.UTF8.GetBytes(sb.ToString());
    }

    private static void WriteFile(string path, byte[] bytes)
    {
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        using var fs = new FileStream(path, FileMode.CreateNew, FileAccess.Write, FileShare.None);
        fs.Write(bytes);
        fs.Flush(true);
    }

    private static string Native(string rel) => rel.Replace('/', Path.DirectorySeparatorChar);

    private static void PauseForTests(CancellationToken cancel)
    {
        if (Environment.GetEnvironmentVariable(TestPauseVariable) != "swap") return;
        Console.Error.WriteLine("tessel: test pause before the swap");
        cancel.WaitHandle.WaitOne(TimeSpan.FromMinutes(1));
    }

    /// <summary>Removes a folder and everything in it without following symbolic links (a link is
    /// removed, never what it points at). Missing is fine.</summary>
    internal static void DeleteTree(string path)
    {
        var info = new DirectoryInfo(path);
        if (!info.Exists && info.LinkTarget is null) return;
        if (info.LinkTarget is not null) { File.Delete(path); return; }
        foreach (var entry in info.EnumerateFileSystemInfos())
        {
            if (entry is DirectoryInfo && entry.LinkTarget is null) DeleteTree(entry.FullName);
            else File.Delete(entry.FullName);
        }
        Directory.Delete(path);
    }

    private static void TryDeleteTree(string path)
    {
        try { DeleteTree(path); }
        catch (IOException) { }
        catch (UnauthorizedAccessException) { }
    }

    private static void Guard(Action action, string root)
    {
        try { action(); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new OutputNotWritableError(root, e.Message, e);
        }
    }
}
