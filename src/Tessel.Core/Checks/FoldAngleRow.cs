using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Checks;

/// <summary>One crease of the fold-angle table.</summary>
/// <param name="Edge">Edge index in the <see cref="CreaseMesh"/>.</param>
/// <param name="V0">First end vertex (V0 &lt; V1).</param>
/// <param name="V1">Second end vertex.</param>
/// <param name="Role">Mountain, valley or flat (a panel diagonal or unused crease).</param>
/// <param name="LengthMetres">Crease length at full scale, metres, in the folded state.</param>
/// <param name="ModelLengthMillimetres">Crease length on a 1:n model, millimetres.</param>
/// <param name="FoldAngleDegrees">Target fold angle in degrees: 0 flat, positive mountain, negative valley.</param>
public sealed record FoldAngleRow(int Edge, int V0, int V1, CreaseRole Role, double LengthMetres,
    double ModelLengthMillimetres, double FoldAngleDegrees);
