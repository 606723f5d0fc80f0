using NetTopologySuite.Geometries;
using Tessel.Core.Geometry;
using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Pipeline;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;

namespace Tessel.Tests.Sheets;

/// <summary>Board-on-fabric output against a single Miura vertex worked by hand. Formula: with the fabric on
/// the outside of a fold of angle rho, square-edged boards must stand g = 2 t sin(rho/2) apart on the fabric
/// face; with it inside, a small fixed gap suffices (derived from the geometry; Lang et al., "A Review of
/// Thickness-Accommodation Techniques in Origami-Inspired Engineering", Appl. Mech. Rev. 70(1), 2018; see
/// docs/reference/fabrication.md "Thick panels").</summary>
public class BoardOnFabricTests
{
    private const double L = 0.01; // 10 mm creases at 1:1

    /// <summary>One Miura vertex O with sector angles a, pi - a, pi - a, a, where tan a = sqrt 2
    /// (a = 54.7356 deg, cos a = 1/sqrt 3, sin a = sqrt(2/3)). Crease rays, flat: E = (L, 0) and W = (-L, 0)
    /// (collinear), U = L (cos a, sin a), D = L (cos a, -sin a). Folded, chosen by hand: E = L (1, 0, 0),
    /// W = L (0, 0, 1), U = L (1, 1, -1)/sqrt 3, D = L (1, -1, -1)/sqrt 3; every sector angle is kept
    /// (E.U = L^2 cos a, U.W = -L^2 cos a, W.D = -L^2 cos a, D.E = L^2 cos a). Each face is the parallelogram
    /// on its two creases, so it stays planar.
    /// Face normals (first crease x second): n1 (E,U) = (0, 1, 1)/sqrt 2, n2 (U,W) = (1, -1, 0)/sqrt 2,
    /// n3 (W,D) = (1, 1, 0)/sqrt 2, n4 (D,E) = (0, -1, 1)/sqrt 2. Fold angles |rho| = acos(n.n'):
    /// at E n1.n4 = 0 -> 90 deg, at W n2.n3 = 0 -> 90 deg, at U n1.n2 = -1/2 -> 120 deg, at D n3.n4 = -1/2 -> 120 deg.
    /// Sign: the far face lies below the near face's plane at E only (D.n1 = -0.816 L), so E is the one
    /// mountain; W, U and D are valleys (D.n2 = +0.816 L, W.n1 = +0.707 L, E.n3 = +0.707 L): Maekawa's 3 - 1.</summary>
    private static FlatPattern MiuraVertex()
    {
        double r3 = Math.Sqrt(3), ca = 1 / r3, sa = Math.Sqrt(2.0 / 3);
        var o3 = new Vec3(0, 0, 0);
        var e3 = new Vec3(L, 0, 0); var w3 = new Vec3(0, 0, L);
        var u3 = new Vec3(L / r3, L / r3, -L / r3); var d3 = new Vec3(L / r3, -L / r3, -L / r3);
        var o2 = new Vec2(0, 0);
        var e2 = new Vec2(L, 0); var w2 = new Vec2(-L, 0);
        var u2 = new Vec2(L * ca, L * sa); var d2 = new Vec2(L * ca, -L * sa);
        // Vertices: O, E, U, W, D, then the outer corners E+U, U+W, W+D, D+E.
        Vec3[] folded = [o3, e3, u3, w3, d3, e3 + u3, u3 + w3, w3 + d3, d3 + e3];
        Vec2[] flat = [o2, e2, u2, w2, d2, e2 + u2, u2 + w2, w2 + d2, d2 + e2];
        int[][] faces = [[0, 1, 5, 2], [0, 2, 6, 3], [0, 3, 7, 4], [0, 4, 8, 1]];
        var mesh = new CreaseMesh("miura", folded.SelectMany(p => new[] { p.X, p.Y, p.Z }).ToArray(), faces,
            new VertexLayer[folded.Length], (_, _) => CreaseRole.Valley);
        return new FlatPattern(mesh, flat.SelectMany(p => new[] { p.X, p.Y }).ToArray(), new double[mesh.EdgeCount]);
    }

    private static int EdgeTo(FlatPattern pattern, int v) =>
        Enumerable.Range(0, pattern.EdgeCount).Single(e => pattern.Edge(e) == (0, v));

    private static double Area(Vec2[] ring) =>
        new GeometryFactory().CreatePolygon(ring.Append(ring[0]).Select(p => new Coordinate(p.X, p.Y)).ToArray()).Area;

