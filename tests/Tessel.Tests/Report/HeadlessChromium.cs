using System.Diagnostics;

namespace Tessel.Tests.Report;

/// <summary>Runs the system's Chromium headless for page tests. The flags keep it off the network
/// (no background fetches, no updates, no sync) and in a fresh profile every time.</summary>
internal static class HeadlessChromium
{
    public const string Missing = "Chromium is not installed: install it (apt-get install -y chromium; CI's .ci/run does this) to run the HTML report test.";

    /// <summary>Path of the chromium executable on PATH, or null.</summary>
    public static string? Find()
    {
        foreach (var name in new[] { "chromium", "chromium-browser" })
            foreach (var dir in (Environment.GetEnvironmentVariable("PATH") ?? "").Split(Path.PathSeparator))
            {
                if (dir.Length == 0) continue;
                var candidate = Path.Combine(dir, name);
                if (File.Exists(candidate)) return candidate;
            }
        return null;
    }

    /// <summary>Runs Chromium with the given page arguments and returns its standard output.</summary>
    public static string Run(string executable, IEnumerable<string> pageArguments, TimeSpan timeout)
    {
        string profile = Path.Combine(Path.GetTempPath(), "tessel-chromium-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(profile);
        try
        {
            var psi = new ProcessStartInfo(executable)
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                UseShellExecute = false,
            };
            foreach (var a in new[] { "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                         "--disable-background-networking", "--disable-component-update", "--disable-sync",
                         "--user-data-dir=" + profile })
                psi.ArgumentList.Add(a);
            foreach (var a in pageArguments) psi.ArgumentList.Add(a);
            using var process = Process.Start(psi) ?? throw new InvalidOperationException("could not start " + executable);
            var stdout = process.StandardOutput.ReadToEndAsync();
            var stderr = process.StandardError.ReadToEndAsync();
            if (!process.WaitForExit((int)timeout.TotalMilliseconds))
            {
                process.Kill(entireProcessTree: true);
                throw new TimeoutException($"chromium did not finish within {timeout.TotalSeconds} s");
            }
            process.WaitForExit();
            return stdout.Result;
        }
        finally
        {
            try { Directory.Delete(profile, recursive: true); } catch (IOException) { } catch (UnauthorizedAccessException) { }
        }
    }
}
