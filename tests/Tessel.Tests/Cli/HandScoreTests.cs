using SkiaSharp;
using Tessel.Cli;

namespace Tessel.Tests.Cli;

/// <summary>The hand-score fold method: both fold directions on the front sheet, printed at a weight that
/// reads on paper, while the files for a cutter keep their hairlines.</summary>
public class HandScoreTests
{
    private static string Build(string method)
    {
        // An invented job: a 3 x 2 m barrel-roofed allotment shed at 1:20 on A4 card.
        string dir = TestPaths.NewTempFolder();
        string job = Path.Combine(dir, "shed.json");
        File.WriteAllText(job, $$"""
            { "name": "allotment-shed", "target": { "kind": "cylinder", "radius": 4, "rise": 2.5, "footprint": { "width": 3, "depth": 2 } },
              "tessellation": { "family": "miura", "cellsX": 6, "cellsY": 5 },
              "fabrication": { "scale": 20, "sheet": { "name": "A4" }, "foldMethod": { "mountain": "{{method}}", "valley": "{{method}}" } },
              "outputs": { "obj": false, "report": false, "pdf": false } }
            """);
        var o = new StringWriter();
        var e = new StringWriter();
        int code = Program.Run(["build", job, "--quiet", "--out", Path.Combine(dir, "out")], o, e);
        Assert.True(code == ExitCodes.Ok, e.ToString());
        return Path.Combine(dir, "out", "sheets");
    }

    private static long InkedPixels(string png)
    {
        using var bitmap = SKBitmap.Decode(png);
        long n = 0;
        for (int y = 0; y < bitmap.Height; y++)
            for (int x = 0; x < bitmap.Width; x++)
            {
                var c = bitmap.GetPixel(x, y);
                if (c.Alpha > 0 && (c.Red + c.Green + c.Blue) / 3 < 200) n++;
            }
        return n;
    }

    [Fact]
    public void HandScorePrintsBothFoldsOnTheFrontAtAPrintWeightAndKeepsHairlinesForTheCutter()
    {
        string hand = Build("hand-score");
        string laser = Build("score");
        // One job per sheet: nothing on a back job.
        Assert.False(File.Exists(Path.Combine(hand, "sheet-01-back.svg")));
        // The SVG is for a cutter: hairlines only.
        string svg = File.ReadAllText(Path.Combine(hand, "sheet-01.svg"));
        Assert.Contains("stroke-width=\"0.05\"", svg);
        Assert.DoesNotContain("stroke-width=\"0.35\"", svg);
        Assert.Contains("TS-CREASE-MTN", svg);
        Assert.Contains("TS-CREASE-VLY", svg);
        // The PNG is for a printer: 0.35 mm lines against hairlines drawn one pixel wide (300 dpi,
        // 0.085 mm), so well over twice the ink for the same drawing.
        long thick = InkedPixels(Path.Combine(hand, "sheet-01.png"));
        long thin = InkedPixels(Path.Combine(laser, "sheet-01.png"));
        Assert.True(thick > 2.5 * thin, $"hand-score print has {thick} inked pixels, the laser sheet {thin}");
    }
}
