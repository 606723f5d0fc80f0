using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>A sheet material with starting values for laser work. Every number is a starting value to
/// test on the user's own machine and stock (docs/reference/fabrication.md, [M]), not a guarantee.</summary>
/// <param name="Name">Preset name, as typed on the command line.</param>
/// <param name="Description">One line for people.</param>
/// <param name="ThicknessMm">Sheet thickness t in mm.</param>
/// <param name="MountainMethod">Default way to make mountain folds (seen from the top side).</param>
/// <param name="ValleyMethod">Default way to make valley folds.</param>
/// <param name="PerforationCutMm">Length of each through-cut dash of a perforation.</param>
/// <param name="PerforationBridgeMm">Length of each uncut bridge between dashes.</param>
/// <param name="MinFacetWidthMm">Facets narrower than this are warned about (10 t, docs/reference/fabrication.md).</param>
/// <param name="StrainLimit">Largest relative edge length error the material takes up (0.0008 = 0.08 %).</param>
/// <param name="CutSpeedMmPerS">Laser head speed for through-cuts.</param>
/// <param name="ScoreSpeedMmPerS">Laser head speed for half-depth scores.</param>
/// <param name="TravelSpeedMmPerS">Head speed moving with the beam off.</param>
public sealed record Material(
    string Name,
    string Description,
    double ThicknessMm,
    FoldMethod MountainMethod,
    FoldMethod ValleyMethod,
    double PerforationCutMm,
    double PerforationBridgeMm,
    double MinFacetWidthMm,
    double StrainLimit,
    double CutSpeedMmPerS,
    double ScoreSpeedMmPerS,
    double TravelSpeedMmPerS);
