namespace Tessel.Core.Tessellation.Waterbomb;

/// <summary>Parameters of a waterbomb tessellation: rows of waterbomb bases along x, stacked along y,
/// every other row shifted by half a base.</summary>
/// <param name="Bases">Bases per row (along x), or null to derive it from <paramref name="CellSize"/>.</param>
/// <param name="Rows">Rows of bases (along y), or null to derive it from <paramref name="CellSize"/>.</param>
/// <param name="CellSize">Plan size of one base in metres (width and row height), used where a count is null.</param>
/// <param name="FoldDepth">Height of the base centres above the grid-line vertices in the starting
/// drape, metres: the distance between the two vertex layers.</param>
/// <param name="Tuck">How far, as a fraction of the row height, the starting drape pulls each midline
/// end toward its base centre in plan; it gives the midline creases their valley sign (see
/// <see cref="WaterbombGenerator"/>). Null: the tuck that makes the regular drape on a plane
/// developable (<see cref="WaterbombGenerator.DevelopableTuck"/>), graded per base on a curved target.</param>
public sealed record WaterbombParameters(
    int? Bases = null,
    int? Rows = null,
    double? CellSize = null,
    double FoldDepth = 0.05,
    double? Tuck = null);
