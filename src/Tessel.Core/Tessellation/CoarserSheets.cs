namespace Tessel.Core.Tessellation;

/// <summary>The job's family on the same target with other cell counts, its fold depth scaled with the
/// cells (<see cref="CoarseStart"/>).</summary>
/// <param name="CellsX">The job's cells along x, as generated.</param>
/// <param name="CellsY">The job's cells along y, as generated.</param>
/// <param name="Generate">Generates the family with the given cells along x and y.</param>
public sealed record CoarserSheets(int CellsX, int CellsY, Func<int, int, GeneratedPattern> Generate);
