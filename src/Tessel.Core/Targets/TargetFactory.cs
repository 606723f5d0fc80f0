using System.Globalization;
using Tessel.Core.Geometry;
using Tessel.Core.Jobs;
using Tessel.Core.Targets.Formulas;

namespace Tessel.Core.Targets;

/// <summary>Builds the target surface a job's <c>target</c> section describes, in metres, and checks
/// that it is defined over the whole footprint.</summary>
public static class TargetFactory
{
    /// <summary>Builds and checks the target.</summary>
    /// <param name="spec">The validated target section.</param>
    /// <param name="baseDirectory">Folder that relative image and mesh paths resolve against.</param>
    /// <param name="decodeImage">Image reader for height maps; null when none is available.</param>
    /// <exception cref="JobError">Bad formula, unreadable input file, or a target undefined somewhere over
    /// its footprint (the message names the point).</exception>
    public static ITargetSurface Build(TargetSpec spec, string baseDirectory, GrayImageDecoder? decodeImage)
    {
        double s = spec.MetresPerUnit;
        var footprint = spec.Footprint is null ? null : FootprintOf(spec.Footprint, s);
        var kind = TargetKinds.Find(spec.Kind) ?? throw new JobError("target.kind", $"unknown kind \"{spec.Kind}\"");
        var target = kind.Build(spec, footprint, new TargetInputs(baseDirectory, decodeImage));
        var bad = TargetDomainCheck.FirstUndefined(target);
        // Samples can step over a pole or a kink; the formula's intervals cannot (a box search over the footprint).
        if (bad is null && target is FormulaSurface formula && footprint is not null)
        {
            var trouble = FormulaIntervals.FirstTrouble(formula.Tree, footprint.MinX / s, footprint.MaxX / s, footprint.MinY / s, footprint.MaxY / s,
                (x, y) => footprint.Contains(x * s, y * s));
            if (trouble is { } t)
                bad = (t.X * s, t.Y * s, t.Trouble == FormulaTrouble.Pole
                    ? "the height is undefined or infinite between the sample points (a division by zero, a log or square root of a negative number, or tan at a pole)"
                    : "the surface has a kink or a vertical slope between the sample points (abs at zero, sqrt at zero, asin or acos at +-1)");
        }
        if (bad is { } b)
        {
            string field = kind.UndefinedField;
            // Mesh and image problems name the file, so the message says which input to fix.
            string? file = kind.InputFile(spec.Parameters);
            string fix = kind.UndefinedFix;
            throw new JobError(field,
                $"{(file is null ? "" : Path.GetFileName(file) + ": ")}{b.What} at x = {Fmt(b.X / s)}, y = {Fmt(b.Y / s)} {spec.Units} inside the footprint; {fix} or shrink the footprint");
        }
        return target;
    }

    private static string Fmt(double v) => Math.Round(v, 6).ToString("0.######", CultureInfo.InvariantCulture);

    /// <summary>The footprint in metres.</summary>
    public static Footprint FootprintOf(FootprintSpec f, double metresPerUnit)
    {
        if (f.Corners is { } c) return Footprint.Polygon(c.Select(p => new Vec2(p[0] * metresPerUnit, p[1] * metresPerUnit)).ToArray());
        return Footprint.Rectangle(f.Width!.Value * metresPerUnit, f.Depth!.Value * metresPerUnit);
    }
}
