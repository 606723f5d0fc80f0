using System.Diagnostics;

namespace Tessel.Tests.Hardening;

/// <summary>The command line built in Release, for tests that run it as a child process: a Debug
/// build runs the fit several times slower, and such tests should see what a user runs. Built once
/// per test run, incrementally, into a folder named after the repository's path (the first test to ask waits for the build).</summary>
internal static class ReleaseCli
{
    private static readonly Lazy<string> Built = new(Build, LazyThreadSafetyMode.ExecutionAndPublication);

    /// <summary>Path of tessel.dll of the Release build.</summary>
    public static string Dll => Built.Value;

    private static string Build()
    {
        string output = Path.Combine(Path.GetTempPath(), "tessel-tests", "release-cli-"
            + Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(TestPaths.RepoRoot)))[..12]);
        var start = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true };
        foreach (var a in new[] { "build", Path.Combine(TestPaths.RepoRoot, "src", "Tessel.Cli"), "-c", "Release", "-o", output, "--nologo", "-v", "q" })
            start.ArgumentList.Add(a);
        using var p = Process.Start(start)!;
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        // A guard against a hung build only: a Release build takes about a minute here.
        if (!p.WaitForExit(TimeSpan.FromMinutes(15))) { p.Kill(entireProcessTree: true); throw new TimeoutException("the Release build of the command line hung"); }
        string dll = Path.Combine(output, "tessel.dll");
        if (p.ExitCode != 0 || !File.Exists(dll))
            throw new InvalidOperationException($"the Release build of the command line failed: {stdout.Result}{stderr.Result}");
        return dll;
    }

    /// <summary>Starts `dotnet tessel.dll args` with output captured line by line.</summary>
    /// <remarks>Through `env --default-signal=INT` (which execs, so the process id stays the child's): a test
    /// run started in the background inherits SIGINT ignored, and the .NET runtime then leaves it ignored,
    /// so the Ctrl-C tests would see no signal.</remarks>
    public static Child Start(IEnumerable<string> args, IDictionary<string, string>? environment = null)
    {
        var start = new ProcessStartInfo("env") { RedirectStandardOutput = true, RedirectStandardError = true };
        start.ArgumentList.Add("--default-signal=INT");
        start.ArgumentList.Add("dotnet");
        start.ArgumentList.Add(Dll);
        foreach (var a in args) start.ArgumentList.Add(a);
        if (environment is not null) foreach (var (k, v) in environment) start.Environment[k] = v;
        return new Child(Process.Start(start)!);
    }

    /// <summary>Sends a signal to a child (Process.Kill only sends SIGKILL).</summary>
    public static void Signal(int pid, string signal)
    {
        using var kill = Process.Start(new ProcessStartInfo("kill") { ArgumentList = { "-" + signal, pid.ToString(System.Globalization.CultureInfo.InvariantCulture) } })!;
        kill.WaitForExit();
    }
}

/// <summary>A running command line with its stderr lines collected.</summary>
internal sealed class Child : IDisposable
{
    private readonly List<string> _err = new();
    private readonly TaskCompletionSource<bool> _paused = new(TaskCreationOptions.RunContinuationsAsynchronously);

    public Child(Process process)
    {
        Process = process;
        process.OutputDataReceived += (_, _) => { };
        process.ErrorDataReceived += (_, e) =>
        {
            if (e.Data is null) return;
            lock (_err) _err.Add(e.Data);
            if (e.Data.Contains("test pause before the swap", StringComparison.Ordinal)) _paused.TrySetResult(true);
        };
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
    }

    public Process Process { get; }

    public string[] ErrLines { get { lock (_err) return _err.ToArray(); } }

    /// <summary>Waits until the child announces its test pause before the swap; false if it exited first
    /// or the hang guard ran out.</summary>
    public bool WaitForPause(TimeSpan guard) => Task.WaitAny(new Task[] { _paused.Task, Process.WaitForExitAsync() }, guard) == 0;

    /// <summary>Waits for the exit (guarded against a hang) and returns the exit code.</summary>
    public int Exit(TimeSpan guard)
    {
        if (!Process.WaitForExit(guard)) { Process.Kill(entireProcessTree: true); throw new TimeoutException("child hung"); }
        Process.WaitForExit();
        return Process.ExitCode;
    }

    public void Dispose()
    {
        if (!Process.HasExited) Process.Kill(entireProcessTree: true);
        Process.Dispose();
    }
}
