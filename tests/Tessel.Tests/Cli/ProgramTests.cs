using Tessel.Cli;
using Tessel.Core.Jobs;

namespace Tessel.Tests.Cli;

public class ProgramTests
{
    private static (int Code, string Out, string Err) Run(params string[] args) => InProcessCli.Run(args);

    [Fact]
    public void BuildWithoutAJobBuildsTheBundledDemo()
    {
        string dir = Path.Combine(TestPaths.NewTempFolder(), "demo");
        var (code, stdout, stderr) = Run("build", "--out", dir, "--quiet");
        Assert.Equal(ExitCodes.Ok, code);
        Assert.Equal("", stderr);
        Assert.Contains("built saddle-canopy", stdout);
        Assert.True(File.Exists(Path.Combine(dir, "target.png")));
        // The bundled demo is the shipped pattern, byte for byte.
        Assert.Equal(File.ReadAllText(Path.Combine(TestPaths.Patterns, "saddle-canopy.json")), DemoJob.Text());
    }

    [Fact]
    public void ProgressGoesToStderrUnlessQuiet()
    {
        string dir = Path.Combine(TestPaths.NewTempFolder(), "p");
        var (code, _, stderr) = Run("build", Path.Combine(TestPaths.Patterns, "barrel-vault.json"), "--out", dir, "--seed", "5");
        // Whether the fit converges depends on the seed's start; the summary is written either way.
        Assert.True(code is ExitCodes.Ok or ExitCodes.NotConverged, stderr);
        Assert.Contains("[target]", stderr);
        Assert.Contains("\"seed\": 5", File.ReadAllText(Path.Combine(dir, "summary.json")));
    }

    [Fact]
    public void BadJobIsExitCodeOneWithOneLine()
    {
        string dir = TestPaths.NewTempFolder();
        string job = Path.Combine(dir, "bad.json");
        File.WriteAllText(job, """{ "target": { "kind": "cylinder", "radius": -3, "rise": 1, "footprint": { "width": 4, "depth": 3 } } }""");
        var (code, _, stderr) = Run("build", job, "--out", Path.Combine(dir, "out"));
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Equal("tessel: target.radius: must be a positive length in m (got -3)" + Environment.NewLine, stderr);
        Assert.False(Directory.Exists(Path.Combine(dir, "out")));
    }

    [Fact]
    public void UnwritableOutputIsExitCodeThree()
    {
        string blocker = Path.Combine(TestPaths.NewTempFolder(), "file");
        File.WriteAllText(blocker, "x");
        var (code, _, stderr) = Run("build", "--quiet", "--out", Path.Combine(blocker, "sub"));
        Assert.Equal(ExitCodes.OutputNotWritable, code);
        Assert.StartsWith("tessel: ", stderr);
    }

    [Fact]
    public void UsageErrorsAreExitCodeOne()
    {
        var (code, _, stderr) = Run("build", "--no-such-option");
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.StartsWith("tessel: ", stderr);
        Assert.Single(stderr.TrimEnd().Split('\n'));
        (code, _, _) = Run("catalog", "colours");
        Assert.Equal(ExitCodes.BadInput, code);
    }

    [Theory]
    [InlineData("saddle-canopy.json")]
    [InlineData("shallow-dome.json")]
    [InlineData("barrel-vault.json")]
    [InlineData("garden-dome.json")]
    public void PatternsValidate(string file)
    {
        var (code, stdout, _) = Run("validate", Path.Combine(TestPaths.Patterns, file));
        Assert.Equal(ExitCodes.Ok, code);
        Assert.StartsWith("OK ", stdout);
    }

    [Fact]
    public void ValidateSaysBeforeAnyFitWhenTheCellsWillBeLoweredForTheMinimumCrease()
    {
        // A pavilion's wave roof (invented), 22 x 22 Miura cells at 1:60: the drape's creases are under the
        // default 3 mm minimum on the model, so the build will use fewer cells; validate names the change.
        string dir = TestPaths.NewTempFolder();
        string job = Path.Combine(dir, "pavilion.json");
        File.WriteAllText(job, """{ "name": "pavilion", "target": { "kind": "sinusoidal-wave", "amplitude": 0.15, "wavelength": 4, "footprint": { "width": 4.4, "depth": 2.6 } }, "tessellation": { "family": "miura", "cellsX": 22, "cellsY": 22 }, "fabrication": { "scale": 60 } }""");
        var (code, stdout, _) = Run("validate", job);
        Assert.Equal(ExitCodes.Ok, code);
        var note = Assert.Single(stdout.Split('\n'), l => l.StartsWith("note: ", StringComparison.Ordinal));
        Assert.Contains("tessellation.cellsX x cellsY lowered from 22 x 22", note);
        Assert.Contains("fabrication.scale", note);
    }

    [Fact]
    public void ValidateReportsUndefinedFormulaWithItsLocation()
    {
        string dir = TestPaths.NewTempFolder();
        string job = Path.Combine(dir, "f.json");
        File.WriteAllText(job, """{ "target": { "kind": "formula", "formula": "1/x", "footprint": { "width": 2, "depth": 2 } } }""");
        var (code, _, stderr) = Run("validate", job);
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.StartsWith("tessel: target.formula: ", stderr);
        Assert.Contains("x = 0", stderr);
    }

    [Fact]
    public void ScaffoldWritesAValidJobAndNeverOverwrites()
    {
        string dir = TestPaths.NewTempFolder();
        string file = Path.Combine(dir, "dome.json");
        var (code, _, _) = Run("scaffold", "--target", "spherical-cap", "--family", "reverse-curvature", "--out", file);
        Assert.Equal(ExitCodes.Ok, code);
        (code, _, _) = Run("validate", file);
        Assert.Equal(ExitCodes.Ok, code);
        string before = File.ReadAllText(file);
        var (again, _, stderr) = Run("scaffold", "--target", "plane", "--family", "miura", "--out", file);
        Assert.Equal(ExitCodes.BadInput, again);
        Assert.Contains("already exists", stderr);
        Assert.Equal(before, File.ReadAllText(file));
    }

    [Fact]
    public void ScaffoldRejectsUnknownKind()
    {
        var (code, _, stderr) = Run("scaffold", "--target", "spere", "--family", "miura", "--out", Path.Combine(TestPaths.NewTempFolder(), "x.json"));
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("--target", stderr);
    }

    [Theory]
    [InlineData("targets", 9)]
    [InlineData("families", 5)]
    [InlineData("sheets", 18)]
    public void CatalogListsOneLineEach(string what, int lines)
    {
        var (code, stdout, _) = Run("catalog", what);
        Assert.Equal(ExitCodes.Ok, code);
        Assert.Equal(lines, stdout.TrimEnd().Split('\n').Length);
        Assert.DoesNotContain("egg", stdout);
    }

    [Fact]
    public void CatalogTargetsNamesEveryKindTheLoaderAccepts()
    {
        var (_, stdout, _) = Run("catalog", "targets");
        foreach (var k in Catalog.TargetKinds) Assert.Contains(k.Name, stdout);
    }
}
