using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Fitting;

/// <summary>A pattern prepared for a refit that holds the fold-angle bounds of a family without fold signs.</summary>
/// <param name="Pattern">The drape with roles read from the first fit, fold signs and flat creases held.</param>
/// <param name="Settings">The settings of the refit (the minimum fold clear of the drawn-flat tolerance).</param>
/// <param name="Outside">Folds of the first fit outside the bounds.</param>
public sealed record BandedPattern(GeneratedPattern Pattern, FitSettings Settings, int Outside);

/// <summary>Fold-angle bounds for families whose roles come from the fitted geometry (free triangulated
/// nets): every interior crease must end either drawn flat or folded within
/// [<see cref="FitSettings.MinFoldAngleDeg"/>, <see cref="FitSettings.MaxFoldAngleDeg"/>].</summary>
/// <remarks>"Flat, or at least the minimum" is not a connected set, so it cannot be a row of the first fit.
/// The first fit runs without it; each crease it leaves between the bands is assigned a band, and a refit
/// from that result holds every crease in its band, as the fold-sign rows of the other families do. The
/// assignments are tried in order: each to the nearer band (flat below the midpoint of the drawn-flat
/// tolerance and the minimum), all of them flat, all of them folds of their own sign. Measured on a free
/// net of a ring-sector mesh at 20 x 20 that the continuation had left 3 % of the way from its plane
/// (36 creases between 0.5 and 1 deg): the nearer bands stalled at 7.6e-4 rad, while setting them all flat
/// lands, since the plane itself lies in that set.</remarks>
public static class FoldBands
{
    /// <summary>The band assignments to try, in order, without repeats; empty when every fold of
    /// <paramref name="fitted"/> already lies within the bounds.</summary>
    public static IEnumerable<BandedPattern> Candidates(GeneratedPattern pattern, CreaseMesh fitted, FitSettings settings)
    {
        const double deg = Math.PI / 180;
        double drawnFlat = settings.DrawnFlatBelowDeg * deg, min = settings.MinFoldAngleDeg * deg, max = settings.MaxFoldAngleDeg * deg;
        int outside = 0;
        for (int e = 0; e < fitted.EdgeCount; e++)
        {
            if (!fitted.IsInterior(e)) continue;
            double size = Math.Abs(fitted.FoldAngle(e));
            if (size >= drawnFlat && (size < min || size > max)) outside++;
        }
        if (outside == 0) yield break;
        // A fold must stay clear of the drawn-flat tolerance, or round-off would draw it flat.
        double clearOfFlat = (2 - FitSettings.HeldFlatShare) * settings.DrawnFlatBelowDeg;
        var refitSettings = settings with { MinFoldAngleDeg = Math.Max(settings.MinFoldAngleDeg, clearOfFlat) };
        var tried = new List<CreaseRole[]>();
        foreach (double toFlat in new[] { Math.Max(drawnFlat, (drawnFlat + min) / 2), Math.Max(drawnFlat, min), drawnFlat })
        {
            var roles = Roles(pattern.Mesh, fitted, toFlat);
            if (tried.Any(r => r.AsSpan().SequenceEqual(roles))) continue;
            tried.Add(roles);
            yield return new BandedPattern(pattern with
            {
                Mesh = pattern.Mesh.WithRoles(roles),
                Constraints = pattern.Constraints | FamilyConstraints.FoldSigns | FamilyConstraints.FlatCreases,
            }, refitSettings, outside);
        }
    }

    /// <summary>Interior creases under <paramref name="toFlat"/> (radians) flat, the rest by their sign.</summary>
    private static CreaseRole[] Roles(CreaseMesh draped, CreaseMesh fitted, double toFlat)
    {
        var roles = new CreaseRole[fitted.EdgeCount];
        for (int e = 0; e < fitted.EdgeCount; e++)
        {
            if (!fitted.IsInterior(e)) { roles[e] = draped.EdgeRoles[e]; continue; }
            double rho = fitted.FoldAngle(e);
            roles[e] = Math.Abs(rho) < toFlat ? CreaseRole.Flat : rho > 0 ? CreaseRole.Mountain : CreaseRole.Valley;
        }
        return roles;
    }
}
