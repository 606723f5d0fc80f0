namespace Tessel.Core.Checks;

/// <summary>Settings of <see cref="BuildabilityChecks.Run"/>.</summary>
/// <param name="Rigidity">DOF settings (null: defaults).</param>
/// <param name="Folding">Folding path settings (null: defaults).</param>
/// <param name="SimulatePath">Run the folding simulation (one sparse factorisation per Newton step: seconds at
/// 10x10 cells, tens of seconds at 20x20).</param>
/// <param name="StrainLimit">Material strain limit for the flat layout.</param>
public sealed record BuildabilitySettings(RigiditySettings? Rigidity = null, FoldingSettings? Folding = null,
    bool SimulatePath = true, double StrainLimit = FlatLayoutStrain.DefaultStrainLimit);
