using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Tests.Tessellation;

public class MiuraGeneratorTests
{
    private static readonly ITargetSurface Saddle = new HyperbolicParaboloidSurface(Footprint.Rectangle(1.2, 1.0), c: 3);

    [Fact]
    public void DrapedLayersSitOnTargetAndOffsetSurface()
    {
        var g = MiuraGenerator.Generate(Saddle, new MiuraParameters(CellsX: 6, CellsY: 5, SectorAngleDeg: 60, FoldDepth: 0.02));
        var m = g.Mesh;
        Assert.Equal(13 * 11, m.VertexCount);
        Assert.Equal(0.02, g.LayerOffset);
        for (int v = 0; v < m.VertexCount; v++)
        {
            var p = m.Vertex(v);
            double z = Saddle.HeightAt(p.X, p.Y);
            if (m.Layers[v] == VertexLayer.Top) Assert.Equal(z, p.Z, 12);
            else
            {
                // Bottom vertex = surface point above its plan position minus d n there: its distance to
                // the draped plan point is exactly d.
                var sp = Saddle.ClosestPoint(p);
                Assert.InRange(sp.SignedDistance, -0.0201, -0.0199);
            }
        }
        Assert.Equal(VertexLayer.Top, m.Layers[g.AnchorVertex]);
        Assert.Equal(0, g.FairnessStencils.Length % 3);
    }

    [Fact]
    public void RegularCellMatchesRequestedDepthAngleAndFootprint()
    {
        var fp = Footprint.Rectangle(2.0, 1.6);
        var (cell, cx, cy) = MiuraGenerator.ResolveCell(fp, new MiuraParameters(CellsX: 10, CellsY: 8, SectorAngleDeg: 55, FoldDepth: 0.04));
        Assert.Equal((10, 8), (cx, cy));
        Assert.Equal(0.04, cell.H, 12);
        Assert.Equal(0.1, cell.S, 12);
        Assert.Equal(0.1, cell.L, 12);
        Assert.Equal(55 * Math.PI / 180, cell.Gamma, 12);
        // Schenk & Guest (PNAS 2013): S^2 + V^2 = b^2, L^2 + H^2 = a^2.
        Assert.Equal(cell.B * cell.B, cell.S * cell.S + cell.V * cell.V, 12);
        Assert.Equal(cell.A * cell.A, cell.L * cell.L + cell.H * cell.H, 12);
    }

    [Fact]
    public void CellCountFollowsCellSizeAndOrientationWidensTheCover()
    {
        var fp = Footprint.Rectangle(2.0, 1.0);
        var (_, cx, cy) = MiuraGenerator.ResolveCell(fp, new MiuraParameters(CellSize: 0.25, FoldDepth: 0.03));
        Assert.Equal((8, 4), (cx, cy));
        // Turned by 90 degrees the zig-zag runs along the footprint's short side.
        var (_, tx, ty) = MiuraGenerator.ResolveCell(fp, new MiuraParameters(CellSize: 0.25, FoldDepth: 0.03, OrientationDeg: 90));
        Assert.Equal((4, 8), (tx, ty));
    }

    [Theory]
    [InlineData(0.0, 0.03, null, "SectorAngleDeg")]
    [InlineData(90.0, 0.03, null, "SectorAngleDeg")]
    [InlineData(60.0, 0.0, null, "FoldDepth")]
    [InlineData(60.0, -0.01, null, "FoldDepth")]
    [InlineData(60.0, 0.03, 5.0, "CellSize")]
    [InlineData(60.0, 0.5, 0.25, "FoldDepth")]
    public void ImpossibleParametersGiveAClearError(double angle, double depth, double? cellSize, string parameter)
    {
        var p = new MiuraParameters(CellSize: cellSize ?? 0.2, SectorAngleDeg: angle, FoldDepth: depth);
        var ex = Assert.Throws<ArgumentException>(() => MiuraGenerator.Generate(Saddle, p));
        Assert.Equal(parameter, ex.ParamName);
        Assert.Contains(parameter, ex.Message);
    }
}
