using Tessel.Core.Checks;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Tests.Checks;

public class RigidFoldingPathTests
{
    private const double Deg = CheckMeshes.Deg;

    [Fact]
    public void MiuraFoldsAlongSchenkGuestClosedForm()
    {
        const double a = 1.0, b = 0.8, gamma = 60 * Deg;
        int cells = 3, nx = 2 * cells + 1;
        var mesh = CheckMeshes.Miura(cells, cells, thetaDeg: 40);
        var path = RigidFoldingPath.Simulate(mesh, new FoldingSettings(KeyframeProgress: [0.1, 0.25, 0.5, 0.75, 1.0, 1.25]));
        Assert.Equal(1, path.DegreesOfFreedom);
        Assert.True(path.ReachedNearFlat, path.StopTowardFlat);
        Assert.Equal(1.25, path.HighestProgress, 12);
        Assert.True(path.MaxBarStrain < 1e-9, $"drift {path.MaxBarStrain}");
        Assert.Equal([0.1, 0.25, 0.5, 0.75, 1.0, 1.25], path.Keyframes.Where(k => k.Progress >= 0.1).Select(k => k.Progress).ToArray());
        Assert.True(path.Keyframes[0].MaxFoldAngleDegrees < 1.0);
        double previousTheta = -1;
        foreach (var key in path.Keyframes)
        {
            // Frame of the sheet: x along vertex (0,0) -> (2,0), y along (0,0) -> (0,2) (Schenk & Guest 2013 layout).
            Vec3 P(int i, int j) => Vec3.Read(key.Positions, RegularMiuraSheet.Index(i, j, cells));
            var o = P(0, 0);
            var ex = (P(2, 0) - o).Normalized();
            var ey = P(0, 2) - o; ey = (ey - Vec3.Dot(ey, ex) * ex).Normalized();
            var ez = Vec3.Cross(ex, ey);
            double h = Vec3.Dot(P(0, 1) - o, ez);
            double theta = Math.Asin(h / (a * Math.Sin(gamma)));
            Assert.True(theta > previousTheta, "theta grows with progress");
            previousTheta = theta;
            var cell = new MiuraCell(a, b, gamma, theta);
            for (int j = 0; j <= 2 * cells; j++)
                for (int i = 0; i < nx; i++)
                {
                    var p = P(i, j) - o;
                    Assert.Equal(i * cell.S, Vec3.Dot(p, ex), 6);
                    Assert.Equal(j * cell.L + (i % 2 == 1 ? cell.V : 0), Vec3.Dot(p, ey), 6);
                    Assert.Equal(j % 2 == 1 ? cell.H : 0, Vec3.Dot(p, ez), 6);
                }
        }
    }

    /// <summary>One flat-foldable degree-4 vertex with sectors alpha, beta, pi - alpha, pi - beta from crease 1,
    /// folded by rotating the panels about creases 1 and 2 until the fourth sector closes (no closed form used).</summary>
    private static CreaseMesh GenericDegreeFourVertex(double alpha, double beta, double phi1)
    {
        var d1 = new Vec3(1, 0, 0);
        var d2 = new Vec3(Math.Cos(alpha), Math.Sin(alpha), 0);
        var d3Flat = new Vec3(Math.Cos(alpha + beta), Math.Sin(alpha + beta), 0);
        var d4Flat = new Vec3(Math.Cos(Math.PI + beta), Math.Sin(Math.PI + beta), 0);
        var d4 = Rotate(d4Flat, d1, phi1);
        double Gap(double phi2) => Vec3.Angle(Rotate(d3Flat, d2, phi2), d4) - (Math.PI - alpha);
        CreaseMesh? best = null;
        double bestMismatch = double.PositiveInfinity;
        for (int k = 0; k < 720; k++)
        {
            double lo = -Math.PI + k * Math.PI / 360, hi = lo + Math.PI / 360;
            if (Math.Sign(Gap(lo)) == Math.Sign(Gap(hi))) continue;
            for (int it = 0; it < 200; it++)
            {
                double mid = 0.5 * (lo + hi);
                if (Math.Sign(Gap(mid)) == Math.Sign(Gap(lo))) lo = mid; else hi = mid;
            }
            var d3 = Rotate(d3Flat, d2, 0.5 * (lo + hi));
            var pos = new double[15];
            Vec3.Zero.Write(pos, 0); d1.Write(pos, 1); d2.Write(pos, 2); d3.Write(pos, 3); d4.Write(pos, 4);
            int[][] faces = [[0, 1, 2], [0, 2, 3], [0, 3, 4], [0, 4, 1]];
            var mesh = RegularMiuraSheet.AssignRolesFromGeometry(
                new CreaseMesh("vertex", pos, faces, new VertexLayer[5], (_, _) => CreaseRole.Flat));
            // Keep the mode with rho3 = rho1 (Lang & Howell's labelling).
            double mismatch = Math.Abs(Rho(mesh, mesh.Positions, 3) - Rho(mesh, mesh.Positions, 1));
            if (mismatch < bestMismatch) { bestMismatch = mismatch; best = mesh; }
        }
        Assert.True(bestMismatch < 1e-9, $"no rho1 = rho3 mode found ({bestMismatch})");
        return best!;
    }

    private static Vec3 Rotate(Vec3 v, Vec3 axis, double angle)
    {
        var k = axis.Normalized();
        return v * Math.Cos(angle) + Vec3.Cross(k, v) * Math.Sin(angle) + k * (Vec3.Dot(k, v) * (1 - Math.Cos(angle)));
    }

