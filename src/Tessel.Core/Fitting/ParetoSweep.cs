using Tessel.Core.LinearAlgebra;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Fitting;

/// <summary>One point of the shape-error / developability trade-off.</summary>
/// <param name="EpsilonDeg">The developability bound of this fit, degrees.</param>
/// <param name="ShapeRms">RMS distance to the surfaces, metres.</param>
/// <param name="ShapeMax">Largest distance, metres.</param>
public sealed record ParetoPoint(double EpsilonDeg, double ShapeRms, double ShapeMax, double Objective,
    double MaxDevelopability, double MaxKawasaki, double MaxPlanarity, bool Converged);

/// <summary>Sweep mode of the epsilon-constraint method (Haimes, Lasdon &amp; Wismer 1971): fits for a
/// list of epsilon values, each warm-started from the previous result, giving the Pareto front as data.
/// A pattern's own <see cref="GeneratedPattern.InitialPenalty"/> replaces the settings' one.</summary>
public static class ParetoSweep
{
    /// <summary>Fits at each epsilon in the given order (sort them so neighbours are close) and
    /// returns the front and the fitted results.</summary>
    public static (IReadOnlyList<ParetoPoint> Front, IReadOnlyList<FitResult> Fits) Run(GeneratedPattern pattern,
        ITargetSurface target, FitSettings settings, IReadOnlyList<double> epsilonsDeg, ISpdSolver? solver = null)
    {
        var front = new List<ParetoPoint>(); var fits = new List<FitResult>();
        double[]? start = null;
        foreach (double eps in epsilonsDeg)
        {
            var s = settings.For(pattern) with { EpsilonDeg = eps };
            var r = EpsilonConstraintFitter.Fit(pattern, target, s, solver, start);
            start = r.Mesh.Positions;
            fits.Add(r);
            front.Add(new ParetoPoint(eps, r.Shape.Rms, r.Shape.Max, r.Objective, r.Residuals.MaxDevelopability,
                r.Residuals.MaxKawasaki, r.Residuals.MaxPlanarity, r.Converged));
        }
        return (front, fits);
    }
}
