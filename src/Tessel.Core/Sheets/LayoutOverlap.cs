using Tessel.Core.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>Refuses a flat layout whose facets are turned over or lie on each other: such a pattern
/// cannot be cut from one sheet.</summary>
internal static class LayoutOverlap
{
    /// <summary>Overlaps below this share of the pattern's area are rounding in the union, not facets on
    /// top of each other.</summary>
    private const double RoundingShare = 1e-6;

    /// <exception cref="UncuttableLayoutException">When a facet is turned over or facets overlap.</exception>
    public static void Check(Vec2[][] facePolys)
    {
        if (Overlaps(facePolys) is { } overlap)
            throw new UncuttableLayoutException($"the flat layout overlaps itself ({overlap}), so its parts cannot be cut from a sheet; a facet of the fitted model is folded over or crossed: let the fit converge (raise fitting.maxIterations, loosen fitting.tolerance or epsilonDeg) or try other cells or fold depth");
    }

    /// <summary>How the layout (model frame, mm) overlaps itself ("2 facet(s) turned over, 19.1 mm2 of facets
    /// lying on others at model scale"), or null when it does not; <paramref name="at"/> says which scale the mm are at.</summary>
    public static string? Overlaps(Vec2[][] facePolys, string at = "at model scale")
    {
        var (flipped, overlap, total) = Measure(facePolys);
        return flipped > 0 || overlap > RoundingShare * total
            ? $"{flipped} facet(s) turned over, {overlap:0.#} mm2 of facets lying on others {at}"
            : null;
    }

    /// <summary>Facets of the layout (model frame, y down) that are turned over or cross themselves, the area
    /// by which facets lie on each other (sum of facet areas less the area of their union) and the sum, mm2.</summary>
    private static (int Flipped, double Overlap, double Total) Measure(Vec2[][] facePolys)
    {
        // Faces run counter-clockwise seen from the top; the model frame flips y, so there they run clockwise.
        int flipped = facePolys.Count(f => !(PolygonMeasures.SignedArea(f) < 0) || !NtsGeometry.Polygon(f).IsValid);
        double total = facePolys.Sum(f => Math.Abs(PolygonMeasures.SignedArea(f)));
        if (facePolys.Length == 0) return (0, 0, 0);
        double union = NtsGeometry.UnionOfFaces(facePolys.Select(NtsGeometry.Polygon).ToArray()).Area;
        return (flipped, Math.Max(0, total - union), total);
    }
}
