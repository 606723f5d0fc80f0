using SkiaSharp;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Output.Report;

/// <summary>How the report draws each crease role: colour, width and dash pattern (Tessel's own
/// choice; the fabrication sheets have their own line conventions).</summary>
public static class CreaseStyle
{
    /// <summary>Mountain folds: solid rust.</summary>
    public static readonly SKColor Mountain = new(178, 58, 38);
    /// <summary>Valley folds: dashed deep blue.</summary>
    public static readonly SKColor Valley = new(28, 88, 150);
    /// <summary>Sheet outline: solid near-black.</summary>
    public static readonly SKColor Boundary = new(34, 34, 38);
    /// <summary>Edges that stay flat: dotted grey.</summary>
    public static readonly SKColor Flat = new(160, 160, 160);

    // Shared, never disposed: a paint does not own its path effect, and these live for the process.
    private static readonly SKPathEffect ValleyDash = SKPathEffect.CreateDash([9, 4], 0);
    private static readonly SKPathEffect FlatDots = SKPathEffect.CreateDash([2, 3], 0);

    /// <summary>A stroke paint for a role (the caller disposes it).</summary>
    public static SKPaint Paint(CreaseRole role)
    {
        var p = role switch
        {
            CreaseRole.Mountain => PreviewCanvas.Stroke(Mountain, 1.8f),
            CreaseRole.Valley => PreviewCanvas.Stroke(Valley, 1.8f),
            CreaseRole.Boundary => PreviewCanvas.Stroke(Boundary, 2.2f),
            _ => PreviewCanvas.Stroke(Flat, 1f),
        };
        if (role == CreaseRole.Valley) p.PathEffect = ValleyDash;
        if (role == CreaseRole.Flat) p.PathEffect = FlatDots;
        return p;
    }

    /// <summary>CSS colour of a role, for the HTML viewer.</summary>
    public static string Css(CreaseRole role)
    {
        var c = role switch
        {
            CreaseRole.Mountain => Mountain,
            CreaseRole.Valley => Valley,
            CreaseRole.Boundary => Boundary,
            _ => Flat,
        };
        return $"#{c.Red:x2}{c.Green:x2}{c.Blue:x2}";
    }
}
