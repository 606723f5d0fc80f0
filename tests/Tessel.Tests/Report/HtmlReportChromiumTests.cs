using System.Net;
using System.Text.Json;
using System.Text.RegularExpressions;
using Tessel.Output.Report;

namespace Tessel.Tests.Report;

public class HtmlReportChromiumTests
{
    [Fact]
    public void SelfTestInHeadlessChromiumDrawsAndTheSliderChangesTheDrawing()
    {
        var chromium = HeadlessChromium.Find();
        Assert.True(chromium != null, HeadlessChromium.Missing);

        string dir = Path.Combine(Path.GetTempPath(), "tessel-html-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        try
        {
            string page = Path.Combine(dir, "report.html");
            HtmlReportWriter.WriteFile(page, ReportDemoData.Build());
            string dom = HeadlessChromium.Run(chromium!,
                ["--virtual-time-budget=5000", "--dump-dom", new Uri(page).AbsoluteUri + "#selftest"], TimeSpan.FromSeconds(60));

            var match = Regex.Match(dom, "<pre id=\"selftest\">(.*?)</pre>", RegexOptions.Singleline);
            Assert.True(match.Success, "no <pre id=\"selftest\"> in the dumped page");
            Assert.False(string.IsNullOrWhiteSpace(match.Groups[1].Value), "the self-test wrote nothing (the page's script did not run)");
            using var result = JsonDocument.Parse(WebUtility.HtmlDecode(match.Groups[1].Value));
            var r = result.RootElement;

            Assert.Equal(0, r.GetProperty("errors").GetArrayLength());
            Assert.True(r.GetProperty("ran").GetBoolean());
            // The viewer canvas is 720 x 480; the folded demo sheet covers a good share of it.
            Assert.Equal(720 * 480, r.GetProperty("pixels").GetInt32());
            Assert.True(r.GetProperty("nonBackgroundBefore").GetInt32() > 720 * 480 / 20, r.ToString());
            Assert.True(r.GetProperty("nonBackgroundAfter").GetInt32() > 720 * 480 / 20, r.ToString());
            Assert.NotEqual(r.GetProperty("checksumBefore").GetUInt32(), r.GetProperty("checksumAfter").GetUInt32());
            Assert.True(r.GetProperty("drew").GetBoolean());
            Assert.True(r.GetProperty("changed").GetBoolean());
            Assert.Equal(0.35, r.GetProperty("progressAfter").GetDouble(), 9);
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }
}
