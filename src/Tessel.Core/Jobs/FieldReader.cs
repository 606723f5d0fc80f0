using System.Globalization;
using System.Text.Json;

namespace Tessel.Core.Jobs;

/// <summary>Reads the fields of one JSON object by name, remembering which names were asked for so
/// that anything else in the object can be reported as an unknown field with a suggestion.</summary>
/// <remarks>An absent section is read as an empty object, so every field the loader knows is asked for
/// on every load; <see cref="JobLoader.KnownFieldPaths"/> relies on that.</remarks>
internal sealed class FieldReader
{
    private readonly JsonElement? _obj;
    private readonly HashSet<string> _asked = new(StringComparer.Ordinal);
    private readonly ICollection<string>? _known;

    public string Path { get; }

    public FieldReader(JsonElement? obj, string path, ICollection<string>? known)
    {
        if (obj is { ValueKind: not JsonValueKind.Object })
            throw new JobError(path == "" ? "job" : path, $"must be a JSON object {{ ... }} (got {Describe(obj.Value)})");
        _obj = obj;
        Path = path;
        _known = known;
    }

    public string PathOf(string name) => Path == "" ? name : Path + "." + name;

    private JsonElement? Get(string name)
    {
        _asked.Add(name);
        _known?.Add(PathOf(name));
        if (_obj is { } o && o.TryGetProperty(name, out var v) && v.ValueKind != JsonValueKind.Null) return v;
        return null;
    }

    public bool Has(string name) => _obj is { } o && o.TryGetProperty(name, out var v) && v.ValueKind != JsonValueKind.Null;

    public string? String(string name)
    {
        var v = Get(name);
        if (v is null) return null;
        if (v.Value.ValueKind != JsonValueKind.String)
            throw new JobError(PathOf(name), $"must be a text in quotes (got {Describe(v.Value)})");
        return v.Value.GetString();
    }

    public double? Number(string name)
    {
        var v = Get(name);
        if (v is null) return null;
        return ToNumber(v.Value, PathOf(name));
    }

    /// <summary>A number, or the one word <paramref name="word"/> in quotes (then <paramref name="isWord"/> is true and null returns).</summary>
    public double? NumberOrWord(string name, string word, out bool isWord)
    {
        isWord = false;
        var v = Get(name);
        if (v is null) return null;
        if (v.Value.ValueKind == JsonValueKind.String)
        {
            if (v.Value.GetString() == word) { isWord = true; return null; }
            throw new JobError(PathOf(name), $"must be a number or \"{word}\" (got {Describe(v.Value)})");
        }
        return ToNumber(v.Value, PathOf(name));
    }

    public int? Integer(string name)
    {
        var v = Get(name);
        if (v is null) return null;
        if (v.Value.ValueKind != JsonValueKind.Number || !v.Value.TryGetInt32(out int i))
            throw new JobError(PathOf(name), $"must be a whole number (got {Describe(v.Value)})");
        return i;
    }

    public bool? Bool(string name)
    {
        var v = Get(name);
        if (v is null) return null;
        return v.Value.ValueKind switch
        {
            JsonValueKind.True => true,
            JsonValueKind.False => false,
            _ => throw new JobError(PathOf(name), $"must be true or false (got {Describe(v.Value)})"),
        };
    }

    public double[]? Numbers(string name)
    {
        var v = Get(name);
        if (v is null) return null;
        if (v.Value.ValueKind != JsonValueKind.Array)
            throw new JobError(PathOf(name), $"must be a list of numbers [ ... ] (got {Describe(v.Value)})");
        var list = new List<double>();
        int i = 0;
        foreach (var e in v.Value.EnumerateArray()) list.Add(ToNumber(e, $"{PathOf(name)}[{i++}]"));
        return list.ToArray();
    }

    public double[][]? NumberPairs(string name)
    {
        var v = Get(name);
        if (v is null) return null;
        if (v.Value.ValueKind != JsonValueKind.Array)
            throw new JobError(PathOf(name), $"must be a list of [x, y] pairs (got {Describe(v.Value)})");
        var list = new List<double[]>();
        int i = 0;
        foreach (var e in v.Value.EnumerateArray())
        {
            string p = $"{PathOf(name)}[{i++}]";
            if (e.ValueKind != JsonValueKind.Array || e.GetArrayLength() != 2)
                throw new JobError(p, $"must be an [x, y] pair (got {Describe(e)})");
            list.Add([ToNumber(e[0], p + "[0]"), ToNumber(e[1], p + "[1]")]);
        }
        return list.ToArray();
    }

    /// <summary>A nested object; an absent one reads as empty so its defaults apply.</summary>
    public FieldReader Object(string name) => new(Get(name), PathOf(name), _known);

    /// <summary>Throws for the first field in the object that nobody asked for.</summary>
    public void RejectUnknown()
    {
        if (_obj is not { } o) return;
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var p in o.EnumerateObject())
        {
            // JSON allows a repeated name and keeps the last; in a job file it is a copy-paste slip.
            if (!seen.Add(p.Name)) throw new JobError(PathOf(p.Name), "appears twice in the same object; keep one");
            if (_asked.Contains(p.Name)) continue;
            string? near = EditDistance.Nearest(p.Name, _asked);
            string hint = near is null
                ? $"unknown field; known here: {string.Join(", ", _asked.Order(StringComparer.Ordinal))}"
                : $"unknown field; did you mean '{near}'?";
            throw new JobError(PathOf(p.Name), hint);
        }
    }

    private static double ToNumber(JsonElement e, string path)
    {
        if (e.ValueKind != JsonValueKind.Number)
            throw new JobError(path, $"must be a number (got {Describe(e)})");
        // TryGetDouble refuses values that overflow to infinity.
        if (!e.TryGetDouble(out double d) || !double.IsFinite(d))
            throw new JobError(path, $"must be a finite number (got {e.GetRawText()})");
        return d;
    }

    internal static string Describe(JsonElement e) => e.ValueKind switch
    {
        JsonValueKind.String => "\"" + e.GetString() + "\"",
        JsonValueKind.Object => "an object",
        JsonValueKind.Array => "a list",
        _ => e.GetRawText(),
    };

    internal static string Format(double d) => d.ToString("R", CultureInfo.InvariantCulture);
}
