using Tessel.Core.Model;
using Tessel.Core.Tessellation;
using Tessel.Core.Tessellation.Miura;
using Tessel.Core.Unfolding;

namespace Tessel.Tests.Sheets;

/// <summary>Test input: a regular Miura sheet developed flat (theta = 0), with mountain/valley roles taken
/// from the same sheet partly folded, so the flat pattern has real creases of both roles.</summary>
internal static class FlatMiura
{
    public static FlatPattern Build(int cellsX, int cellsY, double a = 1.0, double b = 1.0, double gammaDegrees = 60)
    {
        double gamma = gammaDegrees * Math.PI / 180;
        var folded = RegularMiuraSheet.Build(new MiuraCell(a, b, gamma, 0.6), cellsX, cellsY);
        var flat = RegularMiuraSheet.Build(new MiuraCell(a, b, gamma, 0), cellsX, cellsY);
        var xy = new double[flat.VertexCount * 2];
        for (int v = 0; v < flat.VertexCount; v++) { xy[2 * v] = flat.Positions[3 * v]; xy[2 * v + 1] = flat.Positions[3 * v + 1]; }
        return new FlatPattern(folded, xy, new double[folded.EdgeCount]);
    }

    /// <summary>Sum of mountain and valley edge lengths of the flat pattern, metres.</summary>
    public static double CreaseLength(FlatPattern p)
    {
        double sum = 0;
        for (int e = 0; e < p.EdgeCount; e++)
        {
            if (p.Role(e) is not (CreaseRole.Mountain or CreaseRole.Valley)) continue;
            var (v0, v1) = p.Edge(e);
            sum += (p.Vertex(v1) - p.Vertex(v0)).Length;
        }
        return sum;
    }
}
