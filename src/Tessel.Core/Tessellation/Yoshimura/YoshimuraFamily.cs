using Tessel.Core.Targets;

namespace Tessel.Core.Tessellation.Yoshimura;

/// <summary>The Yoshimura family: a diamond pattern that folds to a barrel vault in closed form.</summary>
public sealed class YoshimuraFamily : TessellationFamily
{
    public override string Name => "yoshimura";
    public override string Summary => "barrel vaults and cylinders (one direction curved, K = 0), folded in closed form; parameters: rings along the axis, triangles across the arc, or cell size.";

    public override GeneratedPattern Generate(ITargetSurface target, FamilyParameters p) =>
        YoshimuraGenerator.Generate(target, Own(p));

    private static YoshimuraParameters Own(FamilyParameters p) => new(p.CellsY, p.CellsX, p.CellSize);

    /// <summary>A repair aims this far above the minimum fold, so that the fit keeps room to move (derived
    /// here, no source).</summary>
    public const double FoldMargin = 1.1;

    /// <summary>The closed form's shallowest folds are the ring creases (the triangle bases), and they
    /// deepen as the rings come closer: with R 3.5 m across a 4 m wide arc and 20 segments, 0.31, 0.62 and
    /// 1.24 deg at 10, 20 and 40 rings (measured on the generated pattern). So the repair raises the ring
    /// count (tessellation.cellsX) to the first that folds every crease <see cref="FoldMargin"/> times the
    /// minimum, up to <see cref="FollowEstimate.MaxSuggestedCells"/>; failing that it lowers the segment
    /// count (wider triangles fold their bases more).</summary>
    public override ShallowFoldRepair? DeepenShallowFolds(ITargetSurface target, FamilyParameters p, double minFoldAngle)
    {
        var (segments, rings) = YoshimuraGenerator.Counts(target, Own(p));
        double shallowest = ShallowestFold(Generate(target, p).Mesh);
        if (shallowest >= minFoldAngle) return null;
        var I = System.Globalization.CultureInfo.InvariantCulture;
        static double Deg(double rad) => rad * 180 / Math.PI;
        string why = string.Format(I, "the Yoshimura vault folds its shallowest creases only {0:0.##} deg at {1} rings x {2} segments (tessellation.cellsX x cellsY), under fitting.bounds.minFoldAngleDeg = {3:0.###} deg, and the fit cannot deepen the folds of this closed form",
            Deg(shallowest), rings, segments, Deg(minFoldAngle));
        // More rings first (the job's arc resolution kept), then fewer segments.
        var candidates = Enumerable.Range(rings + 1, Math.Max(0, FollowEstimate.MaxSuggestedCells - rings))
            .Select(r => (Parameters: p with { CellsX = r, CellsY = segments }, Change: $"tessellation.cellsX raised to {r} rings"))
            .Concat(Enumerable.Range(3, Math.Max(0, segments - 3)).Reverse()
                .Select(n => (Parameters: p with { CellsX = rings, CellsY = n }, Change: $"tessellation.cellsY lowered to {n} segments")));
        foreach (var (q, change) in candidates)
        {
            double s = ShallowestFold(Generate(target, q).Mesh);
            if (s >= FoldMargin * minFoldAngle)
                return new(q, string.Format(I, "{0}; {1} (shallowest fold {2:0.##} deg)", why, change, Deg(s)));
        }
        return new(null, string.Format(I, "{0}; no ring count up to {1} nor fewer segments reaches it: lower fitting.bounds.minFoldAngleDeg below {2:0.##} deg or choose another family",
            why, FollowEstimate.MaxSuggestedCells, Deg(shallowest)));
    }

    /// <summary>Smallest |fold angle| over the interior mountain and valley creases, radians.</summary>
    public static double ShallowestFold(Tessel.Core.Model.CreaseMesh mesh)
    {
        double least = double.PositiveInfinity;
        for (int e = 0; e < mesh.EdgeCount; e++)
            if (mesh.IsInterior(e) && mesh.EdgeRoles[e] is Tessel.Core.Model.CreaseRole.Mountain or Tessel.Core.Model.CreaseRole.Valley)
                least = Math.Min(least, Math.Abs(mesh.FoldAngle(e)));
        return least;
    }

    /// <summary>Not judged: the vault is built in closed form on the target's circle.</summary>
    public override double? TurnLimit(Footprint footprint, FamilyParameters p) => null;

    public override FamilyAdvice Judge(CurvatureFigures c)
    {
        var (dome, saddle, curved, k) = FamilyAdvice.Shape(c);
        if (dome || saddle) return new(Name, false, $"The target is doubly curved ({k}): a Yoshimura pattern folds to a cylinder (K = 0) and cannot follow it.", dome ? (saddle ? "free-triangulated" : "waterbomb") : "miura");
        if (!curved) return new(Name, false, $"The target is flat ({k}): a Yoshimura pattern folds to a vault and cannot lie flat.", "miura");
        if (c.BendsBothWays) return new(Name, false, $"The target bends both ways, like a wave (mean curvature from {c.MinMean:0.####} to {c.MaxMean:0.####} 1/m): a Yoshimura vault bends one way only.", "miura");
        return new(Name, true, $"The target is single-curved ({k}): a Yoshimura vault fits it, in closed form on a circular cylinder.", null);
    }

    /// <summary>Rings + 1 rows of vertices along the axis, alternately segments + 1 and segments long
    /// (the diamonds' corners are staggered by half a segment).</summary>
    public override double Vertices(double cellsX, double cellsY) =>
        Math.Ceiling((cellsX + 1) / 2) * (cellsY + 1) + Math.Floor((cellsX + 1) / 2) * cellsY;

    /// <summary>Degree-6 vertices, and more memory per vertex than a Miura sheet: Yoshimura 20 x 20 on a
    /// cylinder (431 vertices) peaked at 96.2 MB (<see cref="Jobs.MemoryEstimate"/> remarks), 2.6 times the
    /// Miura figures above the base; rounded up to 3 from that one measurement.</summary>
    public override double MemoryFactor => 3.0;

    /// <summary>A Yoshimura vault needs a circle across the footprint's centre.</summary>
    public override FamilyAdvice? CannotBuild(ITargetSurface target) =>
        YoshimuraGenerator.Problem(target) is { } problem
            ? new(Name, false, $"A Yoshimura pattern cannot be built on this target: {problem}.", "miura")
            : null;
}
