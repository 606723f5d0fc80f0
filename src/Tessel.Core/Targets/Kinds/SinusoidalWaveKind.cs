using Tessel.Core.Jobs;

namespace Tessel.Core.Targets.Kinds;

/// <summary>A corrugated roof: a sine wave along x.</summary>
public sealed class SinusoidalWaveKind : TargetKind
{
    public override string Name => "sinusoidal-wave";
    public override string Summary => "corrugated roof: amplitude, wavelength and phase along x";
    public override IReadOnlyList<ParameterSpec> Parameters { get; } =
    [
        new("amplitude", ParameterType.Number, Description: "sinusoidal-wave: amplitude (positive). Length in target.units.", Positive: true),
        new("wavelength", ParameterType.Number, Description: "sinusoidal-wave: wavelength along x (positive). Length in target.units.", Positive: true),
        new("phaseDeg", ParameterType.Number, 0, Description: "sinusoidal-wave: phase in degrees."),
        new("rise", ParameterType.Number, 0),
    ];

    public override void Validate(ParameterBag p, ParameterCheck check)
    {
        check.Positive("amplitude", p.Number("amplitude"));
        check.Positive("wavelength", p.Number("wavelength"));
    }

    public override string ScaffoldLines => """
            // Corrugation along x: amplitude, wavelength and phase (degrees).
            "amplitude": 0.4,
            "wavelength": 16,
            "phaseDeg": 0,
        """;

    public override ITargetSurface Build(TargetSpec spec, Footprint? footprint, TargetInputs inputs)
    {
        double s = spec.MetresPerUnit;
        var p = spec.Parameters;
        return new SinusoidalWaveSurface(footprint!, s * p.Required("amplitude"), s * p.Required("wavelength"),
            p.Required("phaseDeg") * Math.PI / 180, s * p.Required("rise"));
    }
}
