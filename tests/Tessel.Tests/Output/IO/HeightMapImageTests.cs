using SkiaSharp;
using Tessel.Core.Jobs;
using Tessel.Core.Targets;
using Tessel.Output.IO;

namespace Tessel.Tests.Output.IO;

public class HeightMapImageTests
{
    internal static string WriteGrayPng(string folder, string name, byte[,] levels)
    {
        int h = levels.GetLength(0), w = levels.GetLength(1);
        using var bmp = new SKBitmap(new SKImageInfo(w, h, SKColorType.Rgba8888, SKAlphaType.Opaque));
        for (int r = 0; r < h; r++)
            for (int c = 0; c < w; c++)
                bmp.SetPixel(c, r, new SKColor(levels[r, c], levels[r, c], levels[r, c]));
        string path = Path.Combine(folder, name);
        using var data = bmp.Encode(SKEncodedImageFormat.Png, 100);
        File.WriteAllBytes(path, data.ToArray());
        return path;
    }

    [Fact]
    public void DecodesGrayLevelsRowByRow()
    {
        string dir = TestPaths.NewTempFolder();
        string path = WriteGrayPng(dir, "g.png", new byte[,] { { 0, 255, 51 }, { 102, 204, 0 } });
        var img = HeightMapImage.Decode(path);
        Assert.Equal(3, img.Width);
        Assert.Equal(2, img.Height);
        // 8-bit levels are k/255; Rec. 709 luma weights sum to 1 so gray pixels keep their level.
        double[] expected = [0, 1, 0.2, 0.4, 0.8, 0];
        for (int i = 0; i < 6; i++) Assert.Equal(expected[i], img.Levels[i], 5);
    }

    [Fact]
    public void HeightMapTargetHitsSampleHeightsAtPixelCentres()
    {
        string dir = TestPaths.NewTempFolder();
        WriteGrayPng(dir, "site.png", new byte[,] { { 0, 255, 0 }, { 255, 0, 255 }, { 0, 255, 0 } });
        var job = JobLoader.Parse("""{ "target": { "kind": "height-map", "image": "site.png", "imageWidth": 3, "imageDepth": 3, "minHeight": 1, "maxHeight": 2 } }""", "j.json", dir);
        var s = TargetFactory.Build(job.Target, dir, HeightMapImage.Decode);
        Assert.Equal(2, s.HeightAt(0, 1), 5);   // top row, middle pixel: white
        Assert.Equal(1, s.HeightAt(0, 0), 5);   // centre pixel: black
        Assert.Equal(2, s.HeightAt(-1, 0), 5);  // middle row, left pixel: white
    }

    [Fact]
    public void NonImageIsAClearError()
    {
        string dir = TestPaths.NewTempFolder();
        string path = Path.Combine(dir, "x.png");
        File.WriteAllBytes(path, [1, 2, 3, 4]);
        var e = Assert.Throws<JobError>(() => HeightMapImage.Decode(path));
        Assert.Equal("target.image", e.Where);
    }
}
