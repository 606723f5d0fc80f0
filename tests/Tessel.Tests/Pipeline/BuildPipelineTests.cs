using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Pipeline;

namespace Tessel.Tests.Pipeline;

/// <summary>The whole pipeline on invented jobs (a rowing club's saddle canopy, a kiosk's dome), with no
/// image decoder and no type of the output project.</summary>
public class BuildPipelineTests
{
    private const string Saddle = """{ "kind": "formula", "formula": "x*y/8", "footprint": { "width": 3, "depth": 2 } }""";
    private const string Dome = """{ "kind": "formula", "formula": "0.5 - 0.2*(x^2 + y^2)", "footprint": { "width": 3, "depth": 2 } }""";

    private static Job JobFor(string target, string family, string fabrication, string fitting = "{}") => JobLoader.Parse($$"""
        { "name": "rowing-club-canopy", "seed": 3, "target": {{target}},
          "tessellation": { "family": "{{family}}", "cellsX": 4, "cellsY": 4 },
          "fabrication": {{fabrication}}, "fitting": {{fitting}},
          "outputs": { "obj": false, "png": false, "svg": true, "dxf": false, "pdf": false, "report": false } }
        """, "rowing-club-canopy.json", Path.GetTempPath());

    [Fact]
    public void CoreKnowsNoOutputProjectAndNoImageLibrary()
    {
        var references = typeof(BuildPipeline).Assembly.GetReferencedAssemblies().Select(a => a.Name!).ToArray();
        Assert.Contains("MathNet.Numerics", references);
        Assert.DoesNotContain(references, n => n == "Tessel.Output" || n.StartsWith("SkiaSharp", StringComparison.Ordinal));
    }

    [Fact]
    public void AYoshimuraVaultWithTooShallowFoldsIsBuiltWithMoreRingsAndSaysSo()
    {
        // The ferry shelter's vault (invented) at 18 x 18 cells: its closed form folds the ring creases
        // 0.52 deg, under the default 1 deg minimum. The tessellation raises the ring count before the fit
        // and the build finishes buildable with every fold within the bounds.
        var job = JobLoader.Parse("""
            { "name": "ferry-shelter", "seed": 2,
              "target": { "kind": "cylinder", "radius": 4.2, "rise": 1.2, "footprint": { "width": 5, "depth": 3.6 } },
              "tessellation": { "family": "yoshimura", "cellsX": 18, "cellsY": 18 },
              "fabrication": { "scale": 40, "sheet": { "name": "A1" } },
              "outputs": { "obj": false, "png": false, "svg": false, "dxf": false, "pdf": false, "report": false } }
            """, "ferry-shelter.json", Path.GetTempPath());
        var r = BuildPipeline.Run(job, null, ProgressReporter.Silent);

        Assert.Null(r.Problem);
        Assert.True(r.Fit.Fit.Buildable && r.Fit.Fit.Converged, r.Fit.Fit.StopReason);
        Assert.Equal(38, r.Tessellation.FoldRepair!.Parameters!.CellsX);
        Assert.Contains(r.Warnings, w => w.Contains("tessellation.cellsX raised to 38 rings", StringComparison.Ordinal));
        Assert.Equal(0, r.Checks!.FoldBounds!.Violations);
        Assert.InRange(r.Fit.Fit.Shape.Rms, 0, 1e-6); // the closed form lies on the cylinder
    }

    [Fact]
    public void AFitThatShortensCreasesUnderTheMinimumLengthensThemByARefit()
    {
        // A bandstand's shallow dome (invented) in reverse-curvature cells at 1:50: the drape's creases are
        // all over 3 mm on the model, but the fit shortens a few under it (measured: 3 of 312 at 6 x 6). A whole
        // refit holding the bound drifts off the constraints (2.6e-5 rad after 600 steps); restoring the
        // constraints alone lands, so the cells stay as asked.
        var job = JobLoader.Parse("""
            { "name": "bandstand", "seed": 1,
              "target": { "kind": "spherical-cap", "radius": 8, "rise": 1.1, "footprint": { "width": 4.6, "depth": 4.6 } },
              "tessellation": { "family": "reverse-curvature", "cellsX": 6, "cellsY": 6 },
              "fabrication": { "scale": 50, "sheet": { "name": "A3" } },
              "outputs": { "obj": false, "png": false, "svg": false, "dxf": false, "pdf": false, "report": false } }
            """, "bandstand.json", Path.GetTempPath());
        var r = BuildPipeline.Run(job, null, ProgressReporter.Silent);

        Assert.Null(r.Problem);
        Assert.True(r.Fit.Fit.Buildable);
        Assert.Equal((6, 6), (r.Job.Tessellation.CellsX!.Value, r.Job.Tessellation.CellsY!.Value));
        Assert.Contains(r.Warnings, w => w.Contains("lengthened to the minimum crease", StringComparison.Ordinal));
        Assert.Equal(0, r.Checks!.ShortCreaseCount);
        // Measured here: every interior edge of the fitted model, in mm at 1:50, within the fit's tolerance.
        var m = r.Fit.Fit.Mesh;
        for (int e = 0; e < m.EdgeCount; e++)
            if (m.IsInterior(e))
                Assert.True((m.Vertex(m.EdgeVertices[2 * e + 1]) - m.Vertex(m.EdgeVertices[2 * e])).Length * 1000 / 50 >= 3 * (1 - 1e-9));
    }

