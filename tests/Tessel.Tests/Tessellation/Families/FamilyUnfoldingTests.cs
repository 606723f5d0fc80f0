using Tessel.Core.Fitting;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation.FreeTriangulated;
using Tessel.Core.Tessellation.Yoshimura;
using Tessel.Core.Unfolding;

namespace Tessel.Tests.Tessellation.Families;

public class FamilyUnfoldingTests
{
    [Fact]
    public void YoshimuraVaultUnfoldsToItsTriangleStrip()
    {
        var vault = new CylinderSurface(Footprint.Rectangle(1.6, 1.2), radius: 1.0, rise: 0.8);
        var p = new YoshimuraParameters(Segments: 6, Rings: 8);
        var ring = YoshimuraGenerator.RingFor(vault, p);
        var flat = MeshUnfolder.Unfold(YoshimuraGenerator.Generate(vault, p).Mesh);
        Assert.InRange(flat.EdgeStrain.Max(Math.Abs), 0, 1e-9);
        // Flat rows are straight lines h apart (Yoshimura 1955 strip): every diagonal spans h across
        // the rows and w/2 along them.
        for (int e = 0; e < flat.EdgeCount; e++)
        {
            var (a, b) = flat.Edge(e);
            double len = (flat.Vertex(b) - flat.Vertex(a)).Length;
            Assert.True(Math.Abs(len - ring.Chord) < 1e-9 || Math.Abs(len - ring.Diagonal) < 1e-9, $"edge {e}: {len}");
        }
    }

    [Fact]
    public void FittedFreeNetUnfoldsWithoutStrain()
    {
        var saddle = new HyperbolicParaboloidSurface(Footprint.Rectangle(1.0, 1.0), c: 1.5);
        var r = MultiStartFitter.Fit(FreeTriangulatedGenerator.Generate(saddle, new FreeTriangulatedParameters(6, 6)), saddle, new FitSettings { Seed = 1 });
        var flat = MeshUnfolder.Unfold(FreeTriangulatedGenerator.RelabelFolds(r.Mesh));
        Assert.InRange(flat.EdgeStrain.Max(Math.Abs), 0, 1e-9);
    }
}
