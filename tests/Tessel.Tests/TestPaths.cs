namespace Tessel.Tests;

/// <summary>Locations shared by tests: the repository root (found from the test binary) and fresh
/// temporary folders.</summary>
internal static class TestPaths
{
    public static string RepoRoot { get; } = FindRoot();

    public static string Patterns => Path.Combine(RepoRoot, "patterns");

    private static string FindRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "Tessel.sln"))) dir = dir.Parent;
        return dir?.FullName ?? throw new InvalidOperationException("Tessel.sln not found above the test binary");
    }

    /// <summary>A new empty folder under the system temp folder.</summary>
    public static string NewTempFolder()
    {
        string p = Path.Combine(Path.GetTempPath(), "tessel-tests", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(p);
        return p;
    }
}
