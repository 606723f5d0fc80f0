namespace Tessel.Core.Jobs;

/// <summary>Peak memory of a build from the size of its crease pattern, checked when a job loads
/// (validate and build) and again once the pattern exists, before the fit, so that a job too large
/// for the machine is refused with what it would need and the largest size that fits.</summary>
/// <remarks>
/// Peak resident memory of whole Release builds without sheets (fit with the automatic solver policy,
/// checks, folding path) measured with /usr/bin/time -v on this project's 2-core, 24 GB machine,
/// saddle z = x y / 40 over 10 x 10 m, 4 solver steps (the peak is reached by the first
/// factorisations): Miura 20 x 20 cells (1,681 vertices) 136.8 MB, 40 x 40 (6,561) 468 MB, 70 x 70
/// (19,881) 2,291 MB; reverse-curvature 20 x 20 on a dome 116.5 MB, 40 x 40 457.5 MB; Yoshimura 20 x 20 on a cylinder
/// 96.2 MB; waterbomb 20 x 20 on a dome (1,271 vertices) 134 MB. The growth is faster than linear
/// (the factor's fill), so the model is base + a V + b V^1.5 in the vertex count V, fitted through
/// the Miura 20 and 70 figures and rounded up; it over-estimates 40 x 40 by 15 % and so errs on the
/// safe side. Each family's descriptor counts its vertices and scales these figures by its
/// <see cref="FamilyInfo.MemoryFactor"/> (waterbomb 1.5, Yoshimura 3; the others as Miura). The PNG raster of a
/// sheet is added twice (the bitmap and its encoding).
/// </remarks>
public static class MemoryEstimate
{
    /// <summary>Runtime, target and report: the peak of the smallest builds.</summary>
    public const double BaseBytes = 60e6;

    /// <summary>Bytes per pattern vertex (the linear term).</summary>
    public const double LinearBytesPerVertex = 18_500;

    /// <summary>Bytes per vertex^1.5 (the factor's fill).</summary>
    public const double FillBytes = 670;

    /// <summary>Share of the machine's memory a build may plan to use: the rest is for the system
    /// and the estimate's own error (common practice, no source).</summary>
    public const double MachineShare = 0.75;

    /// <summary>Memory a build may use, in bytes: <see cref="MachineShare"/> of what the runtime sees
    /// (physical memory, or a container's limit). Settable so tests get machine-independent messages.</summary>
    public static double BudgetBytes { get; set; } = MachineShare * GC.GetGCMemoryInfo().TotalAvailableMemoryBytes;

    /// <summary>Pattern vertices of <paramref name="cellsX"/> x <paramref name="cellsY"/> cells of the
    /// named family, by its descriptor's count.</summary>
    /// <exception cref="ArgumentException">A family the registered vocabulary does not know.</exception>
    public static double Vertices(string family, double cellsX, double cellsY) => Descriptor(family).Vertices(cellsX, cellsY);

    private static double FamilyFactor(string family) => Descriptor(family).MemoryFactor;

    private static FamilyInfo Descriptor(string family) =>
        JobVocabulary.Registered.Family(family) ?? throw new ArgumentException($"unknown family '{family}'", nameof(family));

    /// <summary>Estimated peak bytes of a build whose pattern has <paramref name="vertices"/> vertices,
    /// plus <paramref name="rasterBytes"/> for one PNG sheet.</summary>
    public static double Bytes(string family, double vertices, double rasterBytes = 0) =>
        BaseBytes + FamilyFactor(family) * (LinearBytesPerVertex * vertices + FillBytes * Math.Pow(vertices, 1.5)) + 2 * rasterBytes;

    /// <summary>The largest cell counts in the proportion of the given ones that fit <see cref="BudgetBytes"/>.</summary>
    public static (long CellsX, long CellsY) LargestThatFits(string family, double cellsX, double cellsY, double rasterBytes = 0)
    {
        double lo = 0, hi = 1;
        for (int i = 0; i < 60; i++)
        {
            double s = (lo + hi) / 2;
            if (Bytes(family, Vertices(family, Math.Max(1, Math.Floor(s * cellsX)), Math.Max(1, Math.Floor(s * cellsY))), rasterBytes) <= BudgetBytes) lo = s;
            else hi = s;
        }
        return ((long)Math.Max(1, Math.Floor(lo * cellsX)), (long)Math.Max(1, Math.Floor(lo * cellsY)));
    }

    /// <summary>Why a pattern of this size cannot be built on this machine, or null when it fits.
    /// The text says what it would need, what the machine allows and the largest size that fits.</summary>
    /// <param name="countsNote">Inserted after the cell counts, e.g. how they were derived.</param>
    public static string? Problem(string family, double cellsX, double cellsY, double rasterBytes = 0, double? vertices = null, string countsNote = "")
    {
        double v = vertices ?? Vertices(family, cellsX, cellsY);
        double bytes = Bytes(family, v, rasterBytes);
        if (bytes <= BudgetBytes) return null;
        var (fx, fy) = LargestThatFits(family, cellsX, cellsY, rasterBytes);
        return $"{Big(cellsX)} x {Big(cellsY)} {family} cells{countsNote} would have about {Big(v)} vertices and need about {Gb(bytes)} GB of memory; "
            + $"a build may use {Gb(BudgetBytes)} GB here ({MachineShare * 100:0} % of the memory this machine offers), which fits about {Big(fx)} x {Big(fy)} cells at most";
    }

    /// <summary>As <see cref="Problem"/> for a pattern that exists: by its vertex count.</summary>
    public static string? ProblemForPattern(string family, double vertices, double rasterBytes = 0)
    {
        double bytes = Bytes(family, vertices, rasterBytes);
        if (bytes <= BudgetBytes) return null;
        double lo = 0, hi = vertices;
        for (int i = 0; i < 60; i++)
        {
            double mid = (lo + hi) / 2;
            if (Bytes(family, mid, rasterBytes) <= BudgetBytes) lo = mid;
            else hi = mid;
        }
        return $"the {family} pattern has {Big(vertices)} vertices and would need about {Gb(bytes)} GB of memory; "
            + $"a build may use {Gb(BudgetBytes)} GB here ({MachineShare * 100:0} % of the memory this machine offers), which fits about {Big(Math.Floor(lo))} vertices at most";
    }

    private static string Big(double v) => v < 1e15
        ? v.ToString("#,0", System.Globalization.CultureInfo.InvariantCulture)
        : v.ToString("0.##e0", System.Globalization.CultureInfo.InvariantCulture);

    private static string Gb(double bytes) => (bytes / 1e9) switch
    {
        < 10 and var g => g.ToString("0.0", System.Globalization.CultureInfo.InvariantCulture),
        var g => Big(Math.Round(g)),
    };
}
