using System.Globalization;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Unfolding;

namespace Tessel.Core.Sheets;

/// <summary>The scale chosen for <c>"scale": "auto"</c> and why, in one sentence for the summary.</summary>
/// <param name="Denominator">n of the chosen scale 1:n.</param>
/// <param name="Sheets">Sheets the layout takes at that scale.</param>
/// <param name="NarrowestFacetMm">Narrowest facet at that scale, mm.</param>
/// <param name="Reason">Why this scale: what the next larger scale fails on, and what this one meets.</param>
public sealed record ScaleChoice(double Denominator, int Sheets, double NarrowestFacetMm, string Reason);

/// <summary>Chooses the largest common architectural scale at which every facet is at least ten times the
/// material's thickness and the parts fit a given number of sheets.</summary>
/// <remarks>A larger scale (smaller n) makes facets wider but needs more paper, so the facet rule bounds n
/// from above and the sheet count from below. The scales are tried from the largest down; each one is
/// first checked against the total facet area (a scale whose facets alone cover more than the usable
/// area of the allowed sheets cannot fit) and then laid out for real.</remarks>
public static class ScaleChooser
{
    /// <summary>Common architectural model scales, n of 1:n (common practice, no source).</summary>
    public static IReadOnlyList<double> CommonScales { get; } = [1, 2, 5, 10, 20, 25, 50, 100, 200, 500];

    /// <summary>Facets narrower than this many material thicknesses are too narrow to fold cleanly
    /// (docs/reference/fabrication.md: warn below 10 t; value from memory).</summary>
    public const double MinFacetThicknesses = 10;

    /// <param name="flat">The flat pattern, metres at full scale.</param>
    /// <param name="settingsAt">Fabrication settings (sheet, margins, strip, material) at scale 1:n.</param>
    /// <param name="maxSheets">Most sheets the parts may take.</param>
    /// <param name="lay">The layout to try (the sheet stage's); returns the number of sheets.</param>
    public static ScaleChoice Choose(FlatPattern flat, Func<double, FabricationSettings> settingsAt, int maxSheets,
        Func<FlatPattern, FabricationSettings, int> lay)
    {
        var anySettings = settingsAt(CommonScales[0]);
        double thickness = anySettings.Material.ThicknessMm;
        double minFacetMm = MinFacetThicknesses * thickness;
        double narrowestM = NarrowestFacetMetres(flat);
        double areaM2 = FacetAreaSquareMetres(flat);
        // The facet rule: narrowest * 1000 / n >= 10 t.
        double largestN = narrowestM * 1000 / minFacetMm;

        string? firstFailure = null;
        foreach (double n in CommonScales)
        {
            var settings = settingsAt(n);
            double k = 1000 / n;
            double usable = (settings.Sheet.WidthMm - 2 * settings.MarginMm)
                * (settings.Sheet.HeightMm - 2 * settings.MarginMm - (settings.AnnotationStripMm > 0 ? settings.AnnotationStripMm + settings.SpacingMm : 0));
            int sheets;
            if (areaM2 * k * k > maxSheets * usable) sheets = int.MaxValue;
            else
            {
                // A scale whose layout fails for any reason (a facet larger than the sheet, a polygon
                // operation that gives up on a crowded split) is one that cannot be used: try the next.
                try { sheets = lay(flat, settings); }
                catch (Exception e) when (e is not (OutOfMemoryException or OperationCanceledException)) { sheets = int.MaxValue; }
            }
            if (sheets > maxSheets)
            {
                firstFailure = sheets == int.MaxValue
                    ? $"at 1:{Format(n)} the parts would not fit {maxSheets} sheet{(maxSheets == 1 ? "" : "s")} (fabrication.maxSheets)"
                    : $"at 1:{Format(n)} the parts take {sheets} sheets, more than the {maxSheets} allowed (fabrication.maxSheets)";
                continue;
            }
            double facetMm = narrowestM * k;
            string fits = $"the parts fit {sheets} of {maxSheets} {settings.Sheet.Name} sheet{(maxSheets == 1 ? "" : "s")}";
            string larger = firstFailure is null ? "it is the largest common scale" : firstFailure;
            if (n <= largestN * (1 + 1e-12))
                return new ScaleChoice(n, sheets, facetMm,
                    $"1:{Format(n)}: {fits} and the narrowest facet is {Format(facetMm)} mm, at least 10 x the {Format(thickness)} mm {settings.Material.Name} ({Format(minFacetMm)} mm); {larger}");
            return new ScaleChoice(n, sheets, facetMm,
                $"1:{Format(n)}: {fits}, but no common scale gives facets of 10 x the {Format(thickness)} mm {settings.Material.Name} ({Format(minFacetMm)} mm) on {maxSheets} sheet{(maxSheets == 1 ? "" : "s")}: the narrowest facet is {Format(facetMm)} mm here; {larger}. Allow more sheets (fabrication.maxSheets), a larger sheet, or fewer cells");
        }
        throw new Jobs.JobError("fabrication.scale",
            $"\"auto\" found no common scale down to 1:{Format(CommonScales[^1])} at which the parts fit {maxSheets} sheet{(maxSheets == 1 ? "" : "s")}; raise fabrication.maxSheets, choose a larger sheet, or give a scale");
    }

    /// <summary>Narrowest facet of the flat pattern, metres (the smallest width over facets: the least,
    /// over a facet's edges, of the farthest vertex from that edge's line).</summary>
    public static double NarrowestFacetMetres(FlatPattern flat) =>
        flat.Folded.Faces.Min(f => SheetLayout.MinimumWidth(f.Select(flat.Vertex).ToArray()));

    private static double FacetAreaSquareMetres(FlatPattern flat) =>
        flat.Folded.Faces.Sum(f =>
        {
            double a = 0;
            for (int i = 0; i < f.Length; i++) a += Vec2.Cross(flat.Vertex(f[i]), flat.Vertex(f[(i + 1) % f.Length]));
            return Math.Abs(a) / 2;
        });

    private static string Format(double v) => v.ToString("0.##", CultureInfo.InvariantCulture);
}
