namespace Tessel.Core.Tessellation.Yoshimura;

/// <summary>Parameters of a Yoshimura (diamond) pattern on a barrel vault whose axis runs along x.</summary>
/// <param name="Segments">Horizontal creases (triangle bases) across the arc of the vault, or null to
/// derive it from <paramref name="CellSize"/>.</param>
/// <param name="Rings">Ring-to-ring steps along the axis, or null to derive it from <paramref name="CellSize"/>.</param>
/// <param name="CellSize">Plan size of one triangle (base and axial pitch), metres, used where a count is null.</param>
public sealed record YoshimuraParameters(int? Segments = null, int? Rings = null, double? CellSize = null);
