using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using Tessel.Core.Checks;
using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Pipeline;
using Tessel.Output.Build;

namespace Tessel.Tests.Checks;

/// <summary>What the outputs say a crease does is what the fitted model does: every role in fold-angles.csv,
/// folded.obj and crease-pattern.svg equals the sign of the crease's dihedral in folded.obj, measured here by a
/// routine of this test's own; and fold-angle bound violations are counted from the same geometry.</summary>
public class FoldRolesTests
{
    /// <summary>Small invented jobs, one per family, on a target that suits it.</summary>
    public static TheoryData<string, string, int, int> Jobs() => new()
    {
        { "miura", """{ "kind": "hyperbolic-paraboloid", "c": 8, "footprint": { "width": 2, "depth": 2 } }""", 4, 4 },
        { "reverse-curvature", """{ "kind": "spherical-cap", "radius": 6, "rise": 1, "footprint": { "width": 2, "depth": 2 } }""", 4, 4 },
        { "yoshimura", """{ "kind": "cylinder", "radius": 2, "rise": 1.5, "footprint": { "width": 3, "depth": 2 } }""", 6, 4 },
        { "waterbomb", """{ "kind": "spherical-cap", "radius": 5, "rise": 1, "footprint": { "width": 2, "depth": 2 } }""", 4, 4 },
        // The job of the report that found roles opposite to their fold angles (24 of 96 creases).
        { "free-triangulated", """{ "kind": "elliptic-paraboloid", "radiusX": 5, "radiusY": 5, "footprint": { "width": 1.2, "depth": 1.2 } }""", 6, 6 },
    };

    private static Job JobFor(string family, string target, int cellsX, int cellsY) => JobLoader.Parse($$"""
        {
          "name": "roles-{{family}}",
          "target": {{target}},
          "tessellation": { "family": "{{family}}", "cellsX": {{cellsX}}, "cellsY": {{cellsY}} },
          "fitting": { "acceptUnconverged": true, "maxIterations": 150 },
          "fabrication": { "scale": 10 },
          "outputs": { "obj": true, "svg": true, "png": false, "dxf": false, "pdf": false, "stl": false, "report": false }
        }
        """, "roles.json", Directory.GetCurrentDirectory());

    [Theory]
    [MemberData(nameof(Jobs))]
    public void EveryRoleIsTheSignOfItsFittedDihedral(string family, string target, int cellsX, int cellsY)
    {
        var output = BuildRunner.Collect(JobFor(family, target, cellsX, cellsY), ProgressReporter.Silent);
        string Text(string name) => Encoding.UTF8.GetString(output.Files.Single(f => f.Path == name).Bytes);
        var (positions, faces, objRoles) = ReadObj(Text("folded.obj"));
        var wings = Wings(faces);
        double tolerance = FoldRoles.FlatToleranceDeg;

        var csv = Text("fold-angles.csv").Split('\n', StringSplitOptions.RemoveEmptyEntries).Skip(1).Select(l => l.Split(',')).ToArray();
        Assert.Equal(wings.Count, csv.Length);
        int below = 0, checkedRoles = 0;
        var counts = new Dictionary<string, int> { ["mountain"] = 0, ["valley"] = 0, ["flat"] = 0 };
        foreach (var row in csv)
        {
            int v0 = int.Parse(row[1], CultureInfo.InvariantCulture), v1 = int.Parse(row[2], CultureInfo.InvariantCulture);
            string role = row[3];
            double angle = Dihedral(positions, v0, v1, wings[(v0, v1)]);
            counts[role]++;
            Assert.Equal(role, objRoles[(v0, v1)]);
            // The table prints the same angle as this routine finds (3 decimals in the file; the normals of a
            // slightly warped quad differ between the two routines by a few thousandths of a degree).
            Assert.Equal(angle, double.Parse(row[6], CultureInfo.InvariantCulture), 0.05);
            // Within a hair of the tolerance either answer is right.
            if (Math.Abs(Math.Abs(angle) - tolerance) < 0.01) continue;
            string expected = Math.Abs(angle) < tolerance ? "flat" : angle > 0 ? "mountain" : "valley";
            Assert.True(expected == role, $"{family}: crease {v0}-{v1} folds {angle:0.###} deg but is labelled {role}");
            checkedRoles++;
            // The fit holds its bounds to its constraint tolerance (1e-10 rad, some 6e-9 deg).
            if (role != "flat" && Math.Abs(angle) < 1 - 1e-6) below++;
        }
        Assert.True(checkedRoles >= csv.Length - 2, $"{family}: only {checkedRoles} of {csv.Length} creases away from the tolerance");

        // The drawing shows the same roles: one line per crease in its layer.
        var svg = Text("crease-pattern.svg");
        Assert.Equal(counts["mountain"], PathsIn(svg, "Mountain"));
        Assert.Equal(counts["valley"], PathsIn(svg, "Valley"));
        Assert.Equal(counts["flat"], PathsIn(svg, "FlatCrease"));

        // Bounds are counted honestly: folds under the default 1 deg minimum, from this test's own angles.
        using var summary = JsonDocument.Parse(output.SummaryJson("roles", null));
        var checks = summary.RootElement.GetProperty("figures").GetProperty("checks");
        Assert.Equal(below, checks.GetProperty("foldsBelowMinFoldAngle").GetInt64());
        Assert.Equal(counts["flat"], checks.GetProperty("flatCreases").GetInt64());
        double maxBound = summary.RootElement.GetProperty("figures").GetProperty("fit").GetProperty("maxBoundViolation").GetDouble();
        if (below > 0) Assert.True(maxBound > 0, $"{family}: {below} fold(s) under 1 deg but maxBoundViolation reads 0");
    }

