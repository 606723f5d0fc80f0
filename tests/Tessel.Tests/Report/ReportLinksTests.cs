using Tessel.Core.Jobs;
using Tessel.Core.Pipeline;
using Tessel.Output.Build;
using Tessel.Output.Report;

namespace Tessel.Tests.Report;

/// <summary>The report shows only what the build computed and links every file it wrote.</summary>
public class ReportLinksTests
{
    [Fact]
    public void PlotsOfWhatWasNotComputedAreLeftOut()
    {
        var m = ReportDemoData.Build() with { ParetoFront = [], Convergence = [] };
        var names = ReportFiles.Contents(m).Select(c => c.Name).ToArray();
        Assert.DoesNotContain("preview-tradeoff.png", names);
        Assert.DoesNotContain("preview-convergence.png", names);
        Assert.Contains("preview-model.png", names);
        string html = HtmlReportWriter.Render(m);
        Assert.DoesNotContain("Shape error against the developability tolerance", html);
        Assert.DoesNotContain("Solver convergence", html);
    }

    [Fact]
    public void EveryFileOfABuildIsLinkedFromTheReport()
    {
        // An invented job: a 2 m x 1.5 m cylinder-roofed bicycle shelter, small enough to build in seconds.
        var job = JobLoader.Parse("""
            { "name": "bike-shelter", "target": { "kind": "cylinder", "radius": 3, "rise": 2.2, "footprint": { "width": 2, "depth": 1.5 } },
              "tessellation": { "family": "miura", "cellsX": 3, "cellsY": 3 }, "fabrication": { "scale": 20 } }
            """, "bike.json", Path.GetTempPath());
        string dir = TestPaths.NewTempFolder();
        var result = BuildRunner.Run(job, dir, ProgressReporter.Silent);
        Assert.Null(result.Problem);
        string html = File.ReadAllText(Path.Combine(dir, "report.html"));
        foreach (var (path, _) in result.Files)
            Assert.Contains($"<a href=\"{path}\">", html);
        Assert.Contains("sheets/sheet-01.svg", result.Files.Select(f => f.Path));
        // No sweep in this job: no trade-off plot, in the page or as a file.
        Assert.DoesNotContain("preview-tradeoff.png", result.Files.Select(f => f.Path));
    }
}
