using System.Diagnostics;

namespace Tessel.Tests.Sheets;

/// <summary>Runs a command-line checker (rsvg-convert, pdfinfo, pdftoppm) that CI installs.</summary>
internal static class ExternalTool
{
    public static (int ExitCode, string Output) Run(string tool, string arguments)
    {
        var psi = new ProcessStartInfo(tool, arguments)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        using Process p = Process.Start(psi) ?? throw new InvalidOperationException($"could not start {tool}");
        Task<string> err = p.StandardError.ReadToEndAsync();
        string output = p.StandardOutput.ReadToEnd();
        if (!p.WaitForExit(60_000)) { p.Kill(); throw new TimeoutException($"{tool} took over 60 s"); }
        return (p.ExitCode, output + err.Result);
    }
}
