using SkiaSharp;
using Tessel.Core.Jobs;
using Tessel.Core.Targets;

namespace Tessel.Output.IO;

/// <summary>Decodes an image file (PNG; any format the codec reads) into gray levels for a height map.
/// Colour images are reduced to luminance with the Rec. 709 weights (ITU-R BT.709); 16-bit images keep
/// their precision because pixels are read as 32-bit floats.</summary>
public static class HeightMapImage
{
    /// <summary>Largest image accepted, in pixels (e.g. 5000 x 5000).</summary>
    public const long MaxPixels = 25_000_000;

    /// <summary>Memory used per pixel while decoding: the float RGBA bitmap, its copy and the levels.</summary>
    private const long BytesPerPixel = 16 + 16 + 8;

    /// <summary>Matches <see cref="GrayImageDecoder"/>.</summary>
    /// <exception cref="JobError">The file is missing or not a readable image.</exception>
    public static GrayImage Decode(string path)
    {
        InputFile.RequireRegular(path, "target.image", "image file", InputFile.MaxImageBytes);
        using var codec = SKCodec.Create(path);
        if (codec is null) throw new JobError("target.image", $"not a readable image (expected a grayscale PNG): {path}");
        int w = codec.Info.Width, h = codec.Info.Height;
        // The header alone can declare billions of pixels; refuse before allocating anything for them.
        if (w < 1 || h < 1)
            throw new JobError("target.image", $"the image declares {w} x {h} pixels, so it holds no heights: {path}");
        if ((long)w * h > MaxPixels)
            throw new JobError("target.image", $"the image is {w} x {h} pixels ({(long)w * h / 1e6:0.#} megapixels) and would need about {(long)w * h * BytesPerPixel / 1e9:0.#} GB to read; height maps are limited to {MaxPixels / 1_000_000} megapixels, so scale it down: {path}");
        var levels = new double[w * h];
        // Float pixels keep 16-bit precision; codecs that cannot convert to float get 8-bit pixels.
        if (!TryRead(codec, path, SKColorType.RgbaF32, w, h, out var floats))
        {
            if (!TryRead(codec, path, SKColorType.Rgba8888, w, h, out floats))
                throw new JobError("target.image", $"cannot decode the image: {path}");
        }
        for (int i = 0; i < levels.Length; i++)
        {
            double l = 0.2126 * floats[4 * i] + 0.7152 * floats[4 * i + 1] + 0.0722 * floats[4 * i + 2];
            levels[i] = Math.Clamp(l, 0, 1);
        }
        return new GrayImage(w, h, levels);
    }

    /// <summary>Decodes into <paramref name="type"/> and returns RGBA channels as 0..1 floats.</summary>
    private static bool TryRead(SKCodec codec, string path, SKColorType type, int w, int h, out float[] rgba)
    {
        rgba = [];
        var info = new SKImageInfo(w, h, type, SKAlphaType.Unpremul);
        using var bitmap = new SKBitmap(info);
        var result = codec.GetPixels(info, bitmap.GetPixels());
        // Incomplete input means the file ends early: the missing rows would read as black (minHeight),
        // a silently wrong surface, so it is refused rather than decoded.
        if (result == SKCodecResult.IncompleteInput)
            throw new JobError("target.image", $"the image file is truncated (its pixel data ends early); export it again: {path}");
        if (result != SKCodecResult.Success) return false;
        rgba = new float[w * h * 4];
        if (type == SKColorType.RgbaF32)
        {
            System.Runtime.InteropServices.Marshal.Copy(bitmap.GetPixels(), rgba, 0, rgba.Length);
        }
        else
        {
            var bytes = new byte[w * h * 4];
            System.Runtime.InteropServices.Marshal.Copy(bitmap.GetPixels(), bytes, 0, bytes.Length);
            for (int i = 0; i < bytes.Length; i++) rgba[i] = bytes[i] / 255f;
        }
        return true;
    }
}
