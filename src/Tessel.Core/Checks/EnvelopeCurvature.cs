using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Checks;

/// <summary>Discrete Gaussian curvature of a pattern's envelope: its angle defects at interior envelope
/// vertices (Gauss-Bonnet, docs/reference/geometry.md section 6). Positive everywhere means synclastic (dome-like).</summary>
public sealed record EnvelopeCurvature(double MinDefect, double MaxDefect, double TotalDefect, int Positive, int Interior)
{
    /// <summary>The figures of an envelope mesh, or null when it has no interior vertex.</summary>
    public static EnvelopeCurvature? Of(CreaseMesh envelope)
    {
        var d = AngleDefects.Interior(envelope);
        if (d.Length == 0) return null;
        return new EnvelopeCurvature(d.Min(), d.Max(), d.Sum(), d.Count(x => x > 0), d.Length);
    }

    public bool Synclastic => Positive == Interior;
}
