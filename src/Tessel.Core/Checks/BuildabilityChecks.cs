using System.Diagnostics;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;

namespace Tessel.Core.Checks;

/// <summary>Runs every buildability check on a folded mesh (and its flat layout when given).</summary>
public static class BuildabilityChecks
{
    public static BuildabilityResult Run(CreaseMesh mesh, FlatPattern? flat = null, BuildabilitySettings? settings = null)
    {
        settings ??= new BuildabilitySettings();
        var rigidity = RigidityAnalysis.DegreesOfFreedom(mesh, settings.Rigidity);

        FoldingPathResult? path = null;
        string flatStop = "not simulated", foldStop = "not simulated";
        var pathClock = Stopwatch.StartNew();
        if (settings.SimulatePath)
        {
            try
            {
                path = RigidFoldingPath.Simulate(mesh, settings.Folding);
                flatStop = path.StopTowardFlat; foldStop = path.StopTowardFolded;
            }
            catch (ArgumentException e)
            {
                flatStop = foldStop = e.Message;
            }
        }
        double pathSeconds = pathClock.Elapsed.TotalSeconds;

        var collisionClock = Stopwatch.StartNew();
        var collisions = PanelCollisions.Find(mesh);
        var pathCollisions = path != null ? PanelCollisions.AlongPath(mesh, path) : [];
        double collisionSeconds = collisionClock.Elapsed.TotalSeconds;

        var strainClock = Stopwatch.StartNew();
        var strain = flat != null ? FlatLayoutStrain.Measure(flat, settings.StrainLimit) : null;
        double maxVertexStrain = strain?.MaxVertexAngleStrain ?? FlatLayoutStrain.VertexAngleStrain(mesh).DefaultIfEmpty(0).Max();
        double strainSeconds = strainClock.Elapsed.TotalSeconds;

        var summary = new BuildabilityReport(
            rigidity.DegreesOfFreedom, rigidity.RankTolerance, rigidity.SmallestKeptSingularValue,
            rigidity.LargestDroppedSingularValue, rigidity.GapRatio, rigidity.Method,
            path != null, path?.MaxBarStrain ?? double.NaN, path?.ReachedNearFlat ?? false,
            path?.LowestProgress ?? double.NaN, path?.HighestProgress ?? double.NaN, flatStop, foldStop,
            collisions.Count, collisions.Pairs,
            pathCollisions.Where(f => f.Collisions.Count > 0).Select(f => f.Progress).ToArray(),
            strain != null, strain?.MaxStrain ?? double.NaN, settings.StrainLimit, strain?.FacetsOverLimit ?? [],
            maxVertexStrain, rigidity.Elapsed.TotalSeconds, pathSeconds, collisionSeconds, strainSeconds);
        return new BuildabilityResult(summary, rigidity, path, collisions, pathCollisions, strain);
    }
}