    [Fact]
    public void TheReportedFreeNetHasRolesFromItsGeometryAndHoldsItsFoldBounds()
    {
        // Before roles came from the fitted geometry this job printed 24 of its 96 creases the wrong way
        // round, and maxBoundViolation read 0 with folds under 1 deg; then its folds under 1 deg were counted
        // and warned of. Now each crease ends drawn flat or folded at least the minimum.
        var (family, target, cellsX, cellsY) = ("free-triangulated", """{ "kind": "elliptic-paraboloid", "radiusX": 5, "radiusY": 5, "footprint": { "width": 1.2, "depth": 1.2 } }""", 6, 6);
        var output = BuildRunner.Collect(JobFor(family, target, cellsX, cellsY), ProgressReporter.Silent);
        using var summary = JsonDocument.Parse(output.SummaryJson("roles", null));
        var fit = summary.RootElement.GetProperty("figures").GetProperty("fit");
        Assert.True(fit.GetProperty("rolesFromFittedGeometry").GetInt64() >= 20, "the fit turns many of the draped net's creases");
        var checks = summary.RootElement.GetProperty("figures").GetProperty("checks");
        Assert.Equal(96, checks.GetProperty("folds").GetInt64() + checks.GetProperty("flatCreases").GetInt64());
        Assert.Equal(0, checks.GetProperty("foldsBelowMinFoldAngle").GetInt64());
        Assert.Equal(0, checks.GetProperty("foldsAboveMaxFoldAngle").GetInt64());
        Assert.InRange(fit.GetProperty("maxBoundViolation").GetDouble(), 0, 1e-9);
        Assert.True(checks.GetProperty("folds").GetInt64() >= 20, "the net still folds");
    }

    [Fact]
    public void RoleOfAnAngleFollowsItsSignAndTheFlatTolerance()
    {
        double tol = FoldRoles.FlatToleranceDeg * Math.PI / 180;
        Assert.Equal(Core.Model.CreaseRole.Mountain, FoldRoles.RoleOf(0.6 * Math.PI / 180, tol));
        Assert.Equal(Core.Model.CreaseRole.Valley, FoldRoles.RoleOf(-0.6 * Math.PI / 180, tol));
        Assert.Equal(Core.Model.CreaseRole.Flat, FoldRoles.RoleOf(0.4 * Math.PI / 180, tol));
        Assert.Equal(Core.Model.CreaseRole.Flat, FoldRoles.RoleOf(-0.4 * Math.PI / 180, tol));
        Assert.Equal(Core.Model.CreaseRole.Flat, FoldRoles.RoleOf(double.NaN, tol));
    }

