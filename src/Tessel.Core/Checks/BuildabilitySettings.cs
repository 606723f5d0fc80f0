namespace Tessel.Core.Checks;

/// <summary>Settings of <see cref="BuildabilityChecks.Run"/>.</summary>
/// <param name="Rigidity">DOF settings (null: defaults).</param>
/// <param name="Folding">Folding path settings (null: defaults).</param>
/// <param name="SimulatePath">Run the folding simulation: one sparse factorisation per Newton step, about 20 of
/// them with the default settings (under a second at 10x10 Miura cells; 40x40 cells need about 1 s per
/// factorisation on an idle core and far more on a loaded machine).</param>
/// <param name="StrainLimit">Material strain limit for the flat layout.</param>
public sealed record BuildabilitySettings(RigiditySettings? Rigidity = null, FoldingSettings? Folding = null,
    bool SimulatePath = true, double StrainLimit = FlatLayoutStrain.DefaultStrainLimit);
