using Tessel.Core.Fitting;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;
using Tessel.Core.Tessellation.Miura;
using Tessel.Core.Unfolding;
using Tessel.Tests.Fitting;

namespace Tessel.Tests.Unfolding;

public class MeshUnfolderTests
{
    /// <summary>Flat sector angles at each interior vertex, in ring order.</summary>
    private static double[] FlatSectors(FlatPattern flat, Tessel.Core.Fitting.Residuals.VertexStar star)
    {
        var c = flat.Vertex(star.Center);
        var t = new double[star.Degree];
        for (int k = 0; k < star.Degree; k++)
        {
            var u = flat.Vertex(star.Ring[k]) - c; var w = flat.Vertex(star.Ring[(k + 1) % star.Degree]) - c;
            t[k] = Math.Atan2(Vec2.Cross(u, w), Vec2.Dot(u, w));
        }
        return t;
    }

    [Fact]
    public void RegularSheetUnfoldsToItsFlatMiuraPattern()
    {
        var cell = new MiuraCell(1.0, 1.0, 60 * Math.PI / 180, 45 * Math.PI / 180);
        var mesh = RegularMiuraSheet.Build(cell, 3, 3);
        var flat = MeshUnfolder.Unfold(mesh);
        Assert.All(flat.EdgeStrain, s => Assert.True(Math.Abs(s) < 1e-12));
        // Flat Miura: every facet a parallelogram with sides a = b = 1 and angle gamma = 60 deg
        // (Schenk & Guest 2013); corners keep their folded values.
        foreach (var f in mesh.Faces)
        {
            var p = flat.Vertex(f[0]); var q = flat.Vertex(f[1]); var r = flat.Vertex(f[3]);
            double ang = Math.Atan2(Math.Abs(Vec2.Cross(q - p, r - p)), Vec2.Dot(q - p, r - p));
            Assert.True(Math.Abs(ang - Math.PI / 3) < 1e-12 || Math.Abs(ang - 2 * Math.PI / 3) < 1e-12, $"corner {ang}");
        }
    }

    [Fact]
    public void FittedSaddlePatternIsFlatFoldable()
    {
        var fit = SaddleCase.Fit24;
        var flat = MeshUnfolder.Unfold(fit.Mesh);
        Assert.True(flat.EdgeStrain.Max(Math.Abs) < 1e-8, $"max strain {flat.EdgeStrain.Max(Math.Abs)}");
        var stars = Tessel.Core.Fitting.Residuals.VertexStar.InteriorStars(fit.Mesh);
        Assert.Equal(47 * 47, stars.Length);
        var edgeOf = new Dictionary<(int, int), int>();
        for (int e = 0; e < fit.Mesh.EdgeCount; e++) edgeOf[(fit.Mesh.EdgeVertices[2 * e], fit.Mesh.EdgeVertices[2 * e + 1])] = e;
        foreach (var star in stars)
        {
            var t = FlatSectors(flat, star);
            // Kawasaki 1989 / Justin 1986: alternating sum zero, total 2 pi (the sheet is flat).
            Assert.True(Math.Abs(t[0] - t[1] + t[2] - t[3]) < 1e-9, $"Kawasaki at {star.Center}");
            Assert.True(Math.Abs(t.Sum() - 2 * Math.PI) < 1e-9, $"angle sum at {star.Center}");
            int mountains = 0, valleys = 0;
            foreach (int n in star.Ring)
            {
                int e = edgeOf[star.Center < n ? (star.Center, n) : (n, star.Center)];
                var role = fit.Mesh.EdgeRoles[e];
                if (role == CreaseRole.Mountain) mountains++;
                if (role == CreaseRole.Valley) valleys++;
                // The fitted fold keeps the sign of its role.
                Assert.True(role == CreaseRole.Mountain ? fit.Mesh.FoldAngle(e) > 0 : fit.Mesh.FoldAngle(e) < 0);
            }
            // Maekawa-Justin theorem: |M - V| = 2.
            Assert.Equal(2, Math.Abs(mountains - valleys));
        }
    }

    [Fact]
    public void NonDevelopableFitIsFlattenedByLeastSquares()
    {
        var (pattern, target) = SaddleCase.Make(4);
        var fit = EpsilonConstraintFitter.Fit(pattern, target, new FitSettings { EpsilonDeg = 1.0, StartPerturbation = 0 });
        Assert.True(fit.Residuals.MaxDevelopability > 1e-4, "this fit should be allowed to be non-developable");
        var tree = MeshUnfolder.TreeLayout(fit.Mesh, out _, out _);
        var flat = MeshUnfolder.Unfold(fit.Mesh);
        // Least squares spreads the mismatch: its worst edge strain is below the tree layout's.
        double treeWorst = 0;
        for (int e = 0; e < fit.Mesh.EdgeCount; e++)
        {
            var (a, b) = flat.Edge(e);
            double folded = (fit.Mesh.Vertex(b) - fit.Mesh.Vertex(a)).Length;
            double d = Math.Sqrt(Math.Pow(tree[2 * b] - tree[2 * a], 2) + Math.Pow(tree[2 * b + 1] - tree[2 * a + 1], 2));
            treeWorst = Math.Max(treeWorst, Math.Abs(d / folded - 1));
        }
        double worst = flat.EdgeStrain.Max(Math.Abs);
        Assert.True(worst < treeWorst, $"least squares {worst} vs tree {treeWorst}");
        Assert.True(worst > 0);
    }
}
