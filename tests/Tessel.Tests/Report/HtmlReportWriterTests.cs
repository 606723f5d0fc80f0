using System.Text.Json;
using System.Text.RegularExpressions;
using Tessel.Output.Report;

namespace Tessel.Tests.Report;

public class HtmlReportWriterTests
{
    [Fact]
    public void PageIsSelfContainedAndEscapesJobText()
    {
        var m = ReportDemoData.Build();
        string html = HtmlReportWriter.Render(m);
        Assert.DoesNotContain("://", html); // no links to fetch: offline by construction
        Assert.DoesNotContain("<link", html);
        Assert.DoesNotContain("<script src", html);
        Assert.Contains("&lt;test&gt; &amp; &quot;quotes&quot; &lt;/script&gt; kept as text", html);
        Assert.Single(Regex.Matches(html, "</script>\\s*<script>").Cast<Match>()); // data block, then viewer
        // Four figures and one sheet thumbnail inline as PNG.
        Assert.Equal(5, Regex.Matches(html, "src=\"data:image/png;base64,iVBOR").Count);
        Assert.Contains("<pre id=\"selftest\"></pre>", html);
        Assert.Equal(html, HtmlReportWriter.Render(ReportDemoData.Build()));
    }

    [Fact]
    public void ViewerDataCarriesTheModelAndTheBarLimits()
    {
        var m = ReportDemoData.Build();
        string html = HtmlReportWriter.Render(m);
        var match = Regex.Match(html, "<script type=\"application/json\" id=\"tessel-viewer-data\">(.*?)</script>", RegexOptions.Singleline);
        Assert.True(match.Success);
        Assert.DoesNotContain("</", match.Groups[1].Value);
        using var doc = JsonDocument.Parse(match.Groups[1].Value);
        var r = doc.RootElement;
        Assert.Equal(m.FoldedPositions.Length, r.GetProperty("folded").GetArrayLength());
        Assert.Equal(3 * m.EdgeRoles.Length, r.GetProperty("edges").GetArrayLength());
        Assert.Equal(m.Faces.Length, r.GetProperty("faces").GetArrayLength());
        Assert.Equal(6, r.GetProperty("keyframes").GetArrayLength());
        Assert.Equal(m.VertexDeviationM.Min(), r.GetProperty("barMin").GetDouble());
        Assert.Equal(m.VertexDeviationM.Max(), r.GetProperty("barMax").GetDouble());
        Assert.Equal("Larkfield Yard shade trial", r.GetProperty("name").GetString());
        // Positions rounded to 10 micrometres.
        Assert.Equal(m.FoldedPositions[4], r.GetProperty("folded")[4].GetDouble(), 5);
        var lastFrame = r.GetProperty("keyframes")[5];
        Assert.Equal(1.0, lastFrame.GetProperty("p").GetDouble());
    }

    [Fact]
    public void WriteAllPutsEveryFileInTheFolder()
    {
        string dir = Path.Combine(Path.GetTempPath(), "tessel-report-" + Guid.NewGuid().ToString("N"));
        try
        {
            var paths = ReportFiles.WriteAll(dir, ReportDemoData.Build());
            Assert.Equal(ReportFiles.Names.Length, paths.Length);
            Assert.All(paths, p => Assert.True(new FileInfo(p).Length > 100, p));
            Assert.Empty(Directory.GetFiles(dir, "*.tmp"));
            Assert.Empty(Directory.GetFiles(dir, ".*"));
        }
        finally { if (Directory.Exists(dir)) Directory.Delete(dir, true); }
    }

    [Fact]
    public void MismatchedArraysAreRejectedWithTheirName()
    {
        var m = ReportDemoData.Build() with { VertexDeviationM = [0.0, 1.0] };
        var ex = Assert.Throws<ArgumentException>(() => HtmlReportWriter.Render(m));
        Assert.Contains("deviation", ex.Message);
    }
}
