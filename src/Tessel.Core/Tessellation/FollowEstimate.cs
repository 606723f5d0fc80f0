using System.Globalization;
using Tessel.Core.Targets;

namespace Tessel.Core.Tessellation;

/// <summary>Whether a family's sheet, at the job's cell size and fold depth, can bend as tightly as the
/// target does, judged before any fitting; when it cannot, the change that makes it able to.</summary>
/// <param name="CanFollow">False when the target bends more per cell than the folds allow.</param>
/// <param name="TurnPerCell">Largest principal curvature times the cell's plan size, radians: how far the
/// target's tangent plane turns across one cell.</param>
/// <param name="TurnLimit">The most the family's cells can turn, radians (see <see cref="Check"/>).</param>
/// <param name="Message">One line for the progress and the summary, naming the change; null when it can follow.</param>
/// <param name="SuggestedCellsX">Cells along x that bring the turn per cell within the limit, or null.</param>
/// <param name="SuggestedCellsY">Cells along y likewise, or null.</param>
/// <param name="SuggestedFoldDepth">A fold depth in metres that keeps the bottom layer clear of the
/// target's centres of curvature, or null when the depth is fine.</param>
/// <param name="OtherFamily">Another family that follows the target at the suggested cells, or null.</param>
public sealed record FollowEstimate(bool CanFollow, double TurnPerCell, double TurnLimit, string? Message,
    int? SuggestedCellsX, int? SuggestedCellsY, double? SuggestedFoldDepth, string? OtherFamily)
{
    /// <summary>Share of the turn limit a suggested cell count aims at, so that the suggestion clears the
    /// estimate with room left (the estimate is rough: a rule of thumb derived here, no source).</summary>
    public const double Margin = 0.8;

    /// <summary>Largest fold depth over the smallest radius of curvature: the bottom layer lies on the
    /// offset surface at the fold depth, whose sheet folds back on itself (a cusp) where the depth reaches
    /// the radius (the focal surface); half of it keeps the offset smooth (derived here, no source).</summary>
    public const double MaxDepthOverRadius = 0.5;

    /// <summary>Turn per cell a free triangulated net still follows: a crease then folds about one
    /// radian, well inside the fold-angle bounds (derived here, no source).</summary>
    public const double NetTurnLimit = 1.0;

    /// <summary>Most cells a suggestion asks for along one side: beyond it the fit's cost grows past
    /// what a model needs, and another family is the better change.</summary>
    public const int MaxSuggestedCells = 60;

    /// <summary>Estimates whether <paramref name="family"/> with parameters <paramref name="p"/> can follow
    /// the target of curvature <paramref name="c"/>.</summary>
    /// <remarks>
    /// The target's tangent plane turns by tau = kappa_max x cell across one cell. A folded cell bends
    /// out of its plane only by changing its fold angles, and a crease keeps its mountain or valley sign
    /// only while the change stays below the tilt the fold gives its facets; so tau must stay below the
    /// facet tilt: theta of the Miura cell (Schenk and Guest 2013; sin theta = H / (a sin gamma)) for the
    /// Miura-type families, atan(2 d / base) for a waterbomb base whose centre stands d above its grid
    /// lines, <see cref="NetTurnLimit"/> for a free net. A Yoshimura vault is built in closed form on the
    /// target's circle and is not judged here. Where the limit is passed the suggestion is the cell
    /// count that brings tau within <see cref="Margin"/> of the limit (the fold depth scaled with the
    /// cells when <paramref name="depthScalesWithCells"/>), and for a doubly curved target the free
    /// triangulated family at that count as the other choice.
    /// </remarks>
    public static FollowEstimate Check(string family, ITargetSurface target, FamilyParameters p, CurvatureFigures c, bool depthScalesWithCells)
    {
        var fp = target.Footprint;
        double kappa = c.MaxAbsPrincipal;
        var descriptor = TessellationFamilies.Find(family);
        if (descriptor is null || !(kappa > 0)) return Fine(0, double.PositiveInfinity);
        int cellsX, cellsY;
        try
        {
            cellsX = CellCounts.Resolve(p.CellsX, p.CellSize, fp.Width, nameof(p.CellsX));
            cellsY = CellCounts.Resolve(p.CellsY, p.CellSize, fp.Depth, nameof(p.CellsY));
        }
        catch (ArgumentException) { return Fine(0, double.PositiveInfinity); }

        double? limit = Limit(descriptor, fp, p with { CellsX = cellsX, CellsY = cellsY });
        if (limit is not double lim) return Fine(0, double.PositiveInfinity);
        double cell = Math.Max(fp.Width / cellsX, fp.Depth / cellsY);
        double turn = kappa * cell;
        bool depthTooDeep = descriptor.HasFoldDepth && p.FoldDepth * kappa > MaxDepthOverRadius;
        if (turn <= lim && !depthTooDeep) return Fine(turn, lim);

        int? sx = null, sy = null;
        double? depth = depthTooDeep ? MaxDepthOverRadius * Margin / kappa : null;
        if (turn > lim)
        {
            for (double m = 1.25; Math.Ceiling(cellsX * m) <= MaxSuggestedCells && Math.Ceiling(cellsY * m) <= MaxSuggestedCells; m += 0.25)
            {
                int nx = (int)Math.Ceiling(cellsX * m), ny = (int)Math.Ceiling(cellsY * m);
                double d = depth ?? (depthScalesWithCells ? p.FoldDepth * Math.Min((double)cellsX / nx, (double)cellsY / ny) : p.FoldDepth);
                double cell2 = Math.Max(fp.Width / nx, fp.Depth / ny);
                if (Limit(descriptor, fp, p with { CellsX = nx, CellsY = ny, FoldDepth = d }) is double l2 && kappa * cell2 <= Margin * l2)
                {
                    (sx, sy) = (nx, ny);
                    break;
                }
            }
        }
        bool doubly = c.MaxGaussian * c.Area > FamilyAdvice.NegligibleTotalCurvature || -c.MinGaussian * c.Area > FamilyAdvice.NegligibleTotalCurvature;
        // A free net at the suggested cells follows any curvature; it is named for doubly curved targets,
        // where a regular family's fit is the harder one.
        string? other = family != "free-triangulated" && doubly && sx is not null ? "free-triangulated" : null;

        var I = CultureInfo.InvariantCulture;
        var changes = new List<string>();
        if (sx is int ax && sy is int ay)
            changes.Add(string.Format(I, "cellsX = {0} and cellsY = {1}{2}", ax, ay, other is null ? "" : $" (with this family or with {other})"));
        if (depth is double dd) changes.Add(string.Format(I, "a fold depth of at most {0:0.###} m", dd));
        string fix = changes.Count == 0 ? "use a smaller footprint or a gentler target" : "use " + string.Join(", or ", changes);
        string why = turn > lim
            ? string.Format(I, "the target turns {0:0.##} rad across one {1:0.###} m cell (tightest radius {2:0.###} m) but a {3} cell bends at most about {4:0.##} rad before a crease goes flat", turn, cell, 1 / kappa, family, lim)
            : string.Format(I, "the fold depth {0:0.###} m is more than half the target's tightest radius of curvature ({1:0.###} m), so the bottom layer folds back on itself", p.FoldDepth, 1 / kappa);
        return new FollowEstimate(false, turn, lim, $"The pattern cannot follow the target closely: {why}; {fix}.", sx, sy, depth, other);
    }

    private static FollowEstimate Fine(double turn, double limit) => new(true, turn, limit, null, null, null, null, null);

    /// <summary>The turn per cell the family allows with these parameters, or null where the parameters
    /// make no cell (the generator reports that) or the family is not judged.</summary>
    private static double? Limit(TessellationFamily family, Footprint fp, FamilyParameters p)
    {
        try { return family.TurnLimit(fp, p); }
        catch (ArgumentException) { return null; }
    }
}
