using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Pipeline;
using Tessel.Tests.Checks;

namespace Tessel.Tests.Pipeline;

public class ChecksStageTests
{
    private static readonly Job Job = JobLoader.Parse("""
        { "target": { "kind": "plane", "footprint": { "width": 2, "depth": 2 } },
          "fabrication": { "scale": 10 } }
        """, "checks.json", Path.GetTempPath());

    [Fact]
    public void MiuraWithExactLayoutPassesEveryCheck()
    {
        var folded = CheckMeshes.Miura(2, 2, thetaDeg: 35);
        var flat3 = CheckMeshes.Miura(2, 2, thetaDeg: 0).Positions; // Schenk & Guest 2013 flat state
        var flat2 = new double[folded.VertexCount * 2];
        for (int v = 0; v < folded.VertexCount; v++) { flat2[2 * v] = flat3[3 * v]; flat2[2 * v + 1] = flat3[3 * v + 1]; }

        var model = ChecksStage.FoldedModel(Job, folded, ProgressReporter.Silent);
        Assert.Equal(1, model.Rigidity.DegreesOfFreedom); // Tachi 2009
        Assert.True(model.Path.ReachedNearFlat);
        Assert.True(model.Path.MaxBarStrain < 1e-9);
        Assert.Equal(1.25, model.Path.HighestProgress, 12);
        Assert.Equal(0, model.FittedCollisions.Count);
        Assert.All(model.PathCollisions, f => Assert.Empty(f.Collisions.Pairs));
        Assert.Equal(0, model.FoldBounds.Violations);

        var checks = ChecksStage.FlatLayout(model, new FlatPattern(folded, flat2, new double[folded.EdgeCount]), 0.0008, ProgressReporter.Silent);
        Assert.Equal(0, checks.CollisionCount);
        Assert.True(checks.Strain.MaxStrain < 1e-12);
        Assert.Empty(checks.Strain.FacetsOverLimit);
        Assert.True(checks.Strain.MaxVertexAngleStrain < 1e-12);
        Assert.Equal(0.0008, checks.Strain.StrainLimit);
    }

    [Fact]
    public void FlatModelIsItsOwnFlatStateNotAnError()
    {
        var model = ChecksStage.FoldedModel(Job, CheckMeshes.Miura(2, 2, thetaDeg: 0), ProgressReporter.Silent);
        Assert.True(model.Path.ReachedNearFlat);
        Assert.Contains("no fold", model.Path.StopTowardFlat);
        Assert.True(model.Rigidity.DegreesOfFreedom > 1); // flat state: branch point with extra infinitesimal mobility
    }
}