    [Fact]
    public void MiuraVertexFoldAnglesAreTheHandWorkedOnes()
    {
        var pattern = MiuraVertex();
        Assert.Equal(Math.PI / 2, pattern.Folded.FoldAngle(EdgeTo(pattern, 1)), 9);       // E: mountain 90 deg
        Assert.Equal(-2 * Math.PI / 3, pattern.Folded.FoldAngle(EdgeTo(pattern, 2)), 9);  // U: valley 120 deg
        Assert.Equal(-Math.PI / 2, pattern.Folded.FoldAngle(EdgeTo(pattern, 3)), 9);      // W: valley 90 deg
        Assert.Equal(-2 * Math.PI / 3, pattern.Folded.FoldAngle(EdgeTo(pattern, 4)), 9);  // D: valley 120 deg
    }

    [Fact]
    public void FabricUnderTheBoardsGivesTheHandWorkedGapsAndPanels()
    {
        var pattern = MiuraVertex();
        var layout = SheetLayout.Lay(pattern, new FabricationSettings { ScaleDenominator = 1 });
        var made = BoardOnFabric.Build(pattern, layout, new ThickPanelSettings(2.0, HingeSide.Bottom, 0.4));
        var gap = made.Panels.EdgeGapMm;
        // Fabric underneath: the mountain E has it inside, so only the 0.4 mm hinge gap.
        Assert.Equal(0.4, gap[EdgeTo(pattern, 1)], 12);
        // The 90 deg valley W has it outside: g = 2 x 2 x sin 45 deg = 2.828 mm, each board set back 1.414 mm.
        Assert.Equal(2.8284271247, gap[EdgeTo(pattern, 3)], 9);
        // The 120 deg valleys U and D: g = 2 x 2 x sin 60 deg = 3.464 mm.
        Assert.Equal(3.4641016151, gap[EdgeTo(pattern, 2)], 9);
        Assert.Equal(3.4641016151, gap[EdgeTo(pattern, 4)], 9);
        // Boundary edges keep the fabric's edge.
        Assert.Equal(4, gap.Count(g => g > 0));

        // A parallelogram with angle theta at O and sides L along creases c1, c2, set back s1 from c1 and s2
        // from c2, keeps (L - s2/sin theta)(L - s1/sin theta) sin theta; here sin theta = sqrt(2/3) for all four.
        // F1 (E, U) and F4 (D, E): s = 0.2 and 1.732 -> (10 - 3/sqrt 2)(10 - 0.2 sqrt 1.5) sqrt(2/3) = 62.7534 mm^2.
        // F2 (U, W) and F3 (W, D): s = 1.732 and 1.414 -> (10 - sqrt 3)(10 - 3/sqrt 2) sqrt(2/3) = 53.1870 mm^2.
        // (The whole facet is 100 sqrt(2/3) = 81.6497 mm^2.)
        double[] expected = [62.7534140858, 53.1870143934, 53.1870143934, 62.7534140858];
        for (int f = 0; f < 4; f++) Assert.Equal(expected[f], Area(made.Panels.Panels[f]), 8);
        Assert.Empty(made.Warnings);

        // Boards: four panels to cut; fabric: the one part outline to cut, the four boards drawn as the guide.
        var boards = Assert.Single(made.Boards);
        Assert.Equal("boards", boards.Side);
        Assert.Equal(4, boards.Lines.Count(l => l.Class == LineClass.CutOutline));
        var fabric = Assert.Single(made.Fabric);
        Assert.Equal("fabric", fabric.Side);
        Assert.Equal(layout.Parts[0].Outline, Assert.Single(fabric.Lines, l => l.Class == LineClass.CutOutline).Points);
        Assert.Equal(4, fabric.Lines.Count(l => l.Class == LineClass.Annotation));
        Assert.DoesNotContain(fabric.Lines, l => l.Class is LineClass.Mountain or LineClass.Valley or LineClass.FlatCrease);
    }

    [Fact]
    public void FabricOnTopPutsTheMountainGapOutsideAndTheValleysInside()
    {
        var pattern = MiuraVertex();
        var layout = SheetLayout.Lay(pattern, new FabricationSettings { ScaleDenominator = 1 });
        var made = BoardOnFabric.Build(pattern, layout, new ThickPanelSettings(2.0, HingeSide.Top, 0.4));
        // Mountain E, fabric outside: 2 x 2 x sin 45 deg; the valleys only the hinge gap.
        Assert.Equal(2.8284271247, made.Panels.EdgeGapMm[EdgeTo(pattern, 1)], 9);
        foreach (int v in new[] { 2, 3, 4 }) Assert.Equal(0.4, made.Panels.EdgeGapMm[EdgeTo(pattern, v)], 12);
    }

