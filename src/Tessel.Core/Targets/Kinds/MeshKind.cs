using Tessel.Core.Jobs;
using Tessel.Core.Targets.Meshes;

namespace Tessel.Core.Targets.Kinds;

/// <summary>An OBJ or STL surface seen from above.</summary>
public sealed class MeshKind : TargetKind
{
    public override string Name => "mesh";
    public override string Summary => "OBJ or STL surface, seen from above; curvature is an estimate";
    public override IReadOnlyList<ParameterSpec> Parameters { get; } =
    [
        new("mesh", ParameterType.Text, Description: "mesh: OBJ or STL file relative to the job file, in target.units, seen from above."),
    ];

    public override bool FootprintOptional => true;

    public override void Validate(ParameterBag p, ParameterCheck check)
    {
        string? mesh = p.Text("mesh");
        if (string.IsNullOrWhiteSpace(mesh)) throw check.Error("mesh", "missing; give the path of an .obj or .stl file");
        string ext = Path.GetExtension(mesh).ToLowerInvariant();
        if (ext is not (".obj" or ".stl")) throw check.Error("mesh", $"must be an .obj or .stl file (got \"{mesh}\")");
    }

    public override string ScaffoldLines => """
            // OBJ or STL file (relative to this file) seen from above, in the units above.
            // 'tessel scaffold' wrote an invented example beside this file: a shallow dome. Replace it.
            "mesh": "canopy.obj",
        """;

    public override string UndefinedField => "target.mesh";
    public override string UndefinedFix => "check that the mesh covers the footprint in plan";
    public override string? InputFile(ParameterBag p) => p.Text("mesh");

    public override ITargetSurface Build(TargetSpec spec, Footprint? footprint, TargetInputs inputs)
    {
        string path = inputs.Resolve(spec.Parameters.Text("mesh")!);
        byte[] bytes;
        try { bytes = Jobs.InputFile.ReadBounded(path, "target.mesh", "mesh file", Jobs.InputFile.MaxMeshBytes); }
        catch (Exception e) when (e is FileNotFoundException or DirectoryNotFoundException)
        { throw new JobError("target.mesh", $"mesh file not found: {path}"); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        { throw new JobError("target.mesh", $"cannot read {path} ({e.Message})"); }
        string name = Path.GetFileName(path);
        var mesh = Path.GetExtension(path).Equals(".stl", StringComparison.OrdinalIgnoreCase)
            ? StlMeshReader.Parse(bytes, name)
            : ObjMeshReader.Parse(System.Text.Encoding.UTF8.GetString(bytes), name);
        return new MeshSurface(mesh.Scaled(spec.MetresPerUnit), footprint, name);
    }
}
