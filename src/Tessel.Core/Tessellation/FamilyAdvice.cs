using Tessel.Core.Targets;
using Tessel.Core.Tessellation.Yoshimura;

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

    /// <summary>One line per family: the shapes it suits.</summary>
    public static string Describe(string family) => family switch
    {
        "miura" => "miura: saddles and anticlastic canopies (K < 0), waves and gentle single curvature; parameters: cells or cell size, sector angle, fold depth, orientation.",
        "reverse-curvature" => "reverse-curvature: domes and synclastic shells (K > 0) as a Miura-type sheet whose cells the fit grades; parameters as miura plus grading. On steep domes the fit can fail to converge: then try another fold depth (about half a cell's half-length) or more cells.",
        "yoshimura" => "yoshimura: barrel vaults and cylinders (one direction curved, K = 0), folded in closed form; parameters: rings along the axis, triangles across the arc, or cell size.",
        "waterbomb" => "waterbomb: domes and tubes (K >= 0): uniform bases roll into a tube, the fit grades them into a dome; parameters: bases per row and rows (cells), or cell size, fold depth.",
        "free-triangulated" => "free-triangulated: any shape, domes and saddles included, at the cost of an irregular fold layout; parameters: cells or cell size, flat-diagonal share.",
        _ => throw new ArgumentException($"unknown family '{family}'", nameof(family)),
    };

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
        advice.Suits && advice.Family == "yoshimura" && YoshimuraGenerator.Problem(target) is { } problem
            ? new(advice.Family, false, $"A Yoshimura pattern cannot be built on this target: {problem}.", "miura")
            : advice;

    /// <summary>Judges the pairing of <paramref name="family"/> with a target of the given curvature.</summary>
    public static FamilyAdvice For(string family, CurvatureFigures c)
    {
        double domeScale = c.MaxGaussian * c.Area, saddleScale = -c.MinGaussian * c.Area;
        bool dome = domeScale > NegligibleTotalCurvature, saddle = saddleScale > NegligibleTotalCurvature;
        bool curved = c.MaxAbsPrincipal * Math.Sqrt(c.Area) > NegligibleTotalCurvature;
        string k = $"K from {c.MinGaussian:0.####} to {c.MaxGaussian:0.####} 1/m^2";
        switch (family)
        {
            case "miura":
                if (dome) return new(family, false, $"The target is dome-like ({k}): a uniform Miura sheet bends into a saddle (K < 0), the opposite sign, so the fit will leave large shape error.", saddle ? "free-triangulated" : "waterbomb");
                return new(family, true, $"The target is saddle-like or single-curved ({k}): Miura sheets bend this way naturally.", null);
            case "reverse-curvature":
                if (saddle && !dome) return new(family, false, $"The target is saddle-like ({k}): a reverse-curvature sheet is made for K > 0; a plain Miura sheet bends to K < 0 by itself.", "miura");
                if (!dome) return new(family, false, $"The target is single-curved or flat ({k}): no grading is needed.", curved ? "yoshimura" : "miura");
                return new(family, true, $"The target is dome-like ({k}), the case this family is meant for; check its envelope defects after the fit.", null);
            case "yoshimura":
                if (dome || saddle) return new(family, false, $"The target is doubly curved ({k}): a Yoshimura pattern folds to a cylinder (K = 0) and cannot follow it.", dome ? (saddle ? "free-triangulated" : "waterbomb") : "miura");
                if (!curved) return new(family, false, $"The target is flat ({k}): a Yoshimura pattern folds to a vault and cannot lie flat.", "miura");
                if (c.BendsBothWays) return new(family, false, $"The target bends both ways, like a wave (mean curvature from {c.MinMean:0.####} to {c.MaxMean:0.####} 1/m): a Yoshimura vault bends one way only.", "miura");
                return new(family, true, $"The target is single-curved ({k}): a Yoshimura vault fits it, in closed form on a circular cylinder.", null);
            case "free-triangulated":
                if (!dome && !saddle) return new(family, true, $"Any shape works ({k}); for a single-curved target a Yoshimura or Miura pattern gives a tidier, regular fold layout.", curved ? "yoshimura" : "miura");
                return new(family, true, $"Any shape works ({k}); expect shape error to grow with |K| times the cell area.", null);
            case "waterbomb":
                if (saddle) return new(family, false, $"The target has saddle regions ({k}): waterbomb bases suit domes and tubes (K >= 0); on a saddle expect a larger shape error.", dome ? "free-triangulated" : "miura");
                if (dome) return new(family, true, $"The target is dome-like ({k}): the fit grades the waterbomb bases to follow it.", null);
                if (curved) return new(family, true, $"The target is single-curved ({k}): uniform waterbomb bases roll into a tube or vault.", null);
                return new(family, true, $"The target is flat ({k}): a waterbomb sheet fits it, though it tends to roll; a Miura sheet stays flat more readily.", null);
            default:
                throw new ArgumentException($"unknown family '{family}'", nameof(family));
        }
    }
}
