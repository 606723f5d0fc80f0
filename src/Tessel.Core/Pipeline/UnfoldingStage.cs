using Tessel.Core.LinearAlgebra;
using Tessel.Core.Model;
using Tessel.Core.Unfolding;

namespace Tessel.Core.Pipeline;

/// <summary>Fifth stage: fitted mesh -> flat crease pattern: the fitted facets developed to the plane with the
/// smallest change of edge lengths.</summary>
public static class UnfoldingStage
{
    /// <exception cref="StageBreakdownError">The least-squares system of the development broke down.</exception>
    public static FlatPattern Run(CreaseMesh fitted, ProgressReporter progress)
    {
        progress.Stage("unfold", "developing the fitted pattern to the plane");
        FlatPattern flat;
        try { flat = MeshUnfolder.Unfold(fitted, new AutoSolver()); }
        catch (Exception e) when (e is NotPositiveDefiniteException or ArithmeticException)
        {
            throw new StageBreakdownError("unfold",
                $"unfolding broke down on the fitted model: {e.Message}; the fit left a degenerate or singular model, try other cell counts or cellSize", e);
        }
        double maxEdgeStrain = flat.EdgeStrain.Length == 0 ? 0 : flat.EdgeStrain.Max(Math.Abs);
        progress.Step($"largest edge length error {maxEdgeStrain * 100:0.####} %");
        return flat;
    }
}
