using SkiaSharp;

namespace Tessel.Output.Previews;

/// <summary>Tessel's own colour ramp for heights: slate blue (low) through teal, sage and sand to
/// coral (high). Piecewise linear in sRGB between five stops.</summary>
public static class HeightPalette
{
    private static readonly (byte R, byte G, byte B)[] Stops =
    [
        (0x23, 0x39, 0x5b), (0x3d, 0x7c, 0x84), (0x9b, 0xbf, 0x8a), (0xf2, 0xd4, 0x92), (0xd1, 0x60, 0x3d),
    ];

    /// <summary>Colour for a share t in [0, 1] of the height range (clamped).</summary>
    public static SKColor At(double t)
    {
        t = Math.Clamp(double.IsFinite(t) ? t : 0, 0, 1) * (Stops.Length - 1);
        int i = Math.Min((int)t, Stops.Length - 2);
        double f = t - i;
        var a = Stops[i]; var b = Stops[i + 1];
        return new SKColor(Mix(a.R, b.R, f), Mix(a.G, b.G, f), Mix(a.B, b.B, f));
    }

    private static byte Mix(byte a, byte b, double f) => (byte)Math.Round(a + (b - a) * f);
}
