namespace Tessel.Core.Tessellation;

/// <summary>How many cells a family lays along one side: the count the job gives, else the side's
/// extent over the cell size, at least 2 (one interior vertex needs two cells each way).</summary>
public static class CellCounts
{
    /// <summary>Throws <see cref="ArgumentException"/> naming <paramref name="name"/> for a count below 2
    /// or when neither a count nor a positive, finite cell size is given.</summary>
    public static int Resolve(int? count, double? cellSize, double extent, string name)
    {
        if (count is int c)
        {
            if (c < 2) throw new ArgumentException($"{name} = {c}: at least 2 are needed for an interior vertex; use 2 or more", name);
            return c;
        }
        if (cellSize is not double size || !(size > 0) || !double.IsFinite(size))
            throw new ArgumentException($"{name} is not given and CellSize is not a positive length; give a count or a cell size in metres", name);
        return Math.Max(2, (int)Math.Round(extent / size));
    }
}
