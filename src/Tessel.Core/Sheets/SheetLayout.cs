using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>The sheet stage: scales a flat pattern to the model, splits it into parts that fit the sheet,
/// adds glue tabs, nests the parts onto sheets and writes the line work in cutting order.</summary>
/// <remarks>Each step is its own type in this folder, in the order <see cref="Lay(FlatPattern, FabricationSettings)"/>
/// runs them: <see cref="SheetArea"/> (room on a sheet), <see cref="ModelScalePattern"/> and
/// <see cref="LayoutOverlap"/> (the pattern at model scale, refused if it overlaps itself),
/// <see cref="LayoutParts"/> (split), <see cref="SeamTabs"/> (seams and tabs), <see cref="PartOutlines"/>
/// (outlines with kerf), <see cref="PartPacking"/> (turning and nesting), <see cref="LineWork"/> (lines and
/// labels), <see cref="SheetAssembly"/> (line order per sheet) and <see cref="LayoutFigures"/> (checks and
/// figures). Warnings keep that order.</remarks>
public static class SheetLayout
{
    /// <summary>Least gap, mm, between a glue tab and any other edge or tab of its part once the outline is cut:
    /// room for the blade or beam to separate them, so a seam is cut over its full length (value from memory).
    /// The kerf is added on top, since the outline grows by half a kerf on either side of the gap.</summary>
    public const double TabClearanceMm = 0.5;

    /// <summary>Labels smaller than this (cap height, mm) are warned about as hard to read.</summary>
    public const double MinimumLegibleLabelMm = 1.2;

    /// <summary>Lays out <paramref name="pattern"/> (metres, full scale) on sheets.</summary>
    /// <exception cref="ArgumentException">When the margins and tab allowance leave no room on the sheet.</exception>
    /// <exception cref="InvalidOperationException">When a single facet does not fit the sheet at this scale.</exception>
    public static SheetLayoutResult Lay(FlatPattern pattern, FabricationSettings settings) => Lay(pattern, settings, null);

    /// <summary>As <see cref="Lay(FlatPattern, FabricationSettings)"/>, with the parts given (#F part number
    /// of each face, numbered from 0 by lowest face) instead of found; for tests of seams and tabs.</summary>
    internal static SheetLayoutResult Lay(FlatPattern pattern, FabricationSettings settings, int[]? givenParts)
    {
        var area = SheetArea.For(settings);
        var model = ModelScalePattern.Of(pattern, settings.MillimetresPerMetre);
        LayoutOverlap.Check(model.Faces);
        var parts = LayoutParts.Split(model, area, settings.SpacingMm, givenParts);

        var warnings = new List<string>();
        var tabs = SeamTabs.Place(pattern, model, parts, settings, area.TabRootOffset);
        if (tabs.Warning is { } tabWarning) warnings.Add(tabWarning);
        var outlines = PartOutlines.Build(parts, tabs, settings.KerfMm, warnings);
        var packing = PartPacking.Pack(pattern, model, parts, outlines, area, settings, warnings);

        var work = new LineWork(settings);
        work.AddCreases(pattern, model.Vertices, parts.PartOf, packing);
        var seams = work.AddSeams(pattern, model, parts.PartOf, tabs, packing);
        work.AddOutlinesAndMarks(outlines, parts, model.Faces, packing);
        work.AddLabelStrokes(area.SheetWidth);

        var assembled = SheetAssembly.Assemble(work.Lines, packing, outlines, area, settings);
        var figures = LayoutFigures.Compute(pattern, model.Faces, settings, work, assembled, seams,
            parts.Count, packing.SheetCount, tabs.OverlappingCodes.Count, warnings);
        return new SheetLayoutResult(assembled.Sheets, PlacedParts(pattern, model, parts, outlines, packing), seams, OrderedLabels(work.Labels), figures);
    }

    /// <summary>Each part as placed: its faces, vertices and outline on its sheet.</summary>
    private static PlacedPart[] PlacedParts(FlatPattern pattern, ModelScalePattern model, LayoutParts parts,
        NetTopologySuite.Geometries.Polygon[] outlines, PartPacking packing)
    {
        var mesh = pattern.Folded;
        var placed = new PlacedPart[parts.Count];
        for (int p = 0; p < parts.Count; p++)
        {
            var verts = parts.Faces[p].SelectMany(f => mesh.Faces[f]).Distinct().OrderBy(v => v).ToArray();
            placed[p] = new PlacedPart(p + 1, packing.SheetOf(p), parts.Faces[p], verts, verts.Select(v => packing.Place(p, model.Vertices[v])).ToArray(),
                packing.Angles[p], packing.Offsets[p], NtsGeometry.OpenRing(outlines[p].ExteriorRing).Select(m => packing.Place(p, m)).ToArray(), outlines[p].Area);
        }
        return placed;
    }

    /// <summary>Labels by sheet, part, purpose and text, so the result does not depend on the order they were made in.</summary>
    private static SheetLabel[] OrderedLabels(List<(int Part, SheetLabel Label)> labels) =>
        labels.OrderBy(l => l.Label.Sheet).ThenBy(l => l.Part).ThenBy(l => l.Label.Purpose).ThenBy(l => l.Label.Text, StringComparer.Ordinal)
            .Select(l => l.Label).ToArray();

    /// <summary>Seam code of the s-th seam: A..Z, AA..ZZ, AAA.. (letters only, so codes never read as part numbers).</summary>
    public static string SeamCode(int index)
    {
        var chars = new List<char>();
        int n = index;
        do { chars.Insert(0, (char)('A' + n % 26)); n = n / 26 - 1; } while (n >= 0);
        return new string(chars.ToArray());
    }
}
