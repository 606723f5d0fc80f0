using Tessel.Core.Geometry;
using Tessel.Core.LinearAlgebra;
using Tessel.Core.Model;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Fitting;

/// <summary>A start for a large regular sheet from a fit of the same sheet with half the cells (nested
/// iteration: a coarse level settles the slow, sheet-wide modes that a fine level's Newton steps resolve
/// only a little at a time; Briggs, Henson &amp; McCormick, A Multigrid Tutorial, 2nd ed., SIAM 2000,
/// ch. 3).</summary>
/// <remarks>
/// On a large Miura sheet the developability residual left near the constraint set is one smooth bump
/// over the whole sheet, the rows' lowest mode; each damped projection step removes about 1 % of it, so
/// a fit from the drape stalls from about 64 x 64 cells (measured on the benchmark saddle: 2.2e-6 rad
/// after 300 steps at 64 x 64, 3.4e-6 at 80 x 80). The half-size sheet lands, and its displacement from
/// its own drape, smoothed over <see cref="SmoothingRadius"/> of its edges so that only the sheet-wide
/// part is kept (the cell-scale part belongs to cells of the other size), is added to the fine drape. From
/// there, with no pull toward the target first (<see cref="FitSettings.PullTowardTargetFirst"/>), the
/// projection lands in 34 steps at 64 x 64 and the fit finishes (3e-13 rad).
/// </remarks>
public static class CoarseStart
{
    /// <summary>Sheets with fewer cells than this along either side start from their drape: up to 40 x 40
    /// the fit lands from there (fit benchmark), and the coarse fit would only add time.</summary>
    public const int MinCells = 48;

    /// <summary>Radius of the smoothing kernel in mean plan edge lengths of the coarse sheet. Measured at
    /// 20 x 20 from 10 x 10: a kernel of 3 edges carries the coarse cells' own pattern over (Kawasaki
    /// residual of the start 0.22 rad against the drape's 0.094); 12 edges carries only the sheet-wide
    /// displacement (0.12 rad).</summary>
    public const double SmoothingRadius = 12;

    /// <summary>Start positions (#V*3) for <paramref name="pattern"/> with the coarse fit they came from, or
    /// null when the sheet is small enough to start from its drape, no coarser sheet exists, or the coarse
    /// fit is not buildable.</summary>
    public static CoarseStartResult? For(GeneratedPattern pattern, ITargetSurface target, FitSettings settings, CoarserSheets? coarser,
        Func<ISpdSolver> solverFactory, Action<string>? report = null)
    {
        if (coarser is null || Math.Min(coarser.CellsX, coarser.CellsY) < MinCells) return null;
        int cx = (coarser.CellsX + 1) / 2, cy = (coarser.CellsY + 1) / 2;
        GeneratedPattern coarse;
        try { coarse = coarser.Generate(cx, cy); }
        catch (ArgumentException) { return null; }
        var coarseSettings = settings with { Starts = 1, StartPerturbation = 0, MinEdgeLengthM = 0, OnStep = null };
        var deeper = For(coarse, target, coarseSettings, coarser with { CellsX = cx, CellsY = cy }, solverFactory, report);
        var fit = EpsilonConstraintFitter.Fit(coarse, target, SettingsFrom(coarseSettings.For(coarse), deeper), solverFactory(), deeper?.Positions);
        report?.Invoke(FormattableString.Invariant(
            $"coarse start: the same sheet with {cx} x {cy} cells fitted in {fit.History.Count} steps, {(fit.Buildable ? "buildable" : "not buildable")}, shape RMS {fit.Shape.Rms * 1000:0.##} mm"));
        return fit.Buildable ? new CoarseStartResult(Prolong(coarse.Mesh, fit.Mesh.Positions, pattern.Mesh), fit) : null;
    }

    /// <summary>The settings of a fit from <paramref name="start"/>: a coarse start already has the sheet-wide
    /// shape the constraints need, and phase 1's pull toward the target would take it back (measured at
    /// 80 x 80: the pull brought the start from 5.5 to 0.8 mm RMS and the projection then crawled again;
    /// without it the projection lands in 34 steps at 64 x 64). Unchanged without a coarse start.</summary>
    public static FitSettings SettingsFrom(FitSettings settings, CoarseStartResult? start) =>
        start is null ? settings : settings with { PullTowardTargetFirst = false };

    /// <summary>The fine drape moved by the coarse sheet's displacement (fitted - draped), read at each fine
    /// vertex's plan position from the coarse top-layer vertices by a compactly supported smoothing kernel
    /// w = (1 - r^2/R^2)^2 (a low-pass, unlike interpolation, which would carry the coarse cells' own pattern).</summary>
    public static double[] Prolong(CreaseMesh coarse, double[] fitted, CreaseMesh fine)
    {
        double edge = 0;
        for (int e = 0; e < coarse.EdgeCount; e++)
        {
            var a = coarse.Vertex(coarse.EdgeVertices[2 * e]); var b = coarse.Vertex(coarse.EdgeVertices[2 * e + 1]);
            edge += Math.Sqrt((a.X - b.X) * (a.X - b.X) + (a.Y - b.Y) * (a.Y - b.Y));
        }
        double radius = SmoothingRadius * edge / Math.Max(1, coarse.EdgeCount), r2max = radius * radius;
        // Top-layer vertices in square buckets of the kernel's radius: each fine vertex reads 3 x 3 buckets.
        var buckets = new Dictionary<(long, long), List<int>>();
        (long, long) Bucket(double x, double y) => ((long)Math.Floor(x / radius), (long)Math.Floor(y / radius));
        for (int v = 0; v < coarse.VertexCount; v++)
        {
            if (coarse.Layers[v] == VertexLayer.Bottom) continue;
            var key = Bucket(coarse.Positions[3 * v], coarse.Positions[3 * v + 1]);
            if (!buckets.TryGetValue(key, out var list)) buckets[key] = list = [];
            list.Add(v);
        }
        var result = (double[])fine.Positions.Clone();
        for (int v = 0; v < fine.VertexCount; v++)
        {
            double x = fine.Positions[3 * v], y = fine.Positions[3 * v + 1], weights = 0;
            var sum = new Vec3(0, 0, 0);
            var (bx, by) = Bucket(x, y);
            for (long i = bx - 1; i <= bx + 1; i++)
                for (long j = by - 1; j <= by + 1; j++)
                {
                    if (!buckets.TryGetValue((i, j), out var list)) continue;
                    foreach (int c in list)
                    {
                        double dx = coarse.Positions[3 * c] - x, dy = coarse.Positions[3 * c + 1] - y, r2 = dx * dx + dy * dy;
                        if (r2 >= r2max) continue;
                        double w = (1 - r2 / r2max) * (1 - r2 / r2max);
                        sum += w * (Vec3.Read(fitted, c) - coarse.Vertex(c));
                        weights += w;
                    }
                }
            if (weights > 0) (fine.Vertex(v) + sum / weights).Write(result, v);
        }
        return result;
    }
}

/// <summary>A coarse start: the fine sheet's start positions (#V*3) and the coarse fit they came from.</summary>
public sealed record CoarseStartResult(double[] Positions, FitResult Coarse);
