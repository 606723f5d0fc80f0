using Tessel.Core.Targets;
using Tessel.Core.Tessellation.FreeTriangulated;
using Tessel.Core.Tessellation.Miura;
using Tessel.Core.Tessellation.ReverseCurvature;
using Tessel.Core.Tessellation.Waterbomb;
using Tessel.Core.Tessellation.Yoshimura;

namespace Tessel.Core.Tessellation;

/// <summary>The table of tessellation families: one registration line per family, in the order the
/// documentation lists them. Catalog, job loader, memory estimate, advice and the tessellation stage
/// read it. Every family returns a <see cref="GeneratedPattern"/> that the common fitter, checks and
/// unfolder take as is.</summary>
public static class TessellationFamilies
{
    public static readonly IReadOnlyList<TessellationFamily> All =
    [
        new MiuraFamily(),
        new ReverseCurvatureFamily(),
        new YoshimuraFamily(),
        new WaterbombFamily(),
        new FreeTriangulatedFamily(),
    ];

    /// <summary>Family names, in table order.</summary>
    public static IReadOnlyList<string> Names { get; } = All.Select(f => f.Name).ToArray();

    /// <summary>The family named <paramref name="name"/>, or null.</summary>
    public static TessellationFamily? Find(string name) => All.FirstOrDefault(f => f.Name == name);

    /// <summary>Builds the named family on the target. Throws <see cref="ArgumentException"/> for an unknown
    /// family (naming the known ones) and for parameters the family cannot use.</summary>
    public static GeneratedPattern Generate(string family, ITargetSurface target, FamilyParameters p) =>
        (Find(family) ?? throw new ArgumentException($"unknown family '{family}'; known families: {string.Join(", ", Names)}", nameof(family)))
            .Generate(target, p);
}
