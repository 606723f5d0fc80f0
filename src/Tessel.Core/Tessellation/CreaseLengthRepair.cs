using Tessel.Core.Model;

namespace Tessel.Core.Tessellation;

/// <summary>Fewer, larger cells so that every crease of the draped pattern reaches the job's minimum crease
/// at model scale (<c>fitting.bounds.minEdgeLengthMm</c>).</summary>
/// <param name="CellsX">The count to use along x, or null where the job gives a cell size.</param>
/// <param name="CellsY">The count to use along y, or null where the job gives a cell size.</param>
/// <param name="CellSize">The cell size to use (job units), or null where the job gives counts.</param>
/// <param name="Message">One line for the progress, the summary and the report, naming the fields.</param>
public sealed record CreaseLengthRepair(int? CellsX, int? CellsY, double? CellSize, string Message);

/// <summary>Crease lengths of a pattern, and the coarsening that lengthens them.</summary>
/// <remarks>A crease is an interior edge: the outline is cut, and a cut may be as short as it likes. Every
/// family's creases scale with its cell size on a given footprint (measured over the robustness corpus at
/// 1:50: the shortest, 5th-percentile and quartile creases of each draped pattern halve from 6 to 12 cells
/// and fall by 12/20 from 12 to 20, within 1 %), so a pattern whose shortest crease is s at n cells has
/// shortest crease about s n / n' at n' cells.</remarks>
public static class CreaseLengths
{
    /// <summary>Shortest interior edge of <paramref name="mesh"/> (metres, as the mesh); +infinity without one.</summary>
    public static double Shortest(CreaseMesh mesh)
    {
        double shortest = double.PositiveInfinity;
        for (int e = 0; e < mesh.EdgeCount; e++)
            if (mesh.IsInterior(e))
                shortest = Math.Min(shortest, (mesh.Vertex(mesh.EdgeVertices[2 * e + 1]) - mesh.Vertex(mesh.EdgeVertices[2 * e])).Length);
        return shortest;
    }

    /// <summary>Interior edges of <paramref name="mesh"/> shorter than <paramref name="minimum"/> (same unit as the mesh).</summary>
    public static int ShorterThan(CreaseMesh mesh, double minimum)
    {
        int count = 0;
        for (int e = 0; e < mesh.EdgeCount; e++)
            if (mesh.IsInterior(e) && (mesh.Vertex(mesh.EdgeVertices[2 * e + 1]) - mesh.Vertex(mesh.EdgeVertices[2 * e])).Length < minimum) count++;
        return count;
    }

    /// <summary>The first coarsening, from the estimate s n / n' and then one count less at a time, whose drape
    /// has every crease at least <paramref name="minimum"/> long; null when the counts reach 2 first.</summary>
    /// <param name="cellsX">The job's count along x, or null where a cell size is given.</param>
    /// <param name="cellsY">The job's count along y, or null where a cell size is given.</param>
    /// <param name="cellSize">The job's cell size, used where a count is null.</param>
    /// <param name="shortest">The shortest crease of the job's own drape.</param>
    /// <param name="drape">Drapes the pattern with the given counts and cell size (fold depth and every other
    /// parameter as the job derives them); may throw <see cref="ArgumentException"/> for counts that make no pattern.</param>
    public static (int? CellsX, int? CellsY, double? CellSize, double Shortest)? Coarsen(int? cellsX, int? cellsY, double? cellSize,
        double shortest, double minimum, Func<int?, int?, double?, CreaseMesh> drape)
    {
        // Coarsening factor f: counts divide by it, a cell size multiplies by it.
        double f = minimum / shortest;
        for (int attempt = 0; attempt < 60; attempt++)
        {
            // A count the estimate hits exactly is not lost to round-off in the division.
            int? nx = cellsX is int x ? Math.Max(2, (int)Math.Floor(x / f + 1e-9)) : null;
            int? ny = cellsY is int y ? Math.Max(2, (int)Math.Floor(y / f + 1e-9)) : null;
            double? size = cellSize * f;
            double s;
            try { s = Shortest(drape(nx, ny, size)); }
            catch (ArgumentException) { return null; }
            if (s >= minimum) return (nx, ny, size, s);
            bool atFloor = (nx ?? 3) <= 2 && (ny ?? 3) <= 2 && size is null;
            if (atFloor) return null;
            // One count less along the longer side (or 5 % larger cells), with the shorter side in proportion.
            int largest = Math.Max(nx ?? 0, ny ?? 0);
            f = largest > 2 ? Math.Max(cellsX ?? 0, cellsY ?? 0) / (largest - 1.0) : f * 1.05;
        }
        return null;
    }
}
