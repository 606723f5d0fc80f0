using System.Diagnostics;
using Tessel.Cli;
using Xunit.Abstractions;

namespace Tessel.Tests.Hardening;

/// <summary>Runs every generated case through 'tessel validate' and 'tessel build' in-process.</summary>
public class GeneratedCorpusTests(ITestOutputHelper log)
{
    public static TheoryData<string> CategoryNames() => new(JobCorpus.Categories);

    /// <summary>Categories where every case is invalid by construction: none may slip through.</summary>
    private static readonly HashSet<string> AllInvalid = ["wrong-type", "unknown-field", "nesting", "cell-count", "formula", "fabrication"];

    /// <summary>Cases in otherwise mixed categories that are invalid by construction (a footprint past the target).</summary>
    private static readonly HashSet<string> MustBeRefused = ["dome-too-wide", "vault-too-wide", "height-map-outside-image", "mesh-outside-mesh"];

    /// <summary>Valid mutants built per category; TESSEL_FUZZ_ALL_BUILDS=1 builds every one (a slower,
    /// deeper run: about a second per valid case).</summary>
    private static readonly int ValidBuildsPerCategory =
        Environment.GetEnvironmentVariable("TESSEL_FUZZ_ALL_BUILDS") == "1" ? int.MaxValue : 3;

    [Theory]
    [MemberData(nameof(CategoryNames))]
    public void EveryCaseFailsCleanlyOrBuilds(string category)
    {
        var sw = Stopwatch.StartNew();
        string dir = TestPaths.NewTempFolder();
        JobCorpus.WriteSupportFiles(dir);
        var cases = JobCorpus.Cases(category).ToList();
        var failures = new List<string>();
        var valid = new List<string>();
        int n = 0;
        foreach (var c in cases)
        {
            string file = Path.Combine(dir, $"case{n++:D4}.json");
            File.WriteAllBytes(file, c.Bytes);
            // Refused jobs are cheap and always built; valid ones render previews, so only the first
            // few per category are built (all of them are validated).
            var (problems, isValid) = CliHarness.Check(file, dir, ok => !ok || valid.Count < ValidBuildsPerCategory);
            if (isValid) valid.Add(c.Name);
            foreach (var p in problems) failures.Add($"[{category}] {c.Name} ({Path.GetFileName(file)}): {p}");
        }
        log.WriteLine($"{category}: {cases.Count} cases, {cases.Count - valid.Count} refused, {valid.Count} valid, {sw.Elapsed.TotalSeconds:0.0} s");
        foreach (var v in valid) log.WriteLine($"  valid after mutation: {v}");
        Assert.True(failures.Count == 0, string.Join("\n", failures.Take(40)) + $"\n({failures.Count} problems)");
        if (AllInvalid.Contains(category)) Assert.Empty(valid);
        Assert.Empty(valid.Intersect(MustBeRefused));
        Assert.True(cases.Count - valid.Count > 0, "a category with no refused case tests nothing");
    }

    [Fact]
    public void CorpusHasAtLeast500CasesInEveryCategory()
    {
        var counts = JobCorpus.Categories.ToDictionary(c => c, c => JobCorpus.Cases(c).Count());
        foreach (var (c, k) in counts) log.WriteLine($"{c}: {k}");
        Assert.True(counts.Values.Sum() >= 500, $"only {counts.Values.Sum()} generated cases");
        Assert.All(counts, kv => Assert.True(kv.Value >= 8, $"{kv.Key} has only {kv.Value} cases"));
        // Seeded: the same cases every run.
        Assert.Equal(JobCorpus.Cases("char-edit").Select(c => c.Name), JobCorpus.Cases("char-edit").Select(c => c.Name));
    }

    [Fact]
    public void EveryKnownFieldGetsAWrongTypeAndAMisspelling()
    {
        var wrong = JobCorpus.Cases("wrong-type").Select(c => c.Name.Split('=')[0]).ToHashSet();
        var misspelt = JobCorpus.Cases("unknown-field").Select(c => c.Name.Split("->")[0]).ToHashSet();
        foreach (var path in Tessel.Core.Jobs.JobLoader.KnownFieldPaths())
        {
            Assert.Contains(path, wrong);
            Assert.Contains(path, misspelt);
        }
    }

    [Fact]
    public void EmptyFileIsReportedAtLineOneColumnOne()
    {
        string dir = TestPaths.NewTempFolder();
        string file = Path.Combine(dir, "empty.json");
        File.WriteAllBytes(file, []);
        var r = CliHarness.Run("validate", file);
        Assert.Equal(ExitCodes.BadInput, r.Code);
        Assert.StartsWith("tessel: empty.json:1:1: malformed JSON: the file is empty; ", r.Err);
    }

    [Fact]
    public void TenThousandNestedArraysStopAtTheDepthLimit()
    {
        string dir = TestPaths.NewTempFolder();
        string file = Path.Combine(dir, "deep.json");
        File.WriteAllText(file, new string('[', 10000) + new string(']', 10000));
        var r = CliHarness.Run("build", file, "--out", Path.Combine(dir, "out"), "--quiet");
        Assert.Equal(ExitCodes.BadInput, r.Code);
        Assert.Matches(@"^tessel: deep\.json:1:3\d: malformed JSON: .*depth", r.Err);
        Assert.False(Directory.Exists(Path.Combine(dir, "out")));
    }
}
