using Tessel.Core.Targets;

namespace Tessel.Core.Tessellation.Waterbomb;

/// <summary>The waterbomb family: degree-6 bases that roll into tubes and, graded, into domes.</summary>
public sealed class WaterbombFamily : TessellationFamily
{
    public override string Name => "waterbomb";
    public override string Summary => "domes and tubes (K >= 0): uniform bases roll into a tube, the fit grades them into a dome; parameters: bases per row and rows (cells), or cell size, fold depth.";

    public override GeneratedPattern Generate(ITargetSurface target, FamilyParameters p) =>
        WaterbombGenerator.Generate(target, new WaterbombParameters(p.CellsX, p.CellsY, p.CellSize, p.FoldDepth));

    /// <summary>atan(2 d / base) for a base whose centre stands d above its grid lines.</summary>
    public override double? TurnLimit(Footprint footprint, FamilyParameters p)
    {
        double size = Math.Min(footprint.Width / p.CellsX!.Value, footprint.Depth / p.CellsY!.Value);
        return p.FoldDepth > 0 ? Math.Atan(2 * p.FoldDepth / size) : null;
    }

    public override FamilyAdvice Judge(CurvatureFigures c)
    {
        var (dome, saddle, curved, k) = FamilyAdvice.Shape(c);
        if (saddle) return new(Name, false, $"The target has saddle regions ({k}): waterbomb bases suit domes and tubes (K >= 0); on a saddle expect a larger shape error.", dome ? "free-triangulated" : "miura");
        if (dome) return new(Name, true, $"The target is dome-like ({k}): the fit grades the waterbomb bases to follow it.", null);
        if (curved) return new(Name, true, $"The target is single-curved ({k}): uniform waterbomb bases roll into a tube or vault.", null);
        return new(Name, true, $"The target is flat ({k}): a waterbomb sheet fits it, though it tends to roll; a Miura sheet stays flat more readily.", null);
    }

    /// <summary>Grid-line vertices plus one centre per base (odd rows end in two half bases).</summary>
    public override double Vertices(double cellsX, double cellsY) =>
        (2 * cellsX + 1) * (cellsY + 1) + cellsX * cellsY + Math.Floor(cellsY / 2);

    /// <summary>Degree-6 vertices carry more constraints: waterbomb 20 x 20 on a dome (1,271 vertices)
    /// peaked at 134 MB, which this factor on the Miura figures covers.</summary>
    public override double MemoryFactor => 1.5;

    /// <summary>Bases have no sector angle: their centres start a fifth of the base above the grid
    /// lines, the depth the generator's messages recommend.</summary>
    public override double DefaultFoldDepth(double cellX, double cellY, double sectorAngleDeg) => 0.2 * Math.Min(cellX, cellY);
}