    [Fact]
    public void AResultThatStillMissesItsBoundsIsRefusedLikeAnUnbuildableFit()
    {
        // A kiosk's steep dome (invented) in a free net whose folds may not exceed 4 deg: every band refit
        // fails, so the build stops after the fit, names the bound and writes no sheets; accepting an
        // unconverged fit writes them with the miss among the warnings.
        const string text = """
            { "name": "kiosk", "seed": 1,
              "target": { "kind": "spherical-cap", "radius": 3, "rise": 1, "footprint": { "width": 3, "depth": 3 } },
              "tessellation": { "family": "free-triangulated", "cellsX": 6, "cellsY": 6 },
              "fitting": { "bounds": { "maxFoldAngleDeg": 4 } },
              "fabrication": { "scale": 20, "sheet": { "name": "A3" } },
              "outputs": { "obj": false, "png": false, "svg": true, "dxf": false, "pdf": false, "report": false } }
            """;
        var job = JobLoader.Parse(text, "kiosk.json", Path.GetTempPath());
        var r = BuildPipeline.Run(job, null, ProgressReporter.Silent);
        Assert.Equal(PipelineStop.UnbuildableFit, r.Stop);
        Assert.Contains("fold(s) outside fitting.bounds fold angles", r.Problem);
        Assert.Contains("maxFoldAngleDeg", r.Problem);
        Assert.Null(r.Sheets);

        var accepted = BuildPipeline.Run(job with { Fitting = job.Fitting with { AcceptUnconverged = true } }, null, ProgressReporter.Silent);
        Assert.Null(accepted.Problem);
        Assert.NotNull(accepted.Sheets);
        Assert.Contains(accepted.Warnings, w => w.StartsWith("the fit misses the job's bounds", StringComparison.Ordinal));
        Assert.True(accepted.Checks!.FoldBounds.AboveMaximum > 0);
    }

    [Fact]
    public void MiuraOnASaddleBuildsCompletelyWithoutWarnings()
    {
        var r = BuildPipeline.Run(JobFor(Saddle, "miura", """{ "scale": 20, "sheet": { "name": "A3" } }"""), null, ProgressReporter.Silent);

        Assert.Equal(PipelineStop.None, r.Stop);
        Assert.Null(r.Problem);
        Assert.Empty(r.Warnings);
        Assert.True(r.Fit.Fit.Buildable && r.Fit.Fit.Converged);
        Assert.Equal(81, r.Fit.Fit.Mesh.VertexCount); // (2 x 4 + 1)^2 vertices of 4 x 4 Miura cells
        // The fit's own Kawasaki residual stays under the job's constraint tolerance (fitting.tolerance, 1e-9).
        Assert.True(r.Fit.Fit.Residuals.MaxKawasaki <= r.Job.Fitting.Tolerance);
        // Kawasaki's theorem (Kawasaki 1989; Hull 1994): at every interior vertex of a flat-foldable crease
        // pattern the alternating sum of sector angles is 0. Measured here on the unfolded pattern, apart
        // from the fitter's residuals.
        Assert.True(MaxKawasakiSum(r.Unfolded!) < 1e-6);
        var checks = r.Checks!;
        Assert.Same(r.Unfolded, checks.Flat);
        Assert.Equal(1, checks.Rigidity.DegreesOfFreedom); // a Miura sheet folds with one degree of freedom (Tachi 2009)
        Assert.True(checks.Path.ReachedNearFlat);
        Assert.Equal(0, checks.CollisionCount);
        Assert.True(checks.Strain.MaxStrain < 1e-9);
        Assert.Equal(0.0008, checks.Strain.StrainLimit); // the card preset's limit (Sheets/Materials)
        Assert.Equal(1, r.Sheets!.Layout.Figures.SheetCount);
        Assert.Equal(1, r.Sheets.Layout.Figures.PartCount);
        Assert.Equal(20, r.Job.Fabrication.Scale);
    }