    private static int PathsIn(string svg, string lineClass)
    {
        var m = Regex.Match(svg, $"<g [^>]*data-line-class=\"{lineClass}\"[^>]*>(.*?)</g>", RegexOptions.Singleline);
        return m.Success ? Regex.Matches(m.Groups[1].Value, "<path").Count : 0;
    }

    private static (double[][] Positions, int[][] Faces, Dictionary<(int, int), string> Roles) ReadObj(string obj)
    {
        var pos = new List<double[]>(); var faces = new List<int[]>(); var roles = new Dictionary<(int, int), string>();
        string group = "";
        foreach (var raw in obj.Split('\n'))
        {
            var t = raw.Trim().Split(' ', StringSplitOptions.RemoveEmptyEntries);
            if (t.Length == 0) continue;
            switch (t[0])
            {
                case "v": pos.Add(t.Skip(1).Take(3).Select(x => double.Parse(x, CultureInfo.InvariantCulture)).ToArray()); break;
                case "g": group = t[1]; break;
                case "f": faces.Add(t.Skip(1).Select(x => int.Parse(x.Split('/')[0], CultureInfo.InvariantCulture) - 1).ToArray()); break;
                case "l":
                    int a = int.Parse(t[1], CultureInfo.InvariantCulture) - 1, b = int.Parse(t[2], CultureInfo.InvariantCulture) - 1;
                    roles[(Math.Min(a, b), Math.Max(a, b))] = group;
                    break;
            }
        }
        return (pos.ToArray(), faces.ToArray(), roles);
    }

    /// <summary>For each interior edge (v0 &lt; v1): the face that runs v0 -&gt; v1 (left, counter-clockwise from the
    /// top side) and the face that runs v1 -&gt; v0 (right).</summary>
    private static Dictionary<(int, int), (int[] Left, int[] Right)> Wings(int[][] faces)
    {
        var forward = new Dictionary<(int, int), int[]>();
        foreach (var f in faces)
            for (int k = 0; k < f.Length; k++) forward[(f[k], f[(k + 1) % f.Length])] = f;
        var wings = new Dictionary<(int, int), (int[], int[])>();
        foreach (var ((a, b), f) in forward)
            if (a < b && forward.TryGetValue((b, a), out var g)) wings[(a, b)] = (f, g);
        return wings;
    }

    /// <summary>Fold angle in degrees of crease v0-v1: the angle between the two faces' normals (cross product of
    /// the diagonals of a quad, of two sides of a triangle), positive when the right face drops below the left
    /// face's plane, i.e. the ridge points to the top side (a mountain, README "fold roles").</summary>
    private static double Dihedral(double[][] p, int v0, int v1, (int[] Left, int[] Right) w)
    {
        double[] Sub(double[] x, double[] y) => [x[0] - y[0], x[1] - y[1], x[2] - y[2]];
        double[] Cross(double[] x, double[] y) => [x[1] * y[2] - x[2] * y[1], x[2] * y[0] - x[0] * y[2], x[0] * y[1] - x[1] * y[0]];
        double Dot(double[] x, double[] y) => x[0] * y[0] + x[1] * y[1] + x[2] * y[2];
        double[] Unit(double[] x) { double l = Math.Sqrt(Dot(x, x)); return [x[0] / l, x[1] / l, x[2] / l]; }
        double[] Normal(int[] f) => Unit(f.Length == 4
            ? Cross(Sub(p[f[2]], p[f[0]]), Sub(p[f[3]], p[f[1]]))
            : Cross(Sub(p[f[1]], p[f[0]]), Sub(p[f[2]], p[f[0]])));
        var nl = Normal(w.Left); var nr = Normal(w.Right);
        double magnitude = Math.Acos(Math.Clamp(Dot(nl, nr), -1, 1)) * 180 / Math.PI;
        // The right face's corners off the crease, averaged, against the left face's plane through the crease.
        var off = w.Right.Where(v => v != v0 && v != v1).ToArray();
        double[] c = [off.Average(v => p[v][0]), off.Average(v => p[v][1]), off.Average(v => p[v][2])];
        double[] mid = [(p[v0][0] + p[v1][0]) / 2, (p[v0][1] + p[v1][1]) / 2, (p[v0][2] + p[v1][2]) / 2];
        return Dot(nl, Sub(c, mid)) < 0 ? magnitude : -magnitude;
    }
}
