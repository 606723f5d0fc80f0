using Tessel.Core.Jobs;

namespace Tessel.Core.Targets.Kinds;

/// <summary>A dome (or bowl) with different apex radii along x and y.</summary>
public sealed class EllipticParaboloidKind : TargetKind
{
    public override string Name => "elliptic-paraboloid";
    public override string Summary => "dome with different apex radii radiusX and radiusY";
    public override IReadOnlyList<ParameterSpec> Parameters { get; } =
    [
        new("radiusX", ParameterType.Number, Description: "elliptic-paraboloid: apex radius of curvature along x; non-zero, negative bends upward. Length in target.units."),
        new("radiusY", ParameterType.Number, Description: "elliptic-paraboloid: apex radius of curvature along y; non-zero. Length in target.units."),
        new("rise", ParameterType.Number, 0),
    ];

    public override void Validate(ParameterBag p, ParameterCheck check)
    {
        check.NonZero("radiusX", p.Number("radiusX"));
        check.NonZero("radiusY", p.Number("radiusY"));
    }

    public override string ScaffoldLines => """
            // Apex radii of curvature along x and y; negative bends upward (a bowl).
            "radiusX": 30,
            "radiusY": 40,
            "rise": 2,
        """;

    public override ITargetSurface Build(TargetSpec spec, Footprint? footprint, TargetInputs inputs)
    {
        double s = spec.MetresPerUnit;
        var p = spec.Parameters;
        return new EllipticParaboloidSurface(footprint!, s * p.Required("radiusX"), s * p.Required("radiusY"), s * p.Required("rise"));
    }
}
