using Tessel.Core.Targets;

namespace Tessel.Core.Tessellation;

/// <summary>Whether a family suits a target, in plain words.</summary>
/// <param name="Suits">False when the pairing is poor.</param>
/// <param name="Message">One or two sentences for the summary.</param>
/// <param name="Better">A family that would suit better, or null.</param>
public sealed record FamilyAdvice(string Family, bool Suits, string Message, string? Better)
{
    /// <summary>Total curvature |K| x area below which a target counts as single-curved or flat
    /// (0.05 rad of angle defect spread over the whole sheet; derived here from docs/reference/geometry.md section 7:
    /// at 100 vertices it is 0.0005 rad each, ten times below the invisible 0.005 rad).</summary>
    public const double NegligibleTotalCurvature = 0.05;

    /// <summary>"name: summary", one line per family: the shapes it suits.</summary>
    public static string Describe(string family) =>
        $"{family}: {(TessellationFamilies.Find(family) ?? throw new ArgumentException($"unknown family '{family}'", nameof(family))).Summary}";

    /// <summary>Judges the pairing of <paramref name="family"/> with the target: by its curvature
    /// (<see cref="For(string, CurvatureFigures)"/>), and a family is called suited only where its
    /// generator can build it (a Yoshimura vault needs a circle across the footprint's centre).</summary>
    public static FamilyAdvice For(string family, ITargetSurface target) => For(family, target, CurvatureFigures.Sample(target));

    /// <summary>As <see cref="For(string, ITargetSurface)"/> with the target's curvature already sampled.</summary>
    public static FamilyAdvice For(string family, ITargetSurface target, CurvatureFigures curvature)
    {
        var advice = Buildable(For(family, curvature), target);
        // The family named as better must be suited itself; a free net suits every target.
        if (advice.Better is { } better && !Buildable(For(better, curvature), target).Suits)
            advice = advice with { Better = "free-triangulated" };
        return advice;
    }

    /// <summary>The advice, turned to "not suited" where the family's generator cannot build it.</summary>
    private static FamilyAdvice Buildable(FamilyAdvice advice, ITargetSurface target) =>
        advice.Suits && TessellationFamilies.Find(advice.Family)?.CannotBuild(target) is { } cannot ? cannot : advice;

    /// <summary>Judges the pairing of <paramref name="family"/> with a target of the given curvature.</summary>
    public static FamilyAdvice For(string family, CurvatureFigures c) =>
        (TessellationFamilies.Find(family) ?? throw new ArgumentException($"unknown family '{family}'", nameof(family))).Judge(c);

    /// <summary>The target's shape as the families' verdicts read it: dome-like or saddle-like somewhere
    /// (total curvature beyond <see cref="NegligibleTotalCurvature"/>), curved at all, and the Gaussian
    /// curvature range in words.</summary>
    public static (bool Dome, bool Saddle, bool Curved, string K) Shape(CurvatureFigures c)
    {
        double domeScale = c.MaxGaussian * c.Area, saddleScale = -c.MinGaussian * c.Area;
        bool dome = domeScale > NegligibleTotalCurvature, saddle = saddleScale > NegligibleTotalCurvature;
        bool curved = c.MaxAbsPrincipal * Math.Sqrt(c.Area) > NegligibleTotalCurvature;
        return (dome, saddle, curved, $"K from {c.MinGaussian:0.####} to {c.MaxGaussian:0.####} 1/m^2");
    }
}
