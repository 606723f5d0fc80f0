using Tessel.Core.Targets;

namespace Tessel.Core.Tessellation.Miura;

/// <summary>The Miura-ori family: a uniform zig-zag sheet that bends into saddles by itself.</summary>
public sealed class MiuraFamily : TessellationFamily
{
    public override string Name => "miura";
    public override string Summary => "saddles and anticlastic canopies (K < 0), waves and gentle single curvature; parameters: cells or cell size, sector angle, fold depth, orientation.";

    public override GeneratedPattern Generate(ITargetSurface target, FamilyParameters p) =>
        MiuraGenerator.Generate(target, ParametersOf(p));

    public override FamilyAdvice Judge(CurvatureFigures c)
    {
        var (dome, saddle, _, k) = FamilyAdvice.Shape(c);
        if (dome) return new(Name, false, $"The target is dome-like ({k}): a uniform Miura sheet bends into a saddle (K < 0), the opposite sign, so the fit will leave large shape error.", saddle ? "free-triangulated" : "waterbomb");
        return new(Name, true, $"The target is saddle-like or single-curved ({k}): Miura sheets bend this way naturally.", null);
    }

    /// <summary>Half-size sheets settle the sheet-wide mode that stalls the fit of large Miura sheets
    /// (measured on the benchmark saddle, see <see cref="Fitting.CoarseStart"/>).</summary>
    public override CoarserSheets? Coarser(ITargetSurface target, FamilyParameters p)
    {
        int cx, cy;
        try { (_, cx, cy) = MiuraGenerator.ResolveCell(target.Footprint, ParametersOf(p)); }
        catch (ArgumentException) { return null; }
        return new CoarserSheets(cx, cy, (nx, ny) => Generate(target,
            p with { CellsX = nx, CellsY = ny, CellSize = null, FoldDepth = p.FoldDepth * Math.Sqrt((double)cx / nx * cy / ny) }));
    }

    /// <summary>The facet tilt theta of the Miura cell (Schenk and Guest 2013; sin theta = H / (a sin gamma)).</summary>
    public override double? TurnLimit(Footprint footprint, FamilyParameters p) => MiuraTurnLimit(footprint, p);

    /// <summary>The Miura cell's facet tilt, shared with the reverse-curvature family.</summary>
    public static double MiuraTurnLimit(Footprint footprint, FamilyParameters p) =>
        MiuraGenerator.ResolveCell(footprint, ParametersOf(p)).Cell.Theta;

    /// <summary>The Miura-type parameters of the common set (shared with the reverse-curvature family).</summary>
    public static MiuraParameters ParametersOf(FamilyParameters p) =>
        new(p.CellsX, p.CellsY, p.CellSize, p.SectorAngleDeg, p.FoldDepth, p.OrientationDeg);
}
