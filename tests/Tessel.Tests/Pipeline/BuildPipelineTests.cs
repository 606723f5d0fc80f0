using Tessel.Core.Jobs;
using Tessel.Core.Pipeline;
using Xunit.Abstractions;

namespace Tessel.Tests.Pipeline;

/// <summary>The whole pipeline on invented jobs, with no image decoder and no output types.</summary>
public class BuildPipelineTests(ITestOutputHelper log)
{
    private static Job ShelterVault(string extra = "") => JobLoader.Parse("""
        { "name": "ferry-shelter-vault", "seed": 3,
          "target": { "kind": "formula", "formula": "0.4 - 0.06*x^2", "footprint": { "width": 3, "depth": 2 } },
          "tessellation": { "family": "yoshimura", "cellsX": 4, "cellsY": 4 },
          "fabrication": { "scale": 20, "sheet": { "name": "A3" } },
          "outputs": { "obj": false, "png": false, "svg": true, "dxf": false, "pdf": false, "report": false }
        """ + extra + "}", "ferry-shelter-vault.json", Path.GetTempPath());

    [Fact]
    public void Probe()
    {
        var r = BuildPipeline.Run(ShelterVault(), null, ProgressReporter.Silent);
        var f = r.Fit.Fit;
        log.WriteLine($"stop {r.Stop} problem {r.Problem} buildable {f.Buildable} conv {f.Converged} K {f.Residuals.MaxKawasaki:E3} D {f.Residuals.MaxDevelopability:E3} P {f.Residuals.MaxPlanarity:E3} maxviol {f.Residuals.MaxConstraintViolation:E3} tol {r.Job.Fitting.Tolerance}");
        log.WriteLine($"sheets {r.Sheets?.Layout.Figures.SheetCount} parts {r.Sheets?.Layout.Figures.PartCount} verts {f.Mesh.VertexCount} dof {r.Checks?.Rigidity.DegreesOfFreedom} coll {r.Checks?.CollisionCount} strain {r.Checks?.Strain.MaxStrain:E3} short {r.Checks?.ShortEdgeCount} path {r.Checks?.Path.ReachedNearFlat}");
        foreach (var w in r.Warnings) log.WriteLine("W: " + w);
    }
}
