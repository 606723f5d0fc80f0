using System.Globalization;
using Tessel.Core.Geometry;
using Tessel.Core.Jobs;
using Tessel.Core.Targets.Formulas;
using Tessel.Core.Targets.Meshes;

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
        ITargetSurface target = spec.Kind switch
        {
            "plane" => new PlaneSurface(footprint!, s * (spec.Rise ?? 0)),
            "cylinder" => new CylinderSurface(footprint!, s * spec.Radius!.Value, s * spec.Rise!.Value),
            "spherical-cap" => new SphericalCapSurface(footprint!, s * spec.Radius!.Value, s * spec.Rise!.Value),
            "hyperbolic-paraboloid" => new HyperbolicParaboloidSurface(footprint!, s * spec.C!.Value, s * (spec.Rise ?? 0)),
            "elliptic-paraboloid" => new EllipticParaboloidSurface(footprint!, s * spec.RadiusX!.Value, s * spec.RadiusY!.Value, s * (spec.Rise ?? 0)),
            "sinusoidal-wave" => new SinusoidalWaveSurface(footprint!, s * spec.Amplitude!.Value, s * spec.Wavelength!.Value,
                spec.PhaseDeg * Math.PI / 180, s * (spec.Rise ?? 0)),
            "formula" => Formula(spec, footprint!, s),
            "height-map" => HeightMap(spec, footprint, s, baseDirectory, decodeImage),
            "mesh" => Mesh(spec, footprint, s, baseDirectory),
            _ => throw new JobError("target.kind", $"unknown kind \"{spec.Kind}\""),
        };
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
            string field = spec.Kind switch { "formula" => "target.formula", "mesh" => "target.mesh", "height-map" => "target.footprint", _ => "target.footprint" };
            // Mesh and image problems name the file, so the message says which input to fix.
            string? file = spec.Kind switch { "mesh" => spec.Mesh, "height-map" => spec.Image, _ => null };
            string fix = spec.Kind switch
            {
                "formula" => "change the formula",
                "mesh" => "check that the mesh covers the footprint in plan",
                "height-map" => "check the image and its imageWidth and imageDepth",
                _ => "change the parameters",
            };
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

    private static FormulaSurface Formula(TargetSpec spec, Footprint footprint, double s)
    {
        string text = spec.Formula!;
        try
        {
            return new FormulaSurface(footprint, text, FormulaParser.Parse(text), s);
        }
        catch (FormulaSyntaxError e)
        {
            // A long formula is quoted by its start; the column locates the problem.
            string quoted = text.Length <= 80 ? text : text[..77] + "...";
            throw new JobError("target.formula", $"{e.Message} in \"{quoted}\"");
        }
    }

    private static string Resolve(string baseDirectory, string path) =>
        Path.IsPathRooted(path) ? path : Path.GetFullPath(Path.Combine(baseDirectory, path));

    private static HeightMapSurface HeightMap(TargetSpec spec, Footprint? footprint, double s, string baseDirectory, GrayImageDecoder? decode)
    {
        if (decode is null) throw new JobError("target.image", "height maps need an image reader, which this front end does not provide");
        string path = Resolve(baseDirectory, spec.Image!);
        InputFile.RequireRegular(path, "target.image", "image file", InputFile.MaxImageBytes);
        var img = decode(path);
        if (img.Width < 2 || img.Height < 2) throw new JobError("target.image", $"the image must be at least 2 x 2 pixels (got {img.Width} x {img.Height})");
        double w = s * spec.ImageWidth!.Value, d = s * spec.ImageDepth!.Value;
        return HeightMapSurface.FromLevels(footprint ?? Footprint.Rectangle(w, d), img.Width, img.Height, img.Levels, w, d,
            s * (spec.MinHeight ?? 0), s * spec.MaxHeight!.Value);
    }

    private static MeshSurface Mesh(TargetSpec spec, Footprint? footprint, double s, string baseDirectory)
    {
        string path = Resolve(baseDirectory, spec.Mesh!);
        byte[] bytes;
        try { bytes = InputFile.ReadBounded(path, "target.mesh", "mesh file", InputFile.MaxMeshBytes); }
        catch (Exception e) when (e is FileNotFoundException or DirectoryNotFoundException)
        { throw new JobError("target.mesh", $"mesh file not found: {path}"); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        { throw new JobError("target.mesh", $"cannot read {path} ({e.Message})"); }
        string name = Path.GetFileName(path);
        var mesh = Path.GetExtension(path).Equals(".stl", StringComparison.OrdinalIgnoreCase)
            ? StlMeshReader.Parse(bytes, name)
            : ObjMeshReader.Parse(System.Text.Encoding.UTF8.GetString(bytes), name);
        return new MeshSurface(mesh.Scaled(s), footprint, name);
    }
}
