using Tessel.Core.Targets;
using Tessel.Core.Tessellation.FreeTriangulated;
using Tessel.Core.Tessellation.Miura;
using Tessel.Core.Tessellation.ReverseCurvature;
using Tessel.Core.Tessellation.Waterbomb;
using Tessel.Core.Tessellation.Yoshimura;

namespace Tessel.Core.Tessellation;

/// <summary>One entry point from a family name (as in the job file) to its generator. Every family
/// returns a <see cref="GeneratedPattern"/> that the common fitter, checks and unfolder take as is.</summary>
public static class FamilyGenerators
{
    /// <summary>Family names this build can generate, in the order the documentation lists them.</summary>
    public static readonly string[] Names = ["miura", "reverse-curvature", "yoshimura", "waterbomb", "free-triangulated"];

    /// <summary>Builds the named family on the target. Throws <see cref="ArgumentException"/> for an unknown
    /// family (naming the known ones) and for parameters the family cannot use.</summary>
    public static GeneratedPattern Generate(string family, ITargetSurface target, FamilyParameters p) =>
        family switch
        {
            "miura" => MiuraGenerator.Generate(target, Miura(p)),
            "reverse-curvature" => ReverseCurvatureGenerator.Generate(target, new ReverseCurvatureParameters(Miura(p), p.Grading)),
            "yoshimura" => YoshimuraGenerator.Generate(target, new YoshimuraParameters(p.CellsY, p.CellsX, p.CellSize)),
            "free-triangulated" => FreeTriangulatedGenerator.Generate(target, new FreeTriangulatedParameters(p.CellsX, p.CellsY, p.CellSize, p.FlatDiagonalShare) { CorrugatedStart = p.BuildableStart && p.FlatDiagonalShare == 0 }),
            "waterbomb" => WaterbombGenerator.Generate(target, new WaterbombParameters(p.CellsX, p.CellsY, p.CellSize, p.FoldDepth)),
            _ => throw new ArgumentException($"unknown family '{family}'; known families: {string.Join(", ", Names)}", nameof(family)),
        };

    private static MiuraParameters Miura(FamilyParameters p) =>
        new(p.CellsX, p.CellsY, p.CellSize, p.SectorAngleDeg, p.FoldDepth, p.OrientationDeg);
}
