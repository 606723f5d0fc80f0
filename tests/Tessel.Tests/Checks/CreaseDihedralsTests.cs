using Tessel.Core.Checks;

namespace Tessel.Tests.Checks;

public class CreaseDihedralsTests
{
    [Fact]
    public void AnglesMatchTheMeshAndGradientsMatchCentralDifferences()
    {
        var mesh = CheckMeshes.Miura(2, 2, thetaDeg: 33);
        var d = new CreaseDihedrals(mesh);
        var x = (double[])mesh.Positions.Clone();
        var rng = new Random(3);
        for (int c = 0; c < x.Length; c++) x[c] += 0.01 * (rng.NextDouble() - 0.5); // generic, non-planar panels
        for (int i = 0; i < d.Count; i++)
        {
            Assert.Equal(mesh.FoldAngle(d.Edges[i]), d.Angle(mesh.Positions, i), 12);
            var (ga, gb, gc, gd) = d.Gradient(x, i);
            var analytic = new[] { ga, gb, gc, gd };
            for (int k = 0; k < 4; k++)
            {
                int v = d.Wings[4 * i + k];
                double[] g = [analytic[k].X, analytic[k].Y, analytic[k].Z];
                for (int c = 0; c < 3; c++)
                {
                    const double h = 1e-6;
                    var xp = (double[])x.Clone(); xp[3 * v + c] += h;
                    var xm = (double[])x.Clone(); xm[3 * v + c] -= h;
                    double numeric = (d.Angle(xp, i) - d.Angle(xm, i)) / (2 * h);
                    Assert.True(Math.Abs(numeric - g[c]) < 1e-7, $"edge {i} corner {k} axis {c}: {g[c]} vs {numeric}");
                }
            }
        }
    }
}
