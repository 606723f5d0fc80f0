using Tessel.Cli;
using Tessel.Core.Jobs;

namespace Tessel.Tests.Cli;

/// <summary>Every scaffold either builds as written (exit 0) or is refused, naming a family that suits
/// its target; height-map and mesh scaffolds come with an example input that the build reads.</summary>
public class ScaffoldBuildTests
{
    private static (int Code, string Out, string Err) Run(params string[] args) => InProcessCli.Run(args);

    // Every target kind x family (Catalog.TargetKinds x Catalog.Families; a test below checks the list
    // is complete). No row is skipped: every pair builds or is refused naming a suited family.
    [Theory]
    [InlineData("plane", "miura")]
    [InlineData("plane", "reverse-curvature")]
    [InlineData("plane", "yoshimura")]
    [InlineData("plane", "waterbomb")]
    [InlineData("plane", "free-triangulated")]
    [InlineData("cylinder", "miura")]
    [InlineData("cylinder", "reverse-curvature")]
    [InlineData("cylinder", "yoshimura")]
    [InlineData("cylinder", "waterbomb")]
    [InlineData("cylinder", "free-triangulated")]
    [InlineData("spherical-cap", "miura")]
    [InlineData("spherical-cap", "reverse-curvature")]
    [InlineData("spherical-cap", "yoshimura")]
    [InlineData("spherical-cap", "waterbomb")]
    [InlineData("spherical-cap", "free-triangulated")]
    [InlineData("hyperbolic-paraboloid", "miura")]
    [InlineData("hyperbolic-paraboloid", "reverse-curvature")]
    [InlineData("hyperbolic-paraboloid", "yoshimura")]
    [InlineData("hyperbolic-paraboloid", "waterbomb")]
    [InlineData("hyperbolic-paraboloid", "free-triangulated")]
    [InlineData("elliptic-paraboloid", "miura")]
    [InlineData("elliptic-paraboloid", "reverse-curvature")]
    [InlineData("elliptic-paraboloid", "yoshimura")]
    [InlineData("elliptic-paraboloid", "waterbomb")]
    [InlineData("elliptic-paraboloid", "free-triangulated")]
    [InlineData("sinusoidal-wave", "miura")]
    [InlineData("sinusoidal-wave", "reverse-curvature")]
    [InlineData("sinusoidal-wave", "yoshimura")]
    [InlineData("sinusoidal-wave", "waterbomb")]
    [InlineData("sinusoidal-wave", "free-triangulated")]
    [InlineData("formula", "miura")]
    [InlineData("formula", "reverse-curvature")]
    [InlineData("formula", "yoshimura")]
    [InlineData("formula", "waterbomb")]
    [InlineData("formula", "free-triangulated")]
    [InlineData("height-map", "miura")]
    [InlineData("height-map", "reverse-curvature")]
    [InlineData("height-map", "yoshimura")]
    [InlineData("height-map", "waterbomb")]
    [InlineData("height-map", "free-triangulated")]
    [InlineData("mesh", "miura")]
    [InlineData("mesh", "reverse-curvature")]
    [InlineData("mesh", "yoshimura")]
    [InlineData("mesh", "waterbomb")]
    [InlineData("mesh", "free-triangulated")]
    public void EveryScaffoldBuildsAsWrittenOrIsRefusedNamingASuitedFamily(string kind, string family)
    {
        string dir = TestPaths.NewTempFolder();
        string job = Path.Combine(dir, $"{kind}-{family}.json");
        var (code, stdout, stderr) = Run("scaffold", "--target", kind, "--family", family, "--out", job);
        if (code != ExitCodes.Ok)
        {
            Assert.Equal(ExitCodes.BadInput, code);
            Assert.False(File.Exists(job));
            var named = Catalog.Families.Select(f => f.Name).Where(f => f != family && stderr.Contains(f)).ToList();
            Assert.True(named.Count > 0, $"the refusal names no other family: {stderr}");
            // The family it names is one scaffold accepts for this target.
            string other = named[0];
            var (again, _, err2) = Run("scaffold", "--target", kind, "--family", other, "--out", Path.Combine(dir, "other.json"));
            Assert.True(again == ExitCodes.Ok, $"{kind}/{family} suggested {other}, which is refused too: {err2}");
            return;
        }
        if (kind is "height-map" or "mesh")
        {
            string input = kind == "height-map" ? "site-heights.png" : "canopy.obj";
            Assert.True(File.Exists(Path.Combine(dir, input)), $"{input} was not written beside the job");
            Assert.Contains(input, stdout);
        }
        var (v, _, verr) = Run("validate", job);
        Assert.True(v == ExitCodes.Ok, verr);
        var (b, _, berr) = Run("build", job, "--quiet", "--out", Path.Combine(dir, "out"));
        Assert.True(b == ExitCodes.Ok, $"{kind}/{family} scaffold did not build: {berr}");
    }

    [Fact]
    public void ThePairListCoversEveryKindAndFamily()
    {
        var rows = typeof(ScaffoldBuildTests).GetMethod(nameof(EveryScaffoldBuildsAsWrittenOrIsRefusedNamingASuitedFamily))!
            .GetCustomAttributes(typeof(InlineDataAttribute), false).Cast<InlineDataAttribute>()
            .Select(a => ((string)a.GetData(null!).First()[0], (string)a.GetData(null!).First()[1])).ToHashSet();
        foreach (var k in Catalog.TargetKinds) foreach (var f in Catalog.Families) Assert.Contains((k.Name, f.Name), rows);
        Assert.Equal(Catalog.TargetKinds.Count * Catalog.Families.Count, rows.Count);
    }

    [Fact]
    public void ValidateRefusesAFamilyThatCannotMakeAPatternNamingOneThatCan()
    {
        // A Yoshimura pattern needs a vault; on a plane the generator refuses it.
        string dir = TestPaths.NewTempFolder();
        string job = Path.Combine(dir, "flat-yoshimura.json");
        File.WriteAllText(job, JobScaffold.Text("plane", "yoshimura"));
        var (code, _, err) = Run("validate", job);
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("needs a vault", err);
        Assert.Contains("the miura family suits this target", err);
    }
}
