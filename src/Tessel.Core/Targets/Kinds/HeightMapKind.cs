using Tessel.Core.Jobs;

namespace Tessel.Core.Targets.Kinds;

/// <summary>A grayscale PNG read as heights over a rectangle.</summary>
public sealed class HeightMapKind : TargetKind
{
    public override string Name => "height-map";
    public override string Summary => "grayscale PNG over width x depth, black = minHeight, white = maxHeight";
    public override IReadOnlyList<ParameterSpec> Parameters { get; } =
    [
        new("image", ParameterType.Text, Description: "height-map: grayscale PNG, relative to the job file; black = minHeight, white = maxHeight, top row at +y."),
        new("imageWidth", ParameterType.Number, Description: "height-map: extent of the image along x (positive). Length in target.units.", Positive: true),
        new("imageDepth", ParameterType.Number, Description: "height-map: extent of the image along y (positive). Length in target.units.", Positive: true),
        new("minHeight", ParameterType.Number, 0, Description: "height-map: height of black pixels. Length in target.units."),
        new("maxHeight", ParameterType.Number, Description: "height-map: height of white pixels, above minHeight. Length in target.units."),
    ];

    public override bool FootprintOptional => true;

    public override (double X, double Y)? ExtentWithoutFootprint(ParameterBag p) =>
        p.Number("imageWidth") is double w && p.Number("imageDepth") is double d ? (w, d) : null;

    public override void Validate(ParameterBag p, ParameterCheck check)
    {
        if (string.IsNullOrWhiteSpace(p.Text("image"))) throw check.Error("image", "missing; give the path of a grayscale PNG");
        check.Positive("imageWidth", p.Number("imageWidth"));
        check.Positive("imageDepth", p.Number("imageDepth"));
        double minHeight = p.Required("minHeight");
        if (p.Number("maxHeight") is not double maxHeight) throw check.Error("maxHeight", $"missing; the height of white pixels, a {check.Length}");
        if (!(maxHeight > minHeight))
            throw check.Error("maxHeight", $"must be greater than minHeight ({ParameterCheck.Format(minHeight)}) (got {ParameterCheck.Format(maxHeight)})");
    }

    public override string ScaffoldLines => """
            // Grayscale PNG (relative to this file): black = minHeight, white = maxHeight.
            // Rows run from the far (+y) edge to the near edge; the image spans imageWidth x imageDepth.
            // 'tessel scaffold' wrote an invented example beside this file: a shallow dome. Replace it.
            "image": "site-heights.png",
            "imageWidth": 20,
            "imageDepth": 15,
            "minHeight": 1.8,
            "maxHeight": 3,
        """;

    public override string UndefinedFix => "check the image and its imageWidth and imageDepth";
    public override string? InputFile(ParameterBag p) => p.Text("image");

    public override ITargetSurface Build(TargetSpec spec, Footprint? footprint, TargetInputs inputs)
    {
        if (inputs.DecodeImage is null) throw new JobError("target.image", "height maps need an image reader, which this front end does not provide");
        double s = spec.MetresPerUnit;
        var p = spec.Parameters;
        string path = inputs.Resolve(p.Text("image")!);
        Jobs.InputFile.RequireRegular(path, "target.image", "image file", Jobs.InputFile.MaxImageBytes);
        var img = inputs.DecodeImage(path);
        if (img.Width < 2 || img.Height < 2) throw new JobError("target.image", $"the image must be at least 2 x 2 pixels (got {img.Width} x {img.Height})");
        double w = s * p.Required("imageWidth"), d = s * p.Required("imageDepth");
        return HeightMapSurface.FromLevels(footprint ?? Footprint.Rectangle(w, d), img.Width, img.Height, img.Levels, w, d,
            s * p.Required("minHeight"), s * p.Required("maxHeight"));
    }
}
