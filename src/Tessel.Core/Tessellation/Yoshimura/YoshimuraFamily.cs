using Tessel.Core.Targets;

namespace Tessel.Core.Tessellation.Yoshimura;

/// <summary>The Yoshimura family: a diamond pattern that folds to a barrel vault in closed form.</summary>
public sealed class YoshimuraFamily : TessellationFamily
{
    public override string Name => "yoshimura";
    public override string Summary => "barrel vaults and cylinders (one direction curved, K = 0), folded in closed form; parameters: rings along the axis, triangles across the arc, or cell size.";

    public override GeneratedPattern Generate(ITargetSurface target, FamilyParameters p) =>
        YoshimuraGenerator.Generate(target, new YoshimuraParameters(p.CellsY, p.CellsX, p.CellSize));

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
