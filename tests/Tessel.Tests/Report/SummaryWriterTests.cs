using Tessel.Output.Report;

namespace Tessel.Tests.Report;

public class SummaryWriterTests
{
    [Theory]
    [InlineData(14.0, "+14.0")]
    [InlineData(-8.5612, "-8.56")]
    [InlineData(0.27912, "+0.279")]
    [InlineData(-0.04321, "-0.0432")]
    [InlineData(123.4, "+123")]
    [InlineData(0, "0")]
    [InlineData(-0.00001, "0")]
    public void MillimetresGetASignAndDecimalsByMagnitude(double mm, string text) => Assert.Equal(text, DeviationFormat.SignedMm(mm));

    [Fact]
    public void MarkdownHasTheTableTheLimitsAndEscapedText()
    {
        var m = ReportDemoData.Build() with { Summary = [new("pipe | label", "1")] };
        string md = MarkdownSummaryWriter.Render(m);
        double min = m.VertexDeviationM.Min(), max = m.VertexDeviationM.Max();
        Assert.StartsWith("# Larkfield Yard shade trial\n\n", md);
        Assert.Contains($"| distance to target, full scale | {DeviationFormat.SignedMm(min * 1000)} to {DeviationFormat.SignedMm(max * 1000)} mm |", md);
        Assert.Contains($"| distance to target, model 1:50 | {DeviationFormat.SignedMm(min * 20)} to {DeviationFormat.SignedMm(max * 20)} mm |", md);
        Assert.Contains("| pipe \\| label | 1 |", md);
        Assert.Contains("&lt;/script&gt;", md);
        Assert.DoesNotContain("<test>", md);
        Assert.Contains("| 1 | 8.10 | yes |", md);
        Assert.Contains("- Never laser-cut PVC or vinyl.", md);
        Assert.EndsWith(".\n", md);
        Assert.Equal(md, MarkdownSummaryWriter.Render(m));
    }

    [Fact]
    public void AFitOfSeveralSolverRunsIsNumberedInTheOrderItRanAndSummarisedAtItsLastStep()
    {
        // A continuation: a first run that ends far from buildable, then a stage that lands. Each run
        // numbers its own steps from 0, so the highest number (4) belongs to the first run.
        Tessel.Core.Fitting.FitIteration Step(int index, double residual) =>
            new(index, "stage", 1.0 / (index + 1), 0, 0, residual, 0, 0, 0, true, 0);
        var history = new[] { Step(0, 0.3), Step(1, 0.2), Step(2, 0.1), Step(3, 0.05), Step(4, 0.027), Step(0, 1e-3), Step(1, 5.8e-15) };
        var steps = Tessel.Output.Build.ReportAssembly.ConvergenceSteps(history);
        Assert.Equal(Enumerable.Range(0, 7), steps.Select(s => s.Iteration));
        Assert.Equal([5], steps.Select((s, i) => (s, i)).Where(p => p.s.StartsRun).Select(p => p.i));
        string md = MarkdownSummaryWriter.Render(ReportDemoData.Build() with { Convergence = steps });
        Assert.Contains("Solver: 7 steps recorded in 2 runs (stages, refits or restarts); at the last, step 6, the objective was 5e-1 and the largest residual 5.8e-15.", md);
    }

    [Fact]
    public void TerminalLinesAreAlignedInOneColumn()
    {
        var m = ReportDemoData.Build();
        var lines = TerminalSummary.Format(m).Split('\n');
        Assert.Equal("Larkfield Yard shade trial", lines[0]);
        // Rows: 4 summary rows, 2 distance lines, the warning count, then 1 warning and the caution.
        Assert.Equal(1 + 4 + 2 + 1 + 1 + 1, lines.Length);
        int longest = "max deviation (full scale)".Length;
        for (int i = 1; i < 8; i++)
        {
            Assert.StartsWith("  ", lines[i]);
            Assert.Equal(' ', lines[i][2 + longest]);
            Assert.NotEqual(' ', lines[i][2 + longest + 2]);
        }
        Assert.Contains("mm on the model at 1:50", lines[6]);
        Assert.StartsWith("  ! 2 vertices", lines[8]);
        // The caution is one line and defers to the workshop's own rules (docs/reference/fabrication.md, Safety).
        Assert.Equal("  " + Tessel.Core.Sheets.SheetAnnotations.CautionLine, lines[9]);
        foreach (string must in new[] { "workshop's rules", "machine maker's instructions", "training", "polypropylene", "adhesives", "PVC" })
            Assert.Contains(must, lines[9]);
    }
}