    [Fact]
    public void AutomaticScaleIsResolvedIntoTheResultJob()
    {
        var r = BuildPipeline.Run(JobFor(Saddle, "miura", """{ "scale": "auto", "sheet": { "name": "A4" } }"""), null, ProgressReporter.Silent);

        Assert.Equal(PipelineStop.None, r.Stop);
        Assert.True(r.Job.Fabrication.AutoScale);
        // Facets at least 10 x the 0.4 mm card (common practice, no source; Sheets/ScaleChooser): 1:10 does
        // not fit one A4 sheet, 1:20 does.
        Assert.Equal(20, r.Job.Fabrication.Scale);
        Assert.StartsWith("1:20: the parts fit 1 of 1 A4 sheet", r.Job.Fabrication.ScaleReason);
        Assert.Equal(1, r.Sheets!.Layout.Figures.SheetCount);
        Assert.Same(r.Unfolded, r.Checks!.Flat);
    }

    // Measured when the test was written: the Yoshimura fit on this dome ends at its iteration limit with
    // a developability residual of 7.1e-4 rad, far above the 1e-9 tolerance; a Yoshimura sheet folds to a
    // cylinder (K = 0) and cannot follow a dome (K > 0).
    [Fact]
    public void UnbuildableFitStopsAfterTheFitWithOneLineWhy()
    {
        var r = BuildPipeline.Run(JobFor(Dome, "yoshimura", """{ "scale": 20 }"""), null, ProgressReporter.Silent);

        Assert.Equal(PipelineStop.UnbuildableFit, r.Stop);
        Assert.False(r.Fit.Fit.Buildable);
        Assert.Null(r.Unfolded);
        Assert.Null(r.Checks);
        Assert.Null(r.Sheets);
        Assert.StartsWith("the fit is not buildable (", r.Problem);
        Assert.EndsWith("or pass --accept-unconverged", r.Problem);
        Assert.DoesNotContain('\n', r.Problem!);
        var advice = Assert.Single(r.Warnings);
        Assert.StartsWith("The target is doubly curved", advice);
    }

    [Fact]
    public void AcceptedUnbuildableFitRunsEveryStageAndSaysSoAfterTheAdvice()
    {
        var r = BuildPipeline.Run(JobFor(Dome, "yoshimura", """{ "scale": 20 }""", """{ "acceptUnconverged": true }"""), null, ProgressReporter.Silent);

        Assert.Equal(PipelineStop.None, r.Stop);
        Assert.Null(r.Problem);
        Assert.NotNull(r.Checks);
        Assert.NotNull(r.Sheets);
        Assert.StartsWith("The target is doubly curved", r.Warnings[0]);
        Assert.Contains(r.Warnings, w => w.StartsWith("the fit is not buildable (", StringComparison.Ordinal)
            && w.EndsWith("; outputs written because the job accepts an unconverged fit", StringComparison.Ordinal));
        int accepted = r.Warnings.ToList().FindIndex(w => w.EndsWith("accepts an unconverged fit", StringComparison.Ordinal));
        Assert.True(accepted >= 1);
    }

    /// <summary>Largest |alternating sum of sector angles| over vertices with no boundary crease and at
    /// least four folds, in the flat layout (flat creases left out: they are not folded).</summary>
    private static double MaxKawasakiSum(FlatPattern flat)
    {
        var folds = new List<int>[flat.VertexCount];
        var onBoundary = new bool[flat.VertexCount];
        for (int v = 0; v < folds.Length; v++) folds[v] = [];
        for (int e = 0; e < flat.EdgeCount; e++)
        {
            var (a, b) = flat.Edge(e);
            var role = flat.Role(e);
            if (role == CreaseRole.Boundary) { onBoundary[a] = onBoundary[b] = true; continue; }
            if (role is CreaseRole.Mountain or CreaseRole.Valley) { folds[a].Add(b); folds[b].Add(a); }
        }
        double worst = 0;
        int measured = 0;
        for (int v = 0; v < folds.Length; v++)
        {
            if (onBoundary[v] || folds[v].Count < 4) continue;
            var p = flat.Vertex(v);
            var angles = folds[v].Select(w => Math.Atan2(flat.Vertex(w).Y - p.Y, flat.Vertex(w).X - p.X)).Order().ToArray();
            double sum = 0;
            for (int i = 0; i < angles.Length; i++)
            {
                double sector = i + 1 < angles.Length ? angles[i + 1] - angles[i] : angles[0] + 2 * Math.PI - angles[i];
                sum += i % 2 == 0 ? sector : -sector;
            }
            worst = Math.Max(worst, Math.Abs(sum));
            measured++;
        }
        Assert.Equal(49, measured); // the 7 x 7 interior vertices of the 9 x 9 grid of 4 x 4 Miura cells
        return worst;
    }
}
