using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Checks;

/// <summary>How many folds break the job's fold-angle bounds, measured on the fitted geometry.</summary>
/// <param name="Folds">Creases folded beyond the flat tolerance (mountains and valleys).</param>
/// <param name="FlatCreases">Interior edges within the flat tolerance.</param>
/// <param name="BelowMinimum">Folds whose |fold angle| is below the minimum fold angle.</param>
/// <param name="AboveMaximum">Folds whose |fold angle| is above the maximum fold angle.</param>
/// <param name="MaxViolationRad">Largest amount by which a fold misses its bounds, radians (0 when none does).</param>
public sealed record FoldBoundCount(int Folds, int FlatCreases, int BelowMinimum, int AboveMaximum, double MaxViolationRad)
{
    public int Violations => BelowMinimum + AboveMaximum;
}

/// <summary>Crease roles read from a folded state, after the fit: what the sheets print is what the
/// fitted model does.</summary>
/// <remarks>
/// The top side is defined once, here: it is the side of the pattern that faces the target's normal
/// (faces are counter-clockwise seen from it), and it is the printed face of every sheet (the sheet stage
/// lays the flat pattern out as seen from the top). A crease whose dihedral <see cref="CreaseMesh.FoldAngle"/>
/// is positive has its ridge toward the top side: a mountain; negative: a valley.
/// </remarks>
public static class FoldRoles
{
    /// <summary>Creases folded less than this (degrees) are drawn flat, as edges to leave unfolded.</summary>
    /// <remarks>Half the default minimum fold angle (fitting.bounds.minFoldAngleDeg = 1), so every fold the
    /// fitter held to its bounds stays a fold. Below it a maker cannot set the fold by hand (scored card springs
    /// back by several degrees: value from memory), and leaving it flat moves the far side of a facet by at most
    /// tan(0.5 deg), under 0.9 % of the facet's width.</remarks>
    public const double FlatToleranceDeg = 0.5;

    /// <summary>The same mesh with every interior edge labelled by the sign of its fold angle in
    /// <paramref name="folded"/>: mountain if positive, valley if negative, flat within the tolerance.</summary>
    public static CreaseMesh FromGeometry(CreaseMesh folded, double flatToleranceDeg = FlatToleranceDeg)
    {
        double tolerance = flatToleranceDeg * Math.PI / 180;
        var roles = new CreaseRole[folded.EdgeCount];
        for (int e = 0; e < folded.EdgeCount; e++)
            roles[e] = folded.IsInterior(e) ? RoleOf(folded.FoldAngle(e), tolerance) : CreaseRole.Boundary;
        return folded.WithRoles(roles);
    }

    /// <summary>Role of a crease with fold angle <paramref name="rho"/> (radians) at flat tolerance <paramref name="toleranceRad"/>.</summary>
    public static CreaseRole RoleOf(double rho, double toleranceRad) =>
        !double.IsFinite(rho) || Math.Abs(rho) < toleranceRad ? CreaseRole.Flat : rho > 0 ? CreaseRole.Mountain : CreaseRole.Valley;

    /// <summary>Interior edges whose role differs between two meshes of the same topology.</summary>
    public static int Changed(CreaseMesh before, CreaseMesh after)
    {
        int n = 0;
        for (int e = 0; e < before.EdgeCount; e++)
            if (before.IsInterior(e) && before.EdgeRoles[e] != after.EdgeRoles[e]) n++;
        return n;
    }

    /// <summary>Counts the folds (mountain or valley edges) of <paramref name="mesh"/> whose fold angle magnitude
    /// lies outside [<paramref name="minDeg"/>, <paramref name="maxDeg"/>] by more than
    /// <paramref name="toleranceRad"/> (the fit's constraint tolerance: the fit holds its bounds to it). Flat
    /// creases are not folds and are not counted against the minimum. The largest miss is reported whatever its size.</summary>
    public static FoldBoundCount Bounds(CreaseMesh mesh, double minDeg, double maxDeg, double toleranceRad)
    {
        double min = minDeg * Math.PI / 180, max = maxDeg * Math.PI / 180, worst = 0;
        int folds = 0, flat = 0, below = 0, above = 0;
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            if (!mesh.IsInterior(e)) continue;
            var role = mesh.EdgeRoles[e];
            if (role == CreaseRole.Flat) { flat++; continue; }
            if (role is not (CreaseRole.Mountain or CreaseRole.Valley)) continue;
            folds++;
            double rho = Math.Abs(mesh.FoldAngle(e));
            if (rho < min) { if (min - rho > toleranceRad) below++; worst = Math.Max(worst, min - rho); }
            else if (rho > max) { if (rho - max > toleranceRad) above++; worst = Math.Max(worst, rho - max); }
        }
        return new FoldBoundCount(folds, flat, below, above, worst);
    }
}
