using Tessel.Core.Geometry;
using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>The checks on a finished layout (narrow facets, unreadable labels, short perforations, strained
/// edges) and the figures a build reports: lengths, laser time, counts and warnings.</summary>
internal static class LayoutFigures
{
    /// <summary>Labels named in the warning about small labels; the count gives the rest.</summary>
    private const int TinyLabelsNamed = 12;

    /// <summary>Adds the check warnings to <paramref name="warnings"/> and returns the figures.</summary>
    public static SheetFigures Compute(FlatPattern pattern, Vec2[][] facePolys, FabricationSettings settings, LineWork work,
        AssembledSheets assembled, Seam[] seams, int partCount, int sheetCount, int overlappingTabs, List<string> warnings)
    {
        var material = settings.Material;
        int narrow = 0; double narrowest = double.PositiveInfinity; int narrowestFace = -1;
        for (int f = 0; f < facePolys.Length; f++)
        {
            double w = PolygonMeasures.MinimumWidth(facePolys[f]);
            if (w < material.MinFacetWidthMm) narrow++;
            if (w < narrowest) { narrowest = w; narrowestFace = f; }
        }
        if (narrow > 0)
            warnings.Add($"{narrow} facet(s) narrower than {material.MinFacetWidthMm:0.##} mm (10 x thickness of {material.Name}); narrowest {narrowest:0.##} mm (face {narrowestFace})");
        // Single-stroke capitals below about 1.2 mm blur under a laser spot of 0.1-0.2 mm (docs/reference/fabrication.md [CP/M]).
        var tiny = work.Labels.Where(l => l.Label.HeightMm < SheetLayout.MinimumLegibleLabelMm).Select(l => l.Label.Text).ToArray();
        if (tiny.Length > 0)
            warnings.Add($"{tiny.Length} label(s) shrunk below {SheetLayout.MinimumLegibleLabelMm} mm to fit their facet: {string.Join(", ", tiny.Take(TinyLabelsNamed))}{(tiny.Length > TinyLabelsNamed ? ", ..." : "")}");
        int shortPerforations = work.ShortPerforations;
        if (shortPerforations > 0)
            warnings.Add($"{shortPerforations} perforated crease(s) too short for two cut/bridge cycles: made one centred slot, or left uncut where even a slot does not fit");
        int strained = 0; double worstStrain = 0;
        for (int e = 0; e < pattern.EdgeCount; e++)
        {
            double s = Math.Abs(pattern.EdgeStrain[e]);
            if (s > material.StrainLimit) strained++;
            worstStrain = Math.Max(worstStrain, s);
        }
        if (strained > 0)
            warnings.Add($"{strained} edge(s) stretched or shrunk beyond {material.StrainLimit * 100:0.###} % in the flat pattern; worst {worstStrain * 100:0.###} %");

        var a = assembled;
        double totalCut = a.OutlineCut + a.InnerCut + a.PerforationCut;
        double seconds = totalCut / material.CutSpeedMmPerS + (a.Score + a.BackScore + a.LabelLength) / material.ScoreSpeedMmPerS + a.Travel / material.TravelSpeedMmPerS;
        var folds = work.FoldTotals.OrderBy(kv => kv.Key)
            .Select(kv => new FoldFigures(kv.Key, kv.Value.Method, kv.Value.Crease, kv.Value.Score, kv.Value.Perf)).ToArray();
        return new SheetFigures
        {
            TotalCutLengthMm = totalCut,
            OutlineCutLengthMm = a.OutlineCut,
            InnerCutLengthMm = a.InnerCut,
            ScoreLengthMm = a.Score + a.BackScore,
            BackScoreLengthMm = a.BackScore,
            PerforationCutLengthMm = a.PerforationCut,
            TravelLengthMm = a.Travel,
            EstimatedLaserSeconds = seconds,
            Folds = folds,
            SheetCount = sheetCount,
            PartCount = partCount,
            Utilisation = a.Utilisation,
            SeamCodes = seams.Select(s => s.Code).ToArray(),
            NarrowFacetCount = narrow,
            ShortPerforationCount = shortPerforations,
            OverlappingTabCount = overlappingTabs,
            StrainedEdgeCount = strained,
            Warnings = warnings.ToArray(),
        };
    }
}
