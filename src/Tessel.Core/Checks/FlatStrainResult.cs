namespace Tessel.Core.Checks;

/// <summary>How far the flat layout has to stretch to become the folded model.</summary>
/// <param name="FacetMaxStrain">#F largest |strain| over each facet's sides and (for quads) both diagonals;
/// strain = (flat - folded) / folded, dimensionless.</param>
/// <param name="MaxStrain">Largest entry of <paramref name="FacetMaxStrain"/>.</param>
/// <param name="WorstFacet">Facet with <paramref name="MaxStrain"/> (-1 for a mesh without facets).</param>
/// <param name="StrainLimit">Material limit used for <paramref name="FacetsOverLimit"/>.</param>
/// <param name="FacetsOverLimit">Facets whose max |strain| exceeds the limit, ascending.</param>
/// <param name="VertexAngleStrain">#V estimate |delta| / (2 pi) per interior vertex of the folded mesh, delta =
/// 2 pi - sum of its sector angles (docs/reference/geometry.md section 7); 0 on boundary vertices.</param>
/// <param name="MaxVertexAngleStrain">Largest entry of <paramref name="VertexAngleStrain"/>.</param>
public sealed record FlatStrainResult(double[] FacetMaxStrain, double MaxStrain, int WorstFacet, double StrainLimit,
    int[] FacetsOverLimit, double[] VertexAngleStrain, double MaxVertexAngleStrain);
