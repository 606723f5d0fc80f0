using Tessel.Cli;
using Tessel.Core.Jobs;
using Tessel.Core.Pipeline;

namespace Tessel.Tests.Cli;

/// <summary>What a first-time user reads when something is off: one plain line each, naming what
/// they typed and what to do, with no parser internals or type names.</summary>
public class WordingTests
{
    private static (int Code, string Out, string Err) Run(params string[] args) => InProcessCli.Run(args);

    private static string[] Lines(string text) => text.TrimEnd().Split('\n');

    [Fact]
    public void UnknownVerbIsNamedWithTheNearestVerb()
    {
        var (code, _, err) = Run("bogus");
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Single(Lines(err));
        Assert.StartsWith("tessel: unknown command 'bogus'; the commands are build, scaffold, catalog, validate", err);
        Assert.DoesNotContain("Required command", err);
        (_, _, err) = Run("biuld", "job.json");
        Assert.Contains("unknown command 'biuld'; did you mean 'build'?", err);
    }

    [Fact]
    public void UnknownCatalogListIsOneLine()
    {
        var (code, _, err) = Run("catalog", "foo");
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Single(Lines(err));
        Assert.DoesNotContain("\t", err);
        Assert.Contains("catalog has no list 'foo'; choose targets, families, materials or sheets", err);
        (_, _, err) = Run("catalog", "sheet");
        Assert.Contains("did you mean 'sheets'?", err);
    }

    [Fact]
    public void SeedThatIsNotANumberIsAPlainMessage()
    {
        var (code, _, err) = Run("build", "--seed", "abc", "--quiet");
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Single(Lines(err));
        Assert.Contains("--seed must be a whole number >= 0, e.g. --seed 7 (got \"abc\")", err);
        Assert.DoesNotContain("System.", err);
        Assert.DoesNotContain("Nullable", err);
    }

    [Theory]
    [InlineData("")]
    [InlineData("  \n\t ")]
    public void EmptyJobFileSaysSoWithoutParserInternals(string content)
    {
        string dir = TestPaths.NewTempFolder();
        string job = Path.Combine(dir, "blank.json");
        File.WriteAllText(job, content);
        var (code, _, err) = Run("validate", job);
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Equal("tessel: blank.json:1:1: malformed JSON: the file is empty; a job file is a JSON object with at least a target, and 'tessel scaffold --target plane --family miura' writes one to start from", err.TrimEnd());
    }

    [Fact]
    public void MalformedJobFileNamesNoParserParameter()
    {
        var e = Assert.Throws<JobError>(() => JobLoader.Parse("{ \"name\": ", "half.json", "."));
        Assert.StartsWith("half.json:1:", e.Message);
        Assert.DoesNotContain("isFinalBlock", e.Message);
    }

    [Fact]
    public void MaterialCatalogShowsJobFileValues()
    {
        var (code, stdout, _) = Run("catalog", "materials");
        Assert.Equal(ExitCodes.Ok, code);
        Assert.Contains("card        300 gsm card, t = 0.4 mm; folds: mountain score, valley two-sided;", stdout);
        Assert.Contains("folds: mountain perforate, valley perforate", stdout);
        Assert.DoesNotContain("ScoreFromBack", stdout);
        Assert.DoesNotContain("Score,", stdout);
        // Every fold value printed is one that fabrication.foldMethod accepts.
        var accepted = Catalog.FoldMethods.Select(f => f.Name).ToHashSet();
        foreach (var m in Tessel.Core.Sheets.Materials.All)
        {
            Assert.Contains(Tessel.Core.Composition.JobVocabularyRegistration.JobValue(m.MountainMethod), accepted);
            Assert.Contains(Tessel.Core.Composition.JobVocabularyRegistration.JobValue(m.ValleyMethod), accepted);
        }
    }

    [Fact]
    public void CountsAndStopReasonsReadAsEnglish()
    {
        Assert.Equal("1 part", Wording.Count(1, "part"));
        Assert.Equal("0 parts", Wording.Count(0, "part"));
        Assert.Equal("2 sheets", Wording.Count(2, "sheet"));
        Assert.Equal("1,204 seams", Wording.Count(1204, "seam"));
        Assert.Equal("step below tolerance", Wording.StopDetail("converged: step below tolerance"));
        Assert.Equal("iteration limit", Wording.StopDetail("iteration limit"));
    }

    [Fact]
    public void BuildProgressNeverRepeatsConvergedOrSaysOneParts()
    {
        // An invented job: a 1.2 m plywood reading-nook canopy, small enough to fit in a second.
        string dir = TestPaths.NewTempFolder();
        string job = Path.Combine(dir, "nook.json");
        File.WriteAllText(job, """
            { "name": "reading-nook", "target": { "kind": "cylinder", "radius": 3, "rise": 0.3, "footprint": { "width": 1.2, "depth": 0.8 } },
              "tessellation": { "family": "miura", "cellsX": 3, "cellsY": 3 }, "fabrication": { "scale": 10 } }
            """);
        var (code, _, err) = Run("build", job, "--out", Path.Combine(dir, "out"));
        Assert.True(code is ExitCodes.Ok or ExitCodes.NotConverged, err);
        Assert.Contains("[fit]", err);
        Assert.DoesNotContain("(converged:", err);
        Assert.DoesNotContain(" 1 parts", err);
        Assert.DoesNotContain("part(s)", err);
        Assert.Matches(@"\d+ parts? on \d+ sheets?", err);
    }

    [Fact]
    public void GradingAdviceNamesOnlyJobFields()
    {
        // The target stops at |y| = 0.51 m; the graded zig-zag would reach past it near the footprint's
        // corners, so the generator shrinks the grading there instead of refusing with advice about it.
        string dir = TestPaths.NewTempFolder();
        string job = Path.Combine(dir, "kiln.json");
        File.WriteAllText(job, """
            { "name": "kiln-shelter", "target": { "kind": "formula", "formula": "0.3*sqrt(0.2601 - y^2)", "footprint": { "width": 1, "depth": 1 } },
              "tessellation": { "family": "reverse-curvature", "cellsX": 4, "cellsY": 4 }, "fabrication": { "scale": 10 } }
            """);
        var (code, _, err) = Run("build", job, "--quiet", "--out", Path.Combine(dir, "out"));
        Assert.True(code is ExitCodes.Ok or ExitCodes.NotConverged, err);
        Assert.DoesNotContain("Grading", err);
        Assert.DoesNotContain("where the target has no surface", err);
    }
}
