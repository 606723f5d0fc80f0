using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Tests.Tessellation.Families;

public class FamilyGeneratorsTests
{
    private static readonly Footprint Square = Footprint.Rectangle(1.0, 1.0);

    [Theory]
    [InlineData("miura", 4, FamilyConstraints.All)]
    [InlineData("reverse-curvature", 4, FamilyConstraints.All)]
    [InlineData("yoshimura", 3, FamilyConstraints.Developability | FamilyConstraints.Kawasaki | FamilyConstraints.FoldSigns)]
    [InlineData("waterbomb", 3, FamilyConstraints.Developability | FamilyConstraints.Kawasaki | FamilyConstraints.FoldSigns)]
    [InlineData("free-triangulated", 3, FamilyConstraints.Developability)]
    public void EveryFamilyBuildsThroughTheDispatcher(string family, int faceCorners, FamilyConstraints constraints)
    {
        var vault = new CylinderSurface(Square, 2.0, 0.3);
        var g = TessellationFamilies.Generate(family, vault, new FamilyParameters(CellsX: 4, CellsY: 4, FoldDepth: 0.03));
        Assert.Equal(family, g.Mesh.Family);
        Assert.All(g.Mesh.Faces, f => Assert.Equal(faceCorners, f.Length));
        Assert.Equal(constraints, g.Constraints);
    }

    [Fact]
    public void UnknownFamiliesSaySo()
    {
        var plane = new PlaneSurface(Square);
        var ex = Assert.Throws<ArgumentException>(() => TessellationFamilies.Generate("egg-box", plane, new FamilyParameters(CellsX: 4, CellsY: 4)));
        Assert.Contains("free-triangulated", ex.Message);
        // Every family the job loader accepts is built.
        Assert.Equal(Tessel.Core.Jobs.Catalog.Families.Select(f => f.Name).Order(), TessellationFamilies.Names.Order());
    }

    [Fact]
    public void AdviceFlagsPoorPairingsAndNamesABetterFamily()
    {
        var dome = CurvatureFigures.Sample(new SphericalCapSurface(Square, 2.0, 0.3));
        var saddle = CurvatureFigures.Sample(new HyperbolicParaboloidSurface(Square, c: 2.0));
        var vault = CurvatureFigures.Sample(new CylinderSurface(Square, 2.0, 0.3));
        // Sphere R = 2 m: K = 1/4 everywhere (Gauss); saddle z = xy/2 at the origin K = -1/c^2 = -1/4.
        Assert.Equal(0.25, dome.MinGaussian, 9);
        Assert.Equal(-0.25, saddle.MinGaussian, 9);
        Assert.Equal(0, vault.MaxGaussian, 12);

        var a = FamilyAdvice.For("miura", dome);
        Assert.False(a.Suits);
        Assert.Equal("waterbomb", a.Better);
        Assert.Contains("saddle", a.Message);
        Assert.True(FamilyAdvice.For("miura", saddle).Suits);
        Assert.False(FamilyAdvice.For("yoshimura", dome).Suits);
        Assert.True(FamilyAdvice.For("yoshimura", vault).Suits);
        Assert.Equal("miura", FamilyAdvice.For("reverse-curvature", saddle).Better);
        Assert.True(FamilyAdvice.For("free-triangulated", saddle).Suits);
        Assert.True(FamilyAdvice.For("waterbomb", dome).Suits);
        Assert.True(FamilyAdvice.For("waterbomb", vault).Suits);
        Assert.False(FamilyAdvice.For("waterbomb", saddle).Suits);
        Assert.Equal("miura", FamilyAdvice.For("waterbomb", saddle).Better);
        foreach (var f in TessellationFamilies.Names) Assert.StartsWith(f + ":", FamilyAdvice.Describe(f));
    }
}
