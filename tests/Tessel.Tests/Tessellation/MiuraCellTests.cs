using Tessel.Core.Model;
using Tessel.Core.Tessellation;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Tests.Tessellation;

public class MiuraCellTests
{
    private static readonly double Deg = Math.PI / 180;

    [Fact]
    public void CheckValuesMatchSchenkGuest2013()
    {
        // Schenk & Guest, PNAS 110(9) 2013, formulas; values for a = b = 1, gamma = 60 deg,
        // theta = 45 deg evaluated from them (docs/reference/geometry.md section 2).
        var c = new MiuraCell(1, 1, 60 * Deg, 45 * Deg);
        Assert.Equal(0.6124, c.H, 4);
        Assert.Equal(0.7746, c.S, 4);
        Assert.Equal(0.7906, c.L, 4);
        Assert.Equal(0.6325, c.V, 4);
        Assert.Equal(-1.5000, c.PoissonRatioSL, 4);
        Assert.Equal(1.0, c.S * c.S + c.V * c.V, 12);
        Assert.Equal(1.0, c.L * c.L + c.H * c.H, 12);
    }

    [Fact]
    public void RegularSheetHasMiuraEdgeLengthsAndMaekawaRoles()
    {
        var cell = new MiuraCell(1.3, 0.9, 55 * Deg, 30 * Deg);
        var mesh = RegularMiuraSheet.Build(cell, 3, 2);
        int interiorVertex = RegularMiuraSheet.Index(2, 2, 3);
        int mountains = 0, valleys = 0;
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            var a = mesh.Vertex(mesh.EdgeVertices[2 * e]);
            var b = mesh.Vertex(mesh.EdgeVertices[2 * e + 1]);
            double len = (b - a).Length;
            Assert.True(Math.Abs(len - 1.3) < 1e-12 || Math.Abs(len - 0.9) < 1e-12, $"edge {e} length {len}");
            if (mesh.EdgeVertices[2 * e] == interiorVertex || mesh.EdgeVertices[2 * e + 1] == interiorVertex)
            {
                if (mesh.EdgeRoles[e] == CreaseRole.Mountain) mountains++;
                if (mesh.EdgeRoles[e] == CreaseRole.Valley) valleys++;
            }
        }
        // Maekawa-Justin theorem: |M - V| = 2 at a flat-foldable interior vertex (Kawasaki 1989, Justin 1986).
        Assert.Equal(4, mountains + valleys);
        Assert.Equal(2, Math.Abs(mountains - valleys));
    }
}
