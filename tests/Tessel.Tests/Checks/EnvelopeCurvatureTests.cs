using Tessel.Core.Fitting;
using Tessel.Core.Checks;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation.Miura;
using Tessel.Core.Tessellation.ReverseCurvature;
using Tessel.Tests.Fitting;

namespace Tessel.Tests.Checks;

/// <summary>The envelope-curvature check that the build reports for Miura-type families.</summary>
public class EnvelopeCurvatureTests
{
    [Fact]
    public void FittedMiuraSaddleHasAnAnticlasticEnvelope()
    {
        // A Miura sheet bent out of plane forms a saddle, K < 0 (Wei, Guo, Dudte, Liang & Mahadevan,
        // PRL 110, 2013; docs/reference/geometry.md section 2): every interior envelope defect must be negative.
        var (pattern, target) = SaddleCase.Make(6);
        var fit = EpsilonConstraintFitter.Fit(pattern, target, new FitSettings { StartPerturbation = 0 });
        Assert.True(fit.Converged, fit.StopReason);
        Assert.NotNull(pattern.Envelope);
        Assert.False(pattern.PromisesSynclasticEnvelope);
        var curvature = EnvelopeCurvature.Of(pattern.Envelope!(fit.Mesh))!;
        Assert.Equal((6 - 2) * (6 - 1), curvature.Interior);
        Assert.Equal(0, curvature.Positive);
        Assert.True(curvature.MaxDefect < 0, $"largest defect {curvature.MaxDefect}");
        Assert.False(curvature.Synclastic);
    }

    [Fact]
    public void FittedReverseCurvatureDomePromisesAndKeepsASynclasticEnvelope()
    {
        // docs/reference/geometry.md section 3: the family's acceptance is a positive defect at every interior envelope vertex.
        var dome = new SphericalCapSurface(Footprint.Rectangle(1.0, 1.0), 4.0, 0.3);
        var pattern = ReverseCurvatureGenerator.Generate(dome, new ReverseCurvatureParameters(new MiuraParameters(CellsX: 4, CellsY: 4, SectorAngleDeg: 60, FoldDepth: 0.06), 0));
        Assert.True(pattern.PromisesSynclasticEnvelope);
        var fit = MultiStartFitter.Fit(pattern, dome, new FitSettings { Seed = 1 });
        Assert.True(fit.Converged, fit.StopReason);
        var curvature = EnvelopeCurvature.Of(pattern.Envelope!(fit.Mesh))!;
        Assert.True(curvature.Synclastic, $"defects {curvature.MinDefect} .. {curvature.MaxDefect}");
        Assert.Equal(curvature.Interior, curvature.Positive);
    }
}
