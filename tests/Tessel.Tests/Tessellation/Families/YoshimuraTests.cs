using Tessel.Core.Fitting;
using Tessel.Core.Fitting.Residuals;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;
using Tessel.Core.Tessellation.Yoshimura;

namespace Tessel.Tests.Tessellation.Families;

public class YoshimuraTests
{
    private static readonly CylinderSurface Vault = new(Footprint.Rectangle(1.6, 1.2), radius: 1.0, rise: 0.8);

    [Fact]
    public void ClosedRingOfEightInscribesTheCircleWithFlatLengths()
    {
        // Base w = 0.3 m, height h = 0.25 m, 8 triangles per ring (Guest & Pellegrino 1994 geometry;
        // numbers derived here): R = w / (2 sin(pi/8)).
        var ring = YoshimuraRing.ClosedRing(0.3, 0.25, 8);
        Assert.Equal(0.3 / (2 * Math.Sin(Math.PI / 8)), ring.Radius, 12);
        Assert.Equal(0.3, ring.Chord, 12);
        Assert.Equal(0.25, ring.FlatHeight, 12);
        double r = ring.Radius, phi = ring.ChordAngle, t = ring.AxialPitch;
        Vec3 P(int i, int j) => new(j * t, r * Math.Sin((i + 0.5 * j) * phi), r * Math.Cos((i + 0.5 * j) * phi));
        for (int i = 0; i < 8; i++)
        {
            // The ring closes: vertex 8 is vertex 0 and every chord is the flat base.
            Assert.Equal(0.3, (P(i + 1, 0) - P(i, 0)).Length, 12);
            Assert.Equal(Math.Sqrt(0.15 * 0.15 + 0.25 * 0.25), (P(i, 1) - P(i, 0)).Length, 12);
            Assert.Equal(Math.Sqrt(0.15 * 0.15 + 0.25 * 0.25), (P(i, 1) - P(i + 1, 0)).Length, 12);
        }
        Assert.Equal(0, (P(8, 0) - P(0, 0)).Length, 12);
        Assert.Throws<ArgumentException>(() => YoshimuraRing.ClosedRing(0.3, 0.01, 8));
    }

    [Fact]
    public void ClosedFormOnTheVaultIsExact()
    {
        var g = YoshimuraGenerator.Generate(Vault, new YoshimuraParameters(Segments: 6, Rings: 8));
        var ring = YoshimuraGenerator.RingFor(Vault, new YoshimuraParameters(Segments: 6, Rings: 8));
        var m = g.Mesh;
        Assert.Equal(5 * 7 + 4 * 6, m.VertexCount);
        for (int v = 0; v < m.VertexCount; v++)
        {
            var p = m.Vertex(v);
            // Every ring vertex on the circle of radius R about the axis (y = 0, z = rise - R).
            Assert.Equal(1.0, Math.Sqrt(p.Y * p.Y + Math.Pow(p.Z - (0.8 - 1.0), 2)), 9);
            Assert.Equal(VertexLayer.Top, m.Layers[v]);
        }
        for (int e = 0; e < m.EdgeCount; e++)
        {
            var a = m.Vertex(m.EdgeVertices[2 * e]); var b = m.Vertex(m.EdgeVertices[2 * e + 1]);
            double len = (b - a).Length;
            double expected = Math.Abs(a.X - b.X) < 1e-12 ? ring.Chord : ring.Diagonal;
            Assert.Equal(expected, len, 9);
        }
        var stars = VertexStar.InteriorStars(m);
        Assert.Equal(3 * 5 + 4 * 4, stars.Length);
        var grad = new double[3 * 7];
        var sectors = new double[6];
        var cg = new double[9];
        foreach (var s in stars)
        {
            Assert.Equal(6, s.Degree);
            Assert.InRange(Math.Abs(SectorAngleSums.Developability(m.Positions, s, grad)), 0, 1e-9);
            Assert.InRange(Math.Abs(SectorAngleSums.Kawasaki(m.Positions, s, grad)), 0, 1e-9);
            for (int k = 0; k < 6; k++) sectors[k] = CornerAngle.Evaluate(m.Positions, s.Center, s.Ring[k], s.Ring[(k + 1) % 6], cg);
            // Sectors beta, alpha, beta, beta, alpha, beta up to rotation of the ring.
            int start = Array.FindIndex(sectors, x => Math.Abs(x - ring.Alpha) < 1e-9) - 1;
            Assert.True(start >= -1);
            double[] pattern = [ring.Beta, ring.Alpha, ring.Beta, ring.Beta, ring.Alpha, ring.Beta];
            for (int k = 0; k < 6; k++) Assert.Equal(pattern[k], sectors[(start + k + 6) % 6], 9);
        }
        Assert.Equal(Math.PI, ring.Alpha + 2 * ring.Beta, 12);
    }

