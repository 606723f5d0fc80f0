using Tessel.Core.Checks;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Tests.Checks;

public class PanelCollisionsTests
{
    private const double Deg = CheckMeshes.Deg;

    /// <summary>A strip of unit square panels along a polyline in the xz-plane, each crease turning by
    /// <paramref name="turnDeg"/>, extruded 1 m along y.</summary>
    private static CreaseMesh FoldedStrip(int panels, double turnDeg)
    {
        var pos = new double[(panels + 1) * 2 * 3];
        var p = Vec3.Zero;
        for (int k = 0; k <= panels; k++)
        {
            p.Write(pos, 2 * k);
            (p + new Vec3(0, 1, 0)).Write(pos, 2 * k + 1);
            double phi = k * turnDeg * Deg;
            p += new Vec3(Math.Cos(phi), 0, Math.Sin(phi));
        }
        var faces = new int[panels][];
        for (int k = 0; k < panels; k++) faces[k] = [2 * k, 2 * k + 2, 2 * k + 3, 2 * k + 1];
        return new CreaseMesh("strip", pos, faces, new VertexLayer[pos.Length / 3], (_, _) => CreaseRole.Valley);
    }

    [Fact]
    public void CleanMiuraHasNoCollisionsAtAnyKeyframe()
    {
        var mesh = CheckMeshes.Miura(3, 3, thetaDeg: 40);
        Assert.Equal(0, PanelCollisions.Find(mesh).Count);
        var path = RigidFoldingPath.Simulate(mesh);
        var frames = PanelCollisions.AlongPath(mesh, path);
        Assert.Equal(path.Keyframes.Count, frames.Count);
        Assert.All(frames, f => Assert.Equal(0, f.Collisions.Count));
    }

    [Fact]
    public void StripCurledPastAFullTurnPiercesItsFirstPanel()
    {
        // Turning 80 deg at each crease: after four creases (320 deg) the fifth panel's section runs from
        // (-0.266, 0.461) to (0.500, -0.182) in (x, z) and crosses the first panel at x = 0.283 (derived here).
        var clean = FoldedStrip(4, 80);
        Assert.Equal(0, PanelCollisions.Find(clean).Count);
        var curled = FoldedStrip(5, 80);
        var r = PanelCollisions.Find(curled);
        Assert.Equal([new PanelCollision(0, 4, CollisionKind.Crossing)], r.Pairs);
    }

    [Fact]
    public void PanelsFoldedFlatOntoEachOtherOverlapAtTheirCrease()
    {
        Assert.Equal(0, PanelCollisions.Find(FoldedStrip(2, 170)).Count);
        var flat = PanelCollisions.Find(FoldedStrip(2, 180));
        Assert.Equal([new PanelCollision(0, 1, CollisionKind.OverlapAtSharedCorner)], flat.Pairs);
        // Unfolded (0 deg) the two coplanar panels lie side by side: touching, not overlapping.
        Assert.Equal(0, PanelCollisions.Find(FoldedStrip(2, 0)).Count);
    }

    [Fact]
    public void PanelsSharingOnlyAVertexAreReportedWhenTheyPassThroughEachOther()
    {
        // Panel 1 lies in z = 0 with corner directions x and y; panel 2's plane cuts z = 0 along (1, 1, 0), which
        // lies inside both corners: they cross along a segment from the shared vertex.
        CreaseMesh Two(Vec3 d, Vec3 e)
        {
            var pos = new double[15];
            Vec3.Zero.Write(pos, 0); new Vec3(1, 0, 0).Write(pos, 1); new Vec3(0, 1, 0).Write(pos, 2);
            d.Write(pos, 3); e.Write(pos, 4);
            return new CreaseMesh("pair", pos, [[0, 1, 2], [0, 3, 4]], new VertexLayer[5], (_, _) => CreaseRole.Flat);
        }
        var crossing = PanelCollisions.Find(Two(new Vec3(0.5, 0.2, 1), new Vec3(0.2, 0.5, -1)));
        Assert.Equal([new PanelCollision(0, 1, CollisionKind.OverlapAtSharedCorner)], crossing.Pairs);
        // Mirrored through the vertex the cut line leaves panel 1's corner: only the vertex is shared.
        Assert.Equal(0, PanelCollisions.Find(Two(new Vec3(-0.5, -0.2, 1), new Vec3(-0.2, -0.5, -1))).Count);
    }

    [Fact]
    public void MollerTestSeparatesCrossingTouchingAndDisjointTriangles()
    {
        // Moller, J. Graphics Tools 2(2) 1997: interval overlap on the planes' intersection line.
        var a0 = new Vec3(0, 0, 0); var a1 = new Vec3(2, 0, 0); var a2 = new Vec3(0, 2, 0);
        Assert.True(TriangleIntersection.Intersect(a0, a1, a2, new Vec3(0.5, 0.5, -1), new Vec3(0.5, 0.5, 1), new Vec3(3, 3, 0.2), 1e-12));
        Assert.False(TriangleIntersection.Intersect(a0, a1, a2, new Vec3(2, 2, -1), new Vec3(2, 2, 1), new Vec3(3, 3, 0.2), 1e-12));
        Assert.False(TriangleIntersection.Intersect(a0, a1, a2, new Vec3(0, 0, 0.1), new Vec3(1, 0, 0.1), new Vec3(0, 1, 0.1), 1e-12));
        // Coplanar: overlapping, then disjoint.
        Assert.True(TriangleIntersection.Intersect(a0, a1, a2, new Vec3(0.5, 0.5, 0), new Vec3(3, 0.5, 0), new Vec3(0.5, 3, 0), 1e-12));
        Assert.False(TriangleIntersection.Intersect(a0, a1, a2, new Vec3(1.5, 1.5, 0), new Vec3(3, 1.5, 0), new Vec3(1.5, 3, 0), 1e-12));
    }
}
