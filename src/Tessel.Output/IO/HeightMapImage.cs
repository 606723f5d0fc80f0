using SkiaSharp;
using Tessel.Core.Jobs;
using Tessel.Core.Targets;

namespace Tessel.Output.IO;

/// <summary>Decodes an image file (PNG; any format the codec reads) into gray levels for a height map.
/// Colour images are reduced to luminance with the Rec. 709 weights (ITU-R BT.709); 16-bit images keep
/// their precision because pixels are read as 32-bit floats.</summary>
public static class HeightMapImage
{
    /// <summary>Matches <see cref="GrayImageDecoder"/>.</summary>
    /// <exception cref="JobError">The file is missing or not a readable image.</exception>
    public static GrayImage Decode(string path)
    {
        if (!File.Exists(path)) throw new JobError("target.image", $"image file not found: {path}");
        using var codec = SKCodec.Create(path);
        if (codec is null) throw new JobError("target.image", $"not a readable image (expected a grayscale PNG): {path}");
        int w = codec.Info.Width, h = codec.Info.Height;
        var info = new SKImageInfo(w, h, SKColorType.RgbaF32, SKAlphaType.Unpremul);
        using var bitmap = new SKBitmap(info);
        var result = codec.GetPixels(info, bitmap.GetPixels());
        if (result is not (SKCodecResult.Success or SKCodecResult.IncompleteInput))
            throw new JobError("target.image", $"cannot decode the image ({result}): {path}");
        var floats = new float[w * h * 4];
        System.Runtime.InteropServices.Marshal.Copy(bitmap.GetPixels(), floats, 0, floats.Length);
        var levels = new double[w * h];
        for (int i = 0; i < levels.Length; i++)
        {
            double l = 0.2126 * floats[4 * i] + 0.7152 * floats[4 * i + 1] + 0.0722 * floats[4 * i + 2];
            levels[i] = Math.Clamp(l, 0, 1);
        }
        return new GrayImage(w, h, levels);
    }
}
