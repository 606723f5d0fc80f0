using Tessel.Core.Fitting;
using Tessel.Core.LinearAlgebra;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Tests.Fitting;

/// <summary>Shared test cases: Miura sheets on the saddle z = x y / c (fitted once, used by the
/// fitting and unfolding tests).</summary>
public static class SaddleCase
{
    /// <summary>cells x cells Miura, 0.1 m cells, 60 deg, depth 0.03 m, on z = x y / (0.25 * cells).</summary>
    public static (GeneratedPattern Pattern, ITargetSurface Target) Make(int cells)
    {
        double size = 0.1 * cells;
        var target = new HyperbolicParaboloidSurface(Footprint.Rectangle(size, size), c: 2.5 * size);
        var pattern = MiuraGenerator.Generate(target, new MiuraParameters(CellsX: cells, CellsY: cells, SectorAngleDeg: 60, FoldDepth: 0.03));
        return (pattern, target);
    }

    private static readonly Lazy<FitResult> _fit24 = new(() =>
    {
        var (pattern, target) = Make(24);
        return EpsilonConstraintFitter.Fit(pattern, target, new FitSettings { StartPerturbation = 0 }, new SupernodalCholeskySolver());
    });

    /// <summary>The 24 x 24 saddle fitted at epsilon = 0.</summary>
    public static FitResult Fit24 => _fit24.Value;
}
