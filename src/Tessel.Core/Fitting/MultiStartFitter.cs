using Tessel.Core.LinearAlgebra;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Fitting;

/// <summary>Runs <see cref="FitSettings.Starts"/> fits in parallel from seeded perturbations of the
/// interior vertices along the target normal and keeps the best. Deterministic: start k draws from a
/// generator seeded by (Seed, k) alone, each start owns all its state, and the winner is the lowest
/// objective among buildable starts, finished ones first (then among all), ties broken by the lower start index. A pattern's
/// own <see cref="GeneratedPattern.InitialPenalty"/> replaces the settings' one.</summary>
public static class MultiStartFitter
{
    /// <param name="solverFactory">Makes one SPD solver per start; default <see cref="EpsilonConstraintFitter.DefaultSolver"/>.</param>
    /// <param name="from">Positions (#V*3) the starts perturb instead of the drape (a coarse start), or null.</param>
    public static FitResult Fit(GeneratedPattern pattern, ITargetSurface target, FitSettings settings,
        Func<ISpdSolver>? solverFactory = null, double[]? from = null)
    {
        settings = settings.For(pattern);
        int starts = Math.Max(1, settings.Starts);
        var rows = new FitRows(pattern, target, pattern.LayerOffset, settings);
        var results = new FitResult[starts];
        Parallel.For(0, starts, k =>
        {
            var start = PerturbedStart(pattern.Mesh, target, rows.Scale * settings.StartPerturbation, settings.Seed, k, from);
            results[k] = EpsilonConstraintFitter.FitWithRows(pattern, rows, settings,
                solverFactory?.Invoke() ?? EpsilonConstraintFitter.DefaultSolver(), start);
        });
        int best = 0;
        for (int k = 1; k < starts; k++)
        {
            var a = results[k]; var b = results[best];
            if (a.Buildable != b.Buildable ? a.Buildable : a.Converged != b.Converged ? a.Converged : a.Objective < b.Objective) best = k;
        }
        var spread = new StartSpread(best, results.Select(r => r.Objective).ToArray(), results.Select(r => r.Converged).ToArray());
        return results[best] with { Spread = spread };
    }

    /// <summary>#V*3 start positions: interior vertices moved along the target normal by a normal
    /// deviate of standard deviation <paramref name="sigma"/> metres (Box-Muller on a seeded generator).</summary>
    public static double[] PerturbedStart(CreaseMesh mesh, ITargetSurface target, double sigma, int seed, int startIndex, double[]? from = null)
    {
        var pos = (double[])(from ?? mesh.Positions).Clone();
        if (sigma <= 0) return pos;
        var random = new Random(unchecked(seed * 1_000_003 + startIndex * 7919 + 17));
        var boundary = mesh.BoundaryVertices();
        for (int v = 0; v < mesh.VertexCount; v++)
        {
            double u1 = 1 - random.NextDouble(), u2 = random.NextDouble();
            double g = Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
            if (boundary[v]) continue;
            var p = Vec3.Read(pos, v);
            (p + sigma * g * target.NormalAt(p.X, p.Y)).Write(pos, v);
        }
        return pos;
    }
}
