using Tessel.Core.Fitting;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Targets;
using Tessel.Core.Targets.Meshes;
using Tessel.Core.Tessellation;
using Xunit.Abstractions;

namespace Tessel.Tests.Tessellation.Families;

/// <summary>Patterns on footprints that are not rectangles: a mesh whose plan is an annular sector
/// (default footprint: its plan outline) and a hexagonal footprint on a saddle. Invented shapes.</summary>
public class PolygonFootprintTests(ITestOutputHelper output)
{
    internal static MeshSurface RingSector() => new(ObjMeshReader.Parse(Tessel.Tests.Targets.RingSectorMesh.Obj(), "ring-sector.obj"), null, "ring-sector.obj");

    private static readonly Footprint Hexagon = Footprint.Polygon(
        [new(2.4, 0), new(1.2, 2.1), new(-1.2, 2.1), new(-2.4, 0), new(-1.2, -2.1), new(1.2, -2.1)]);

    internal static HyperbolicParaboloidSurface HexSaddle() => new(Hexagon, c: 10);

    [Fact]
    public void MeshFootprintIsItsPlanOutline()
    {
        var ring = RingSector();
        var fp = ring.Footprint;
        Assert.False(fp.IsRectangle);
        // The outline is the union of the plan triangles: 28 chords of the 110-degree arcs, so its area is
        // 28 x (1/2) sin(110/28 deg) (r1^2 - r0^2) = 13.08 m^2 (an exact sector would be 13.09), less the
        // 2e-5-of-a-side strip it is moved inward by (about 0.001 m^2).
        double chordArea = 28 * 0.5 * Math.Sin(110.0 / 28 * Math.PI / 180) * (4.2 * 4.2 - 2.0 * 2.0);
        Assert.InRange(fp.Area, chordArea - 0.003, chordArea);
        Assert.Null(TargetDomainCheck.FirstUndefined(ring));
        // A point in the hole of the ring is outside the footprint; one on the middle radius is inside.
        Assert.False(fp.Contains(1.0, 1.0));
        Assert.True(fp.Contains(3.1 * Math.Cos(0.9), 3.1 * Math.Sin(0.9)));
        // Every corner of the outline has a height.
        Assert.All(fp.Corners, c => Assert.True(double.IsFinite(ring.HeightAt(c.X, c.Y)), $"{c}"));
    }

    [Fact]
    public void MeshWhosePlanFillsItsBoxKeepsTheBoxAsARectangle()
    {
        var bumpy = new MeshSurface(Targets.Meshes.MeshSurfaceTests.Bumpy(8, 3), null, "bumpy.obj");
        Assert.True(bumpy.Footprint.IsRectangle);
        Assert.Equal(-2, bumpy.Footprint.MinX, 12);
        Assert.Equal(2, bumpy.Footprint.MaxY, 12);
    }

    public static TheoryData<string, string> SuitedPairs()
    {
        var data = new TheoryData<string, string>();
        foreach (var (name, target) in new (string, ITargetSurface)[] { ("ring", RingSector()), ("hexagon", HexSaddle()) })
            foreach (var family in TessellationFamilies.Names)
                if (FamilyAdvice.For(family, target).Suits) data.Add(name, family);
        return data;
    }

    private static ITargetSurface Named(string name) => name == "ring" ? RingSector() : HexSaddle();

    [Theory]
    [MemberData(nameof(SuitedPairs))]
    public void SuitedFamiliesFillThePolygonAndStayOnTheSurface(string targetName, string family)
    {
        var target = Named(targetName);
        var fp = target.Footprint;
        var g = TessellationFamilies.Generate(family, target, new FamilyParameters(CellsX: 8, CellsY: 8, FoldDepth: 0.06));
        var mesh = g.Mesh;
        for (int v = 0; v < mesh.VertexCount; v++)
        {
            var p = mesh.Vertex(v);
            if (mesh.Layers[v] == VertexLayer.Bottom)
            {
                // Bottom layer: the fold depth below a surface point inside the footprint (to 0.1 mm: on a
                // mesh the drape offsets along the interpolated normal, the closest point uses the facet).
                var s = target.ClosestPoint(p);
                Assert.Equal(-g.LayerOffset, s.SignedDistance, 4);
                Assert.True(fp.Covers(s.Point.X, s.Point.Y, 1e-6), $"{family} vertex {v} over {s.Point} is outside the footprint");
            }
            else
            {
                Assert.True(fp.Covers(p.X, p.Y), $"{family} vertex {v} at {p} is outside the footprint");
                // Top layer on the target (free-triangulated starts crumpled off it: interior vertices only).
                if (family != "free-triangulated" || mesh.BoundaryVertices()[v])
                    Assert.Equal(target.HeightAt(p.X, p.Y), p.Z, 9);
            }
        }
        Assert.InRange(g.AnchorVertex, 0, mesh.VertexCount - 1);
        Assert.All(g.FairnessStencils, v => Assert.InRange(v, 0, mesh.VertexCount - 1));
        // Every vertex is used and the sheet is one piece with one boundary loop (no pinched vertex).
        Assert.Equal(mesh.VertexCount, mesh.Faces.SelectMany(f => f).Distinct().Count());
        Assert.Equal(1, BoundaryLoops(mesh));
        // Cells cover the polygon up to a stepped border about a cell wide: at 8 cells over the bounding
        // box more than half the footprint's area is covered (measured below, per family).
        double covered = mesh.Faces.Sum(f => PlanArea(mesh, f));
        output.WriteLine($"{targetName}/{family}: {mesh.VertexCount} vertices, {mesh.FaceCount} faces, covers {covered / fp.Area:P1} of the footprint");
        Assert.InRange(covered / fp.Area, 0.5, 1.0 + 1e-9);
        // Interior vertices kept all their faces: degree as generated (4 for Miura-type, 6 for the rest).
        int expected = family is "miura" or "reverse-curvature" ? 4 : 6;
        var boundary = mesh.BoundaryVertices();
        var degree = new int[mesh.VertexCount];
        for (int e = 0; e < mesh.EdgeCount; e++) { degree[mesh.EdgeVertices[2 * e]]++; degree[mesh.EdgeVertices[2 * e + 1]]++; }
        Assert.Contains(boundary, b => !b);
        for (int v = 0; v < mesh.VertexCount; v++) if (!boundary[v]) Assert.Equal(expected, degree[v]);
    }

