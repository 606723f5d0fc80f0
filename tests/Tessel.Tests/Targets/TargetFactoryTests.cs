using Tessel.Core.Jobs;
using Tessel.Core.Targets;
using Tessel.Output.IO;

namespace Tessel.Tests.Targets;

public class TargetFactoryTests
{
    private static ITargetSurface Build(string targetJson, string? baseDir = null)
    {
        var job = JobLoader.Parse($$"""{ "target": {{targetJson}} }""", "t.json", baseDir ?? Path.GetTempPath());
        return TargetFactory.Build(job.Target, job.BaseDirectory, HeightMapImage.Decode);
    }

    private static JobError Fails(string targetJson, string? baseDir = null) =>
        Assert.Throws<JobError>(() => Build(targetJson, baseDir));

    [Fact]
    public void UnitsAreConvertedToMetres()
    {
        // 1 ft = 0.3048 m exactly (international foot, 1959 agreement; value as defined in Geometry/Units).
        var s = Build("""{ "kind": "spherical-cap", "units": "ft", "radius": 100, "rise": 10, "footprint": { "width": 40, "depth": 40 } }""");
        Assert.Equal(12.192, s.Footprint.Width, 12);
        Assert.Equal(3.048, s.HeightAt(0, 0), 12);
        Assert.Equal(-1 / 30.48, s.CurvaturesAt(0, 0).K1, 12);
    }

    [Fact]
    public void FormulaInCentimetresScalesValueAndCurvature()
    {
        // z = x^2/200 in cm is z = x^2/2 in m: at the flat apex k = f'' = 1 per metre (Monge patch, do Carmo 3-3).
        var s = Build("""{ "kind": "formula", "units": "cm", "formula": "x^2/200", "footprint": { "width": 100, "depth": 100 } }""");
        Assert.Equal(0.5 * 0.3 * 0.3, s.HeightAt(0.3, 0), 12);
        Assert.Equal(1, s.CurvaturesAt(0, 0).K1, 12);
    }

    [Fact]
    public void FormulaSyntaxErrorNamesTheColumn()
    {
        var e = Fails("""{ "kind": "formula", "formula": "x * (y +", "footprint": { "width": 4, "depth": 4 } }""");
        Assert.Equal("target.formula", e.Where);
        Assert.Contains("column 9", e.Message);
    }

    [Fact]
    public void FormulaUndefinedOverTheFootprintSaysWhere()
    {
        // log(x) is undefined for x <= 0: the row-by-row scan starts at the footprint's corner (-2, -2).
        var e = Fails("""{ "kind": "formula", "formula": "log(x + 1)", "footprint": { "width": 4, "depth": 4 } }""");
        Assert.Equal("target.formula", e.Where);
        Assert.Contains("x = -2, y = -2 m", e.Message);
        Assert.Contains("undefined", e.Message);
    }

    [Fact]
    public void DomeSmallerThanItsFootprintIsRejected()
    {
        var e = Fails("""{ "kind": "spherical-cap", "radius": 5, "rise": 2, "footprint": { "width": 12, "depth": 12 } }""");
        Assert.Equal("target.footprint", e.Where);
    }

    [Fact]
    public void PolygonFootprintIsHonoured()
    {
        var s = Build("""{ "kind": "plane", "footprint": { "corners": [[0, 0], [4, 0], [0, 3]] } }""");
        Assert.Equal(6, s.Footprint.Area, 12);
        Assert.False(s.Footprint.Contains(3, 2.5));
    }

    [Fact]
    public void MissingImageAndUnreadableImageAreClearErrors()
    {
        string dir = TestPaths.NewTempFolder();
        var e = Fails("""{ "kind": "height-map", "image": "nope.png", "imageWidth": 4, "imageDepth": 4, "maxHeight": 1 }""", dir);
        Assert.Equal("target.image", e.Where);
        Assert.Contains("not found", e.Message);
        File.WriteAllText(Path.Combine(dir, "junk.png"), "this is not a PNG");
        e = Fails("""{ "kind": "height-map", "image": "junk.png", "imageWidth": 4, "imageDepth": 4, "maxHeight": 1 }""", dir);
        Assert.Equal("target.image", e.Where);
        Assert.Contains("not a readable image", e.Message);
    }

    [Fact]
    public void MissingMeshAndEmptyMeshAreClearErrors()
    {
        string dir = TestPaths.NewTempFolder();
        var e = Fails("""{ "kind": "mesh", "mesh": "gone.obj" }""", dir);
        Assert.Equal("target.mesh", e.Where);
        File.WriteAllText(Path.Combine(dir, "points.obj"), "v 0 0 0\nv 1 0 0\nv 0 1 0\n");
        e = Fails("""{ "kind": "mesh", "mesh": "points.obj" }""", dir);
        Assert.Equal("points.obj", e.Where);
        Assert.Contains("no triangles", e.Message);
    }

    [Fact]
    public void MeshTargetReadsAnObjRelativeToTheJob()
    {
        string dir = TestPaths.NewTempFolder();
        File.WriteAllText(Path.Combine(dir, "roof.obj"), "v 0 0 100\nv 400 0 100\nv 400 300 200\nv 0 300 200\nf 1 2 3 4\n");
        var s = Build("""{ "kind": "mesh", "units": "cm", "mesh": "roof.obj" }""", dir);
        Assert.Equal(4, s.Footprint.Width, 12);
        Assert.Equal(1.5, s.HeightAt(2, 1.5), 12);
    }
}
