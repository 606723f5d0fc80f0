using Xunit.Abstractions;

namespace Tessel.Tests.Hardening;

/// <summary>The hand-written corpus in Hardening/Corpus: job files and the corrupt images and meshes
/// they point at. expected.tsv gives, per job, "OK" or the exact stderr line after "tessel: " (the
/// folder part of file paths written as {dir}).</summary>
public class CorpusFileTests(ITestOutputHelper log)
{
    public static string CorpusDir => Path.Combine(AppContext.BaseDirectory, "Hardening", "Corpus");

    private static Dictionary<string, string> Expected() => File.ReadAllLines(Path.Combine(CorpusDir, "expected.tsv"))
        .Where(l => l.Length > 0 && !l.StartsWith('#'))
        .Select(l => l.Split('\t', 2))
        .ToDictionary(p => p[0], p => p[1]);

    public static TheoryData<string> Jobs() => new(Directory.GetFiles(CorpusDir, "*.json").Select(Path.GetFileName).Order(StringComparer.Ordinal)!);

    [Theory]
    [MemberData(nameof(Jobs))]
    public void CorpusJobGivesItsExpectedResult(string job)
    {
        string file = Path.Combine(CorpusDir, job);
        string outRoot = TestPaths.NewTempFolder();
        var clock = System.Diagnostics.Stopwatch.StartNew();
        var (problems, valid) = CliHarness.Check(file, outRoot);
        // Logged, not asserted (timings depend on the machine's load): every case should end well within a minute.
        log.WriteLine($"{job}: validate and build took {clock.Elapsed.TotalSeconds:0.0} s");
        Assert.True(problems.Count == 0, string.Join("\n", problems));
        var expected = Expected();
        var v = CliHarness.Run("validate", file);
        string actual = valid ? "OK" : v.Err.TrimEnd()["tessel: ".Length..].Replace(CorpusDir, "{dir}", StringComparison.Ordinal);
        log.WriteLine($"{job}\t{actual}");
        Assert.True(expected.ContainsKey(job), $"add to expected.tsv:\n{job}\t{actual}");
        Assert.Equal(expected[job], actual);
    }

    [Fact]
    public void EveryExpectationHasItsJob()
    {
        foreach (var job in Expected().Keys) Assert.True(File.Exists(Path.Combine(CorpusDir, job)), job);
        Assert.True(Expected().Count >= 50, $"{Expected().Count} corpus jobs");
    }
}
