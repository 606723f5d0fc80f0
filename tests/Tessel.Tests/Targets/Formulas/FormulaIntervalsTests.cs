using Tessel.Core.Jobs;
using Tessel.Core.Targets;
using Tessel.Core.Targets.Formulas;
using Tessel.Output.IO;

namespace Tessel.Tests.Targets.Formulas;

public class FormulaIntervalsTests
{
    private static (double X, double Y, FormulaTrouble T)? Trouble(string formula, double w = 4, double d = 3) =>
        FormulaIntervals.FirstTrouble(FormulaParser.Parse(formula), -w / 2, w / 2, -d / 2, d / 2, (_, _) => true);

    [Theory]
    // Poles the 41 x 41 samples of a 4 m wide footprint (every 0.1 m) step over.
    [InlineData("1/(x-0.123456789)", 0.123456789)]
    [InlineData("tan(x)", -Math.PI / 2)]
    [InlineData("log((x - 0.0321)^2 + 0.5*y^2)", 0.0321)]
    // Two poles at x = +-sqrt(0.7777); the search reports the one it meets first, the lower.
    [InlineData("x/(x*x - 0.7777)", -0.88187300)]
    public void PolesBetweenSamplesAreFoundWhereTheyAre(string formula, double x)
    {
        var t = Trouble(formula);
        Assert.NotNull(t);
        Assert.Equal(FormulaTrouble.Pole, t.Value.T);
        Assert.Equal(x, t.Value.X, 5);
    }

    [Theory]
    [InlineData("abs(x - 0.333) + y", 0.333)]
    [InlineData("sqrt((x - 0.71)^2 + y^2)", 0.71)]
    public void KinksAreFound(string formula, double x)
    {
        var t = Trouble(formula);
        Assert.NotNull(t);
        Assert.Equal(FormulaTrouble.Kink, t.Value.T);
        Assert.Equal(x, t.Value.X, 5);
    }

    [Theory]
    [InlineData("0.1*(x^2 - y^2)")]
    [InlineData("sqrt(9 + x^2 + y^2) - log(3 + x) + atan(y/2)")]
    [InlineData("tan(x/4) + asin(y/4) + acos(x/5)/(2 + y)")]
    [InlineData("1/(2 + sin(3*x)*cos(2*y))")]
    [InlineData("x*x/(1 + y*y) + exp(-x^2)")]
    public void SmoothFormulasAreProvenClean(string formula) => Assert.Null(Trouble(formula));

    [Fact]
    public void APoleOutsideAPolygonFootprintIsNotReported()
    {
        // Triangle with corners (0,0), (4,0), (0,3): x + y <= 4 on it, so the pole line x + y = 5
        // misses the triangle but crosses its bounding box (at (4, 1), for one).
        var tree = FormulaParser.Parse("1/(x + y - 5)");
        bool InTriangle(double x, double y) => x >= 0 && y >= 0 && x / 4 + y / 3 <= 1;
        Assert.Null(FormulaIntervals.FirstTrouble(tree, 0, 4, 0, 3, InTriangle));
        Assert.NotNull(FormulaIntervals.FirstTrouble(tree, 0, 4, 0, 3, (_, _) => true));
    }

    [Fact]
    public void TheTargetNamesThePoleInTheJobsUnits()
    {
        var job = JobLoader.Parse("""{ "target": { "kind": "formula", "units": "cm", "formula": "100/(x - 12.3456789)", "footprint": { "width": 400, "depth": 300 } } }""",
            "pole.json", Path.GetTempPath());
        var e = Assert.Throws<JobError>(() => TargetFactory.Build(job.Target, job.BaseDirectory, HeightMapImage.Decode));
        Assert.Equal("target.formula", e.Where);
        var m = System.Text.RegularExpressions.Regex.Match(e.Problem,
            @"^the height is undefined or infinite between the sample points .* at x = (?<x>[-0-9.]+), y = [-0-9.]+ cm inside the footprint; change the formula or shrink the footprint$");
        Assert.True(m.Success, e.Problem);
        // Located to the search's smallest box, 1e-7 of the 400 cm footprint.
        Assert.Equal(12.3456789, double.Parse(m.Groups["x"].Value, System.Globalization.CultureInfo.InvariantCulture), 4);
    }
}
