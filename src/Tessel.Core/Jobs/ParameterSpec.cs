namespace Tessel.Core.Jobs;

/// <summary>How a parameter is written in the job file.</summary>
public enum ParameterType { Number, Text }

/// <summary>One field an extension (a target kind, a family) reads from its job section.</summary>
/// <param name="Name">Field name in the job file (camelCase).</param>
/// <param name="Default">Value used when the field is absent; null = none (required or optional as the
/// extension's validation says).</param>
/// <param name="Description">The field's description in the JSON Schema; null where an earlier kind in
/// the table that shares the field describes it for all.</param>
/// <param name="Positive">The schema states the value must be above zero (the kind's validation checks it).</param>
public sealed record ParameterSpec(string Name, ParameterType Type, double? Default = null, string? Description = null, bool Positive = false);

/// <summary>The parameters one job section gave an extension, read and type-checked by the loader;
/// absent fields hold the extension's defaults.</summary>
public sealed class ParameterBag
{
    private readonly IReadOnlyDictionary<string, double> _numbers;
    private readonly IReadOnlyDictionary<string, string> _texts;

    public ParameterBag(IReadOnlyDictionary<string, double> numbers, IReadOnlyDictionary<string, string> texts)
    {
        _numbers = numbers;
        _texts = texts;
    }

    /// <summary>A bag with no parameters.</summary>
    public static ParameterBag Empty { get; } = new(new Dictionary<string, double>(), new Dictionary<string, string>());

    /// <summary>The number given (or defaulted) for <paramref name="name"/>, or null.</summary>
    public double? Number(string name) => _numbers.TryGetValue(name, out double v) ? v : null;

    /// <summary>The text given for <paramref name="name"/>, or null.</summary>
    public string? Text(string name) => _texts.TryGetValue(name, out var v) ? v : null;

    /// <summary>A number the extension's validation has already required.</summary>
    public double Required(string name) =>
        Number(name) ?? throw new InvalidOperationException($"parameter '{name}' was not validated as required");
}

/// <summary>Checks an extension runs on its parameters; each throws a <see cref="JobError"/> naming
/// the field's full path and the fix.</summary>
public sealed class ParameterCheck
{
    private readonly string _section;

    public ParameterCheck(string section, string units)
    {
        _section = section;
        Units = units;
    }

    /// <summary>The section's length unit (the target's units).</summary>
    public string Units { get; }

    /// <summary>"length in m": how lengths are named in messages.</summary>
    public string Length => $"length in {Units}";

    /// <summary>Full path of a field of this section ("target.radius").</summary>
    public string PathOf(string name) => _section + "." + name;

    public JobError Error(string name, string problem) => new(PathOf(name), problem);

    public void Positive(string name, double? v, bool required = true)
    {
        if (v is null)
        {
            if (required) throw Error(name, $"missing; must be a positive {Length}");
            return;
        }
        if (!(v > 0)) throw Error(name, $"must be a positive {Length} (got {FieldReader.Format(v.Value)})");
    }

    public void NonNegative(string name, double? v, bool required = true)
    {
        if (v is null)
        {
            if (required) throw Error(name, $"missing; must be a {Length} >= 0");
            return;
        }
        if (!(v >= 0)) throw Error(name, $"must be a {Length} >= 0 (got {FieldReader.Format(v.Value)})");
    }

    /// <summary>A non-zero length whose sign chooses the bending direction.</summary>
    public void NonZero(string name, double? v)
    {
        if (v is null) throw Error(name, $"missing; must be a non-zero {Length} (negative bends downward)");
        if (v == 0) throw Error(name, $"must be a non-zero {Length} (got 0)");
    }

    public static string Format(double v) => FieldReader.Format(v);
}
