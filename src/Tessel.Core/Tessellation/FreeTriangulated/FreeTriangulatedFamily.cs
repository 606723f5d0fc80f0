using Tessel.Core.Targets;

namespace Tessel.Core.Tessellation.FreeTriangulated;

/// <summary>The free-triangulated family: a triangulated grid whose every vertex the fit may move.</summary>
public sealed class FreeTriangulatedFamily : TessellationFamily
{
    public override string Name => "free-triangulated";
    public override string Summary => "any shape, domes and saddles included, at the cost of an irregular fold layout; parameters: cells or cell size, flat-diagonal share.";

    public override GeneratedPattern Generate(ITargetSurface target, FamilyParameters p) =>
        FreeTriangulatedGenerator.Generate(target, new FreeTriangulatedParameters(p.CellsX, p.CellsY, p.CellSize, p.FlatDiagonalShare)
        {
            CorrugatedStart = p.BuildableStart && p.FlatDiagonalShare == 0,
        });

    public override double? TurnLimit(Footprint footprint, FamilyParameters p) => FollowEstimate.NetTurnLimit;

    /// <summary>One vertex layer: no fold depth.</summary>
    public override bool HasFoldDepth => false;

    public override FamilyAdvice Judge(CurvatureFigures c)
    {
        var (dome, saddle, curved, k) = FamilyAdvice.Shape(c);
        if (!dome && !saddle) return new(Name, true, $"Any shape works ({k}); for a single-curved target a Yoshimura or Miura pattern gives a tidier, regular fold layout.", curved ? "yoshimura" : "miura");
        return new(Name, true, $"Any shape works ({k}); expect shape error to grow with |K| times the cell area.", null);
    }

    /// <summary>One vertex per grid corner.</summary>
    public override double Vertices(double cellsX, double cellsY) => (cellsX + 1) * (cellsY + 1);
}