    [Fact]
    public void MiuraOnAPolygonIsCutNotClampedToTheBoundingBox()
    {
        var g = TessellationFamilies.Generate("miura", HexSaddle(), new FamilyParameters(CellsX: 6, CellsY: 6, FoldDepth: 0.06));
        // The hexagon leaves out four corner triangles of its 4.8 x 4.2 box, a quarter of the box's area;
        // the full sheet would have 12 x 12 facets.
        Assert.InRange(g.Mesh.FaceCount, 60, 144 * 3 / 4);
        Assert.NotNull(g.Envelope);
        var envelope = g.Envelope!(g.Mesh);
        Assert.True(envelope.FaceCount > 0);
    }

    [Fact]
    public void FreeTriangulatedKeepsTheLastRowAndColumnOfARectangle()
    {
        // 0.7 / 7 is not exact in binary, so min + 7 x step lands an ulp past the border.
        var plane = new PlaneSurface(Footprint.Rectangle(0.7, 0.3));
        var g = TessellationFamilies.Generate("free-triangulated", plane, new FamilyParameters(CellsX: 7, CellsY: 3));
        Assert.Equal(2 * 7 * 3, g.Mesh.FaceCount);
        Assert.Equal(8 * 4, g.Mesh.VertexCount);
    }

    [Theory]
    [InlineData("miura", "hexagon", 0.01)]
    [InlineData("free-triangulated", "hexagon", 0.08)]
    [InlineData("free-triangulated", "ring", 0.06)]
    public void CutPatternsFitToTheConstraints(string family, string targetName, double rmsBand)
    {
        var target = Named(targetName);
        var p = new FamilyParameters(CellsX: 6, CellsY: 6, FoldDepth: 0.1);
        var g = TessellationFamilies.Generate(family, target, p);
        var r = ContinuationFitter.Fit(g, target, new FitSettings { Seed = 1 }, s => TessellationFamilies.Generate(family, s, p with { BuildableStart = true }), EpsilonConstraintFitter.DefaultSolver);
        output.WriteLine($"{targetName}/{family}: {r.StopReason}, {r.History.Count} steps, residual {r.Residuals.MaxConstraintViolation:E2}, RMS {r.Shape.Rms * 1e3:F2} mm");
        Assert.InRange(r.Residuals.MaxConstraintViolation, 0, 1e-9);
        Assert.InRange(r.Residuals.MaxKawasaki, 0, 1e-9);
        // Every quad facet is a simple convex quadrilateral: its corner angles sum to 360 deg (the angle sum
        // of a convex polygon, Euclid I.32); a crossed (bow-tie) or reflex facet reads less.
        foreach (var q in r.Mesh.Faces.Where(q => q.Length == 4))
        {
            double sum = Enumerable.Range(0, 4).Sum(i => Vec3.Angle(r.Mesh.Vertex(q[(i + 3) % 4]) - r.Mesh.Vertex(q[i]), r.Mesh.Vertex(q[(i + 1) % 4]) - r.Mesh.Vertex(q[i])));
            Assert.Equal(2 * Math.PI, sum, 6);
        }
        // Bands from the measured shape error with 6 x 6 cells over the bounding box (cells 0.7-0.94 m):
        // hexagon Miura 2.7 mm (by the continuation: the fit from the drape ended with two corner facets
        // crossed, which the corner-order rows now refuse; before them it was called buildable at 36 mm),
        // hexagon net 57 mm, ring net 41 mm (11 vertices are left on the 2.2 m wide ring; the same dome as a
        // formula over the same outline also gives 41 mm). Before the mesh's distance continued along its
        // tangent plane past its border, the ring net stopped at 236 mm.
        Assert.InRange(r.Shape.Rms, 0, rmsBand);
    }

    private static double PlanArea(CreaseMesh m, int[] f)
    {
        double a = 0;
        for (int k = 0; k < f.Length; k++)
        {
            var p = m.Vertex(f[k]); var q = m.Vertex(f[(k + 1) % f.Length]);
            a += p.X * q.Y - q.X * p.Y;
        }
        return 0.5 * a;
    }

    /// <summary>Number of closed loops the boundary edges form, walking from each boundary vertex to the
    /// next; a vertex on two loops (a pinch) makes the walk fail.</summary>
    private static int BoundaryLoops(CreaseMesh m)
    {
        var next = new Dictionary<int, int>();
        for (int e = 0; e < m.EdgeCount; e++)
        {
            if (m.IsInterior(e)) continue;
            int a = m.EdgeVertices[2 * e], b = m.EdgeVertices[2 * e + 1];
            // The face lies left of a -> b when it is EdgeFaceLeft: walk with the face on the left.
            var (from, to) = m.EdgeFaceLeft[e] >= 0 ? (a, b) : (b, a);
            Assert.True(next.TryAdd(from, to), $"vertex {from} starts two boundary edges (pinched)");
        }
        var seen = new HashSet<int>();
        int loops = 0;
        foreach (int start in next.Keys)
        {
            if (seen.Contains(start)) continue;
            loops++;
            int v = start;
            while (seen.Add(v)) v = next[v];
        }
        return loops;
    }
}