    [Fact]
    public void KerfWidensEveryBoardCutByHalfTheKerfEachSide()
    {
        var pattern = MiuraVertex();
        var layout = SheetLayout.Lay(pattern, new FabricationSettings { ScaleDenominator = 1 });
        var made = BoardOnFabric.Build(pattern, layout, new ThickPanelSettings(2.0, HingeSide.Bottom, 0.4, KerfMm: 0.2));
        var cuts = made.Boards[0].Lines.Where(l => l.Class == LineClass.CutOutline).Select(l => Area(l.Points)).ToArray();
        // A convex panel grown by d = 0.1 mm on every side with mitred corners has area A + d P + d^2 sum tan(turn/2),
        // so more than A + d P (P its perimeter); the panels themselves, and so the hinge gaps, are unchanged.
        Assert.All(cuts.Zip(made.Panels.Panels), c => Assert.True(c.First > Area(c.Second) + 0.1 * Perimeter(c.Second)));
        Assert.Equal(62.7534140858, Area(made.Panels.Panels[0]), 8);
    }

    private static double Perimeter(Vec2[] ring) => ring.Select((p, i) => (ring[(i + 1) % ring.Length] - p).Length).Sum();

    [Fact]
    public void TooThickABoardLeavesNoPanelAndSaysSoOnce()
    {
        var pattern = MiuraVertex();
        var layout = SheetLayout.Lay(pattern, new FabricationSettings { ScaleDenominator = 1 });
        // 10 mm board: the 120 deg valleys want 2 x 10 x sin 60 = 17.3 mm, wider than the 8.2 mm facets.
        var made = BoardOnFabric.Build(pattern, layout, new ThickPanelSettings(10.0, HingeSide.Bottom, 0.4));
        Assert.All(made.Panels.Panels, p => Assert.Empty(p));
        var warning = Assert.Single(made.Warnings);
        Assert.StartsWith("4 facet(s) too small for 10 mm boards", warning);
    }

    private static Job BoardJob(string boards) => JobLoader.Parse($$"""
        { "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3 } },
          "fabrication": { "scale": 1, "sheet": { "name": "A4" }, "boardOnFabric": {{boards}} } }
        """, "boards.json", Path.GetTempPath());

    [Fact]
    public void JobDefaultsAreTwoMillimetreBoardAHalfMillimetreGapAndFabricUnderneath()
    {
        // 2 mm greyboard (common practice, no source); 0.4 mm, inside the 0.3-0.5 mm of
        // docs/reference/fabrication.md [M] (value from memory).
        Assert.Equal(new BoardOnFabricSpec(2, 0.4, "bottom"), BoardJob("{}").Fabrication.BoardOnFabric);
        Assert.Null(JobLoader.Parse("""{ "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3 } } }""",
            "plain.json", Path.GetTempPath()).Fabrication.BoardOnFabric);
    }

    [Theory]
    [InlineData("""{ "boardThicknessMm": 0 }""", "fabrication.boardOnFabric.boardThicknessMm")]
    [InlineData("""{ "boardThicknessMm": 40 }""", "fabrication.boardOnFabric.boardThicknessMm")]
    [InlineData("""{ "hingeGapMm": -0.1 }""", "fabrication.boardOnFabric.hingeGapMm")]
    [InlineData("""{ "fabricSide": "inside" }""", "fabrication.boardOnFabric.fabricSide")]
    [InlineData("""{ "boardMm": 2 }""", "fabrication.boardOnFabric.boardMm")]
    public void BadBoardFieldsNameTheField(string boards, string field)
    {
        var e = Assert.Throws<JobError>(() => BoardJob(boards));
        Assert.Equal(field, e.Where);
    }

    [Fact]
    public void SheetStageWritesBoardAndFabricSheetsAfterTheCreaseSheets()
    {
        var job = BoardJob("""{ "boardThicknessMm": 2, "fabricSide": "bottom" }""");
        var result = SheetStage.Run(job, MiuraVertex(), ProgressReporter.Silent);
        var sides = result.Sheets.Select(s => s.Side).ToArray();
        Assert.Equal(["boards", "fabric"], sides[^2..]);
        Assert.Equal(["sheet-01-boards", "sheet-01-fabric"], sides[^2..].Select(s => SheetFiles.BaseName(result.Sheets.First(x => x.Side == s))));
        // A plain job keeps its crease sheets only.
        var plain = SheetStage.Run(job with { Fabrication = job.Fabrication with { BoardOnFabric = null } }, MiuraVertex(), ProgressReporter.Silent);
        Assert.DoesNotContain(plain.Sheets, s => s.Side is "boards" or "fabric");
    }
}
