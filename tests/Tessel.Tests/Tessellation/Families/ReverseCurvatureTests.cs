using Tessel.Core.Fitting;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;
using Tessel.Core.Tessellation.Miura;
using Tessel.Core.Tessellation.ReverseCurvature;

namespace Tessel.Tests.Tessellation.Families;

public class ReverseCurvatureTests
{
    private static readonly SphericalCapSurface Dome = new(Footprint.Rectangle(1.0, 1.0), 4.0, 0.3);
    private static readonly MiuraParameters Sheet = new(CellsX: 4, CellsY: 4, SectorAngleDeg: 60, FoldDepth: 0.06);

    [Fact]
    public void GradingWidensTheZigZagTowardTheCorners()
    {
        var uniform = ReverseCurvatureGenerator.Generate(Dome, new ReverseCurvatureParameters(Sheet, 0));
        var graded = ReverseCurvatureGenerator.Generate(Dome, new ReverseCurvatureParameters(Sheet, 0.5));
        var (cell, _, _) = MiuraGenerator.ResolveCell(Dome.Footprint, Sheet);
        Assert.Equal(FamilyConstraints.All, graded.Constraints);
        Assert.Equal("reverse-curvature", graded.Mesh.Family);
        // Top-layer zig-zag vertex (i = 1, j = 1) near a corner: r^2 = ((1-4)/4)^2 * 2 / 2 = 0.5625
        // (derived here), so it moves across the zig-zag by 0.5 * 0.5625 V in plan.
        var a = uniform.Mesh.Vertex(9 + 1); var b = graded.Mesh.Vertex(9 + 1);
        Assert.Equal(VertexLayer.Top, graded.Mesh.Layers[10]);
        Assert.Equal(0.5 * 0.5625 * cell.V, b.Y - a.Y, 9);
        Assert.Equal(a.X, b.X, 12);
        var ex = Assert.Throws<ArgumentException>(() => ReverseCurvatureGenerator.Generate(Dome, new ReverseCurvatureParameters(Sheet, 5)));
        Assert.Equal("Grading", ex.ParamName);
    }

    [Fact]
    public void FitOnTheDomeIsDevelopableFlatFoldableAndPlanar()
    {
        var g = ReverseCurvatureGenerator.Generate(Dome, new ReverseCurvatureParameters(Sheet, 0.3));
        var r = MultiStartFitter.Fit(g, Dome, new FitSettings { Seed = 1 });
        Assert.True(r.Converged, r.StopReason);
        Assert.InRange(r.Residuals.MaxDevelopability, 0, 1e-9);
        Assert.InRange(r.Residuals.MaxKawasaki, 0, 1e-9);
        Assert.InRange(r.Residuals.MaxPlanarity, 0, 1e-9);
        // The draped envelope through the top vertices carries the dome's curvature: K A = 0.25^2 / 16
        // = 0.0039 rad at each interior vertex (Gauss-Bonnet, R = 4 m, 0.25 m cells).
        var draped = AngleDefects.PerVertex(ReverseCurvatureGenerator.TopEnvelope(g.Mesh, 4, 4));
        var boundary = ReverseCurvatureGenerator.TopEnvelope(g.Mesh, 4, 4).BoundaryVertices();
        for (int v = 0; v < draped.Length; v++) if (!boundary[v]) Assert.Equal(0.0039, draped[v], 4);
    }
}