    private static double Rho(CreaseMesh mesh, double[] positions, int crease)
    {
        var m = mesh.WithPositions(positions);
        for (int e = 0; e < m.EdgeCount; e++)
            if (m.EdgeVertices[2 * e] == 0 && m.EdgeVertices[2 * e + 1] == crease) return m.FoldAngle(e);
        throw new InvalidOperationException("no such crease");
    }

    [Fact]
    public void DegreeFourVertexKeepsLangHowellFoldAngleRatio()
    {
        // Lang & Howell, J. Mech. Robot. 10(2) 2018: rho3 = rho1, rho4 = -rho2, tan(rho2/2) = mu tan(rho1/2),
        // mu = -cos((a+b)/2) / cos((a-b)/2); a = 50 deg, b = 70 deg gives mu = -0.50771 (docs/reference/geometry.md section 1).
        double alpha = 50 * Deg, beta = 70 * Deg;
        double mu = -Math.Cos((alpha + beta) / 2) / Math.Cos((alpha - beta) / 2);
        Assert.Equal(-0.50771, mu, 5);
        var mesh = GenericDegreeFourVertex(alpha, beta, 50 * Deg);
        var path = RigidFoldingPath.Simulate(mesh, new FoldingSettings(KeyframeProgress: [0.05, 0.2, 0.4, 0.6, 0.8, 1.0, 1.2, 1.4], MaxProgress: 1.4));
        Assert.Equal(1, path.DegreesOfFreedom);
        Assert.True(path.ReachedNearFlat, path.StopTowardFlat);
        Assert.True(path.Keyframes.Count >= 8);
        foreach (var key in path.Keyframes)
        {
            double r1 = Rho(mesh, key.Positions, 1), r2 = Rho(mesh, key.Positions, 2);
            double r3 = Rho(mesh, key.Positions, 3), r4 = Rho(mesh, key.Positions, 4);
            Assert.Equal(r1, r3, 9);
            Assert.Equal(-r2, r4, 9);
            Assert.Equal(mu * Math.Tan(r1 / 2), Math.Tan(r2 / 2), 9);
        }
    }

    [Fact]
    public void SymmetricDegreeSixVertexFoldsUniformlyAndKeepsItsSymmetry()
    {
        // Six 60-degree sectors, crease elevations alternating 20 deg and psi_b with
        // 0.5 cos(20) cos(psi_b) + sin(20) sin(psi_b) = 0.5 so every sector stays 60 deg (derived here).
        // A triangulated disk with 6 boundary vertices has 6 - 3 = 3 DOF (docs/reference/geometry.md section 4); the predictor's
        // least-squares "uniform scaling" direction is intrinsic and unique, so it must keep the 3-fold symmetry:
        // rho1 = rho3 = rho5 and rho2 = rho4 = rho6 all the way.
        double psiA = 20 * Deg;
        double r = Math.Sqrt(Math.Pow(0.5 * Math.Cos(psiA), 2) + Math.Pow(Math.Sin(psiA), 2));
        double psiB = Math.Atan2(Math.Sin(psiA), 0.5 * Math.Cos(psiA)) - Math.Acos(0.5 / r);
        var pos = new double[7 * 3];
        for (int k = 0; k < 6; k++)
        {
            double psi = k % 2 == 0 ? psiA : psiB, phi = k * 60 * Deg;
            new Vec3(Math.Cos(phi) * Math.Cos(psi), Math.Sin(phi) * Math.Cos(psi), Math.Sin(psi)).Write(pos, k + 1);
        }
        var faces = Enumerable.Range(0, 6).Select(k => new[] { 0, k + 1, (k + 1) % 6 + 1 }).ToArray();
        var mesh = RegularMiuraSheet.AssignRolesFromGeometry(
            new CreaseMesh("vertex6", pos, faces, new VertexLayer[7], (_, _) => CreaseRole.Flat));
        for (int k = 0; k < 6; k++)
            Assert.Equal(60.0, Vec3.Angle(mesh.Vertex(k + 1), mesh.Vertex((k + 1) % 6 + 1)) / Deg, 9);
        Assert.Equal(3, RigidityAnalysis.DegreesOfFreedom(mesh).DegreesOfFreedom);
        var path = RigidFoldingPath.Simulate(mesh, new FoldingSettings(MaxProgress: 1.5, KeyframeProgress: [0.2, 0.5, 1.0, 1.5]));
        Assert.Equal(3, path.DegreesOfFreedom);
        Assert.True(path.ReachedNearFlat, path.StopTowardFlat);
        Assert.Equal(1.5, path.HighestProgress, 12);
        Assert.True(path.MaxBarStrain < 1e-9, $"drift {path.MaxBarStrain}");
        Assert.Equal(5, path.Keyframes.Count);
        foreach (var key in path.Keyframes)
        {
            double[] rho = Enumerable.Range(1, 6).Select(k => Rho(mesh, key.Positions, k)).ToArray();
            // 1e-10 rad (about 2e-13 is seen): a corrector without fold-angle pins (Cartesian min-norm only) broke it by 1e-4.
            foreach (var (p, q) in new[] { (0, 2), (0, 4), (1, 3), (1, 5) })
                Assert.True(Math.Abs(rho[p] - rho[q]) < 1e-10, $"progress {key.Progress}: rho{p + 1} {rho[p]} vs rho{q + 1} {rho[q]}");
        }
    }

    [Fact]
    public void FlatInputIsRejected()
    {
        Assert.Throws<ArgumentException>(() => RigidFoldingPath.Simulate(CheckMeshes.Miura(1, 1, thetaDeg: 0)));
    }
}
