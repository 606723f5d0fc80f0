using Tessel.Output.Report;

namespace Tessel.Tests.Report;

public class PreviewLookTests
{
    [Fact]
    public void WritesEveryPreviewToAFolder()
    {
        var dir = Environment.GetEnvironmentVariable("TESSEL_REPORT_LOOK_DIR") ?? Path.Combine(Path.GetTempPath(), "tessel-report-look");
        Directory.CreateDirectory(dir);
        var m = ReportDemoData.Build();
        File.WriteAllBytes(Path.Combine(dir, "model.png"), FoldedModelPreview.Render(m).Image.Png);
        File.WriteAllBytes(Path.Combine(dir, "pattern.png"), CreasePatternPreview.Render(m).Png);
        File.WriteAllBytes(Path.Combine(dir, "pareto.png"), ParetoPlot.Render(m.ParetoFront).Png);
        File.WriteAllBytes(Path.Combine(dir, "convergence.png"), ConvergencePlot.Render(m.Convergence).Png);
        File.WriteAllBytes(Path.Combine(dir, "sheet.png"), SheetThumbnail.Render(m.Sheets[0]).Png);
        File.WriteAllBytes(Path.Combine(dir, "single.png"), FoldedModelPreview.Render(DegenerateModelTests.OneFlatTriangle()).Image.Png);
        var written = ReportFiles.WriteAll(dir, m);
        Assert.All(written, p => Assert.True(new FileInfo(p).Length > 0, p));
    }
}
