using Tessel.Core.Targets;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Core.Tessellation.ReverseCurvature;

/// <summary>A Miura-type sheet for domes: its cells start graded and the fit grades them further.</summary>
public sealed class ReverseCurvatureFamily : TessellationFamily
{
    public override string Name => "reverse-curvature";
    public override string Summary => "domes and synclastic shells (K > 0) as a Miura-type sheet whose cells the fit grades; parameters as miura. On steep domes the fit can fail to converge: then try another fold depth (about half a cell's half-length) or more cells.";

    /// <summary>The start's grading stays the generator's default: the fit grades the cells to the
    /// target, so the start's grading only moves where the fit begins.</summary>
    public override GeneratedPattern Generate(ITargetSurface target, FamilyParameters p) =>
        ReverseCurvatureGenerator.Generate(target, new ReverseCurvatureParameters(MiuraFamily.ParametersOf(p)));

    /// <summary>As a Miura sheet's: the graded cells start from the same facet tilt.</summary>
    public override double? TurnLimit(Footprint footprint, FamilyParameters p) => MiuraFamily.MiuraTurnLimit(footprint, p);

    public override FamilyAdvice Judge(CurvatureFigures c)
    {
        var (dome, saddle, curved, k) = FamilyAdvice.Shape(c);
        if (saddle && !dome) return new(Name, false, $"The target is saddle-like ({k}): a reverse-curvature sheet is made for K > 0; a plain Miura sheet bends to K < 0 by itself.", "miura");
        if (!dome) return new(Name, false, $"The target is single-curved or flat ({k}): no grading is needed.", curved ? "yoshimura" : "miura");
        return new(Name, true, $"The target is dome-like ({k}), the case this family is meant for; check its envelope defects after the fit.", null);
    }
}