    [Fact]
    public void FitFromTheClosedFormStaysAndFromASmallPerturbationReturns()
    {
        var g = YoshimuraGenerator.Generate(Vault, new YoshimuraParameters(Segments: 6, Rings: 6));
        var exact = MultiStartFitter.Fit(g, Vault, new FitSettings { StartPerturbation = 0 });
        Assert.True(exact.Converged, exact.StopReason);
        Assert.InRange(exact.Shape.Rms, 0, 1e-12);
        // sigma = 0.005 x mean edge (about 1.3 mm) along the normal: the fit lands back within half
        // of it (measured 0.61 mm with the fitter's defaults, 0.15 mm with a 1e-3 round stop), every
        // constraint held. (At 0.02 x mean edge the start falls onto another
        // folded branch of the triangulated cylinder, 6 mm RMS away: measured, see report.)
        var settings = new FitSettings { Seed = 3, StartPerturbation = 0.005 };
        var r = MultiStartFitter.Fit(g, Vault, settings);
        Assert.True(r.Converged, r.StopReason);
        Assert.InRange(r.Residuals.MaxDevelopability, 0, 1e-9);
        Assert.InRange(r.Residuals.MaxKawasaki, 0, 1e-9);
        Assert.InRange(r.Shape.Rms, 0, 0.5 * 0.005 * 0.26);
        Assert.InRange(r.Shape.Rms, 1e-9, 1);
    }

    /// <summary>A ferry shelter's vault (invented): R 4.2 m over a 5 m long, 3.6 m wide footprint.</summary>
    private static readonly CylinderSurface Shelter = new(Footprint.Rectangle(5, 3.6), radius: 4.2, rise: 1.2);

    /// <summary>Ring-crease fold angle of the closed form, derived here from <see cref="YoshimuraRing"/>: the
    /// two triangles on a ring crease are mirror images across the ring's plane, their apexes t along the
    /// axis and R (1 - cos(phi / 2)) outward of the crease's midpoint, so rho = 2 atan(R (1 - cos(phi/2)) / t).</summary>
    private static double RingFold(double radius, double phi, double pitch) => 2 * Math.Atan(radius * (1 - Math.Cos(phi / 2)) / pitch);

    [Fact]
    public void ShallowestFoldOfTheClosedFormIsTheRingCrease()
    {
        var p = new YoshimuraParameters(Segments: 18, Rings: 18);
        var ring = YoshimuraGenerator.RingFor(Shelter, p);
        double shallowest = YoshimuraFamily.ShallowestFold(YoshimuraGenerator.Generate(Shelter, p).Mesh);
        Assert.Equal(RingFold(4.2, ring.ChordAngle, 5.0 / 18), shallowest, 12);
        Assert.Equal(0.5244, shallowest * 180 / Math.PI, 3); // worked by hand from the formula above
    }

    [Fact]
    public void TooShallowFoldsRaiseTheRingCountToTheFirstThatHoldsTheMinimum()
    {
        var family = new YoshimuraFamily();
        double min = 1 * Math.PI / 180;
        var asked = new FamilyParameters(CellsX: 18, CellsY: 18);
        var repair = family.DeepenShallowFolds(Shelter, asked, min);

        Assert.NotNull(repair);
        Assert.NotNull(repair.Parameters);
        // The first ring count whose ring creases fold FoldMargin x 1 deg, from the closed form:
        // t <= R (1 - cos(phi/2)) / tan(1.1 deg / 2), and t = 5 m / rings.
        double phi = YoshimuraGenerator.RingFor(Shelter, new YoshimuraParameters(18, 18)).ChordAngle;
        int expected = (int)Math.Ceiling(5 / (4.2 * (1 - Math.Cos(phi / 2)) / Math.Tan(YoshimuraFamily.FoldMargin * min / 2)));
        Assert.Equal(38, expected);
        Assert.Equal(expected, repair.Parameters.CellsX);
        Assert.Equal(18, repair.Parameters.CellsY);
        Assert.Contains("tessellation.cellsX raised to 38 rings", repair.Message);
        Assert.Contains("fitting.bounds.minFoldAngleDeg = 1 deg", repair.Message);
        Assert.Contains("0.52 deg", repair.Message);
        // Folds that already hold the minimum need no repair.
        Assert.Null(family.DeepenShallowFolds(Shelter, repair.Parameters, min));
        Assert.Null(family.DeepenShallowFolds(Shelter, asked, 0.5 * Math.PI / 180));
    }
}
