namespace Tessel.Core.Tessellation.FreeTriangulated;

/// <summary>Parameters of a free triangulated developable net.</summary>
/// <param name="CellsX">Grid cells along x over the footprint's bounding box, or null to derive it from
/// <paramref name="CellSize"/>.</param>
/// <param name="CellsY">Grid cells along y, or null to derive it from <paramref name="CellSize"/>.</param>
/// <param name="CellSize">Plan size of one grid cell in metres, used where a count is null.</param>
/// <param name="FlatDiagonalShare">Share of the grid cells, in [0, 1], kept as planar quad panels (their
/// diagonal a flat crease, held planar by the fit) instead of two triangles folded along the diagonal.
/// A net with panels starts corrugated (see <see cref="FreeTriangulatedGenerator"/>); large shares and saddles
/// converge less often (measurements in docs/decisions.md): check the fit's residuals.</param>
/// <param name="Crumple">Standard deviation of the start's deterministic out-of-surface offsets of interior
/// vertices, as a fraction of the cell size (see <see cref="FreeTriangulatedGenerator"/>); with quad panels
/// half the row offset of the corrugated start instead; 0 starts on the target itself.</param>
public sealed record FreeTriangulatedParameters(
    int? CellsX = null,
    int? CellsY = null,
    double? CellSize = null,
    double FlatDiagonalShare = 0,
    double Crumple = 0.1)
{
    /// <summary>Start as straight corrugated rows (every vertex, border included, alternately above and
    /// below the surface, no zig-zag): on a plane every interior vertex then lies on one straight fold
    /// between two planar strips, so the start is exactly developable with a developability gradient
    /// that does not vanish (the fit's continuation starts there).</summary>
    public bool CorrugatedStart { get; init; }
}
