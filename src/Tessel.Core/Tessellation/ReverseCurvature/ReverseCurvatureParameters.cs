using Tessel.Core.Tessellation.Miura;

namespace Tessel.Core.Tessellation.ReverseCurvature;

/// <summary>Parameters of a reverse-curvature tessellation: a Miura-type sheet whose zig-zag is graded
/// across the sheet before it is fitted to a synclastic (dome-like) target.</summary>
/// <param name="Miura">Cell counts or size, sector angle, fold depth and orientation of the underlying sheet.</param>
/// <param name="Grading">Relative change of the zig-zag offset V from the sheet's centre to its edge
/// (V(r) = V (1 + Grading r^2), r = 0 at the centre, 1 at the farthest corner); 0 = uniform sheet.</param>
public sealed record ReverseCurvatureParameters(MiuraParameters Miura, double Grading = 0.3);
