using SkiaSharp;

namespace Tessel.Output.Report;

/// <summary>Diverging colours for signed distance to the target: cool below, warm above, a pale neutral
/// at zero, so that "on target" reads as paper and both error directions stand out.</summary>
/// <remarks>The neutral sits at zero deviation whatever the data range; the scale runs to the larger
/// magnitude of the two limits so equal distances above and below get equally strong colours.</remarks>
public static class DeviationPalette
{
    // Stops at t = -1, -0.5, 0, 0.5, 1 (t = deviation / largest magnitude). Chosen for this project.
    private static readonly (byte R, byte G, byte B)[] Stops =
    [
        (31, 76, 122),
        (92, 150, 178),
        (238, 234, 222),
        (222, 150, 84),
        (150, 44, 36),
    ];

    /// <summary>The scale never runs to less than this (metres at full scale): a model that lies on its target
    /// (a closed-form vault) has deviations of round-off size, which a scale fitted to them would colour
    /// as strongly as centimetres. A micrometre is far below anything a model shows and far above round-off.</summary>
    public const double SmallestSpanM = 1e-6;

    /// <summary>Colour of a deviation given the colour bar limits, metres at full scale.</summary>
    public static SKColor Colour(double deviation, double min, double max)
    {
        double span = Math.Max(Math.Max(Math.Abs(min), Math.Abs(max)), SmallestSpanM);
        return AtSigned(Math.Clamp(deviation / span, -1, 1));
    }

    /// <summary>Colour at t in [-1, 1]: -1 most below, 0 on target, 1 most above.</summary>
    public static SKColor AtSigned(double t)
    {
        double u = (Math.Clamp(t, -1, 1) + 1) * 2; // 0..4 across the four intervals
        int k = Math.Min(3, (int)Math.Floor(u));
        double f = u - k;
        var a = Stops[k]; var b = Stops[k + 1];
        return new SKColor(Mix(a.R, b.R, f), Mix(a.G, b.G, f), Mix(a.B, b.B, f));
    }

    /// <summary>The stops as CSS hex colours, for the HTML viewer to use the same scale.</summary>
    public static string[] CssStops() => Stops.Select(s => $"#{s.R:x2}{s.G:x2}{s.B:x2}").ToArray();

    private static byte Mix(byte a, byte b, double f) => (byte)Math.Round(a + (b - a) * f);
}
