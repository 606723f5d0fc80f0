using Tessel.Core.Pipeline;

namespace Tessel.Tests.Pipeline;

public class ProgressReporterTests
{
    [Fact]
    public void LinesCarryTheStageAndSilentSaysNothing()
    {
        var w = new StringWriter();
        var p = new ProgressReporter(w);
        p.Stage("fitting", "start 1 of 4");
        p.Step("residual 1e-3");
        for (int i = 1; i <= 100; i++) p.Fraction("iteration", i, 100);
        var lines = w.ToString().TrimEnd().Split('\n');
        Assert.Equal("[fitting] start 1 of 4", lines[0].TrimEnd('\r'));
        Assert.Equal("[fitting]   residual 1e-3", lines[1].TrimEnd('\r'));
        Assert.Equal(12, lines.Length); // ten progress lines for a hundred steps
        ProgressReporter.Silent.Stage("x", "y");
        Assert.False(ProgressReporter.Silent.IsVerbose);
    }
}
