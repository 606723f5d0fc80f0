using Tessel.Core.Model;

namespace Tessel.Core.Tessellation;

/// <summary>What a tessellation family hands to the fitting stage: the draped crease mesh plus the
/// family's choice of constraints and regularisation. A new family is one generator that returns this.</summary>
/// <param name="Mesh">Initial folded state, draped on the target (top layer on it, bottom layer below).</param>
/// <param name="Constraints">Which constraint kinds hold for this family.</param>
/// <param name="FairnessStencils">#S*3 vertex triples (a, c, b): the tangential part of the second
/// difference x_a - 2 x_c + x_b is kept small. Chosen so that it is exactly zero on the family's
/// regular state (e.g. same-layer neighbours for Miura rows), so fairness never fights a regular sheet.</param>
/// <param name="AnchorVertex">Vertex held at its draped position (removes the sliding gauge freedom).</param>
/// <param name="LayerOffset">Distance in metres of the bottom layer below the target along its normal
/// (the fold depth); 0 for single-layer families.</param>
public sealed record GeneratedPattern(
    CreaseMesh Mesh,
    FamilyConstraints Constraints,
    int[] FairnessStencils,
    int AnchorVertex,
    double LayerOffset)
{
    /// <summary>Starting augmented-Lagrangian penalty this family needs, or null for the fit settings'
    /// value. The multi-start fit and the epsilon sweep use it in place of the settings' value (the
    /// single-start fit takes its settings as given).</summary>
    /// <remarks>A family whose constraint-feasible start lies far from its best fit (a Miura-type sheet
    /// on a dome) must travel along the constraint set in phase 2; a stiff penalty turns every step
    /// there into a creep, and the fit stops where phase 1 landed.</remarks>
    public double? InitialPenalty { get; init; }

    /// <summary>The surface the family's top layer spans, as a triangulated grid built from a folded state
    /// of this mesh (same vertex numbering), or null when the family defines none. The checks report its
    /// angle defects: the envelope's discrete Gaussian curvature.</summary>
    public Func<CreaseMesh, CreaseMesh>? Envelope { get; init; }

    /// <summary>True when the family promises a synclastic envelope (K &gt; 0 at every interior envelope
    /// vertex, docs/reference/geometry.md section 3); the build warns when the fitted envelope breaks the promise.</summary>
    public bool PromisesSynclasticEnvelope { get; init; }
}

/// <summary>Constraint kinds a family asks the fitter to enforce.</summary>
[Flags]
public enum FamilyConstraints
{
    None = 0,
    /// <summary>Every quadrilateral facet planar (triangles are planar anyway).</summary>
    QuadPlanarity = 1,
    /// <summary>Alternating sector-angle sum zero at every interior vertex of even degree (Kawasaki 1989).</summary>
    Kawasaki = 2,
    /// <summary>Sector angles at every interior vertex sum to 2 pi, up to the epsilon of the fit.</summary>
    Developability = 4,
    /// <summary>Every interior non-flat crease keeps the sign of its role (mountain / valley) and stays
    /// away from flat and from fully closed.</summary>
    FoldSigns = 8,
    /// <summary>Every interior crease whose role is flat stays drawn flat (within
    /// <see cref="Fitting.FitSettings.HeldFlatShare"/> of <see cref="Fitting.FitSettings.DrawnFlatBelowDeg"/>). Not a family's own constraint: set on the
    /// refit of a family without fold signs, whose roles were read from its first fit (see
    /// <see cref="Fitting.FoldBands"/>).</summary>
    FlatCreases = 16,
    All = QuadPlanarity | Kawasaki | Developability | FoldSigns,
}
