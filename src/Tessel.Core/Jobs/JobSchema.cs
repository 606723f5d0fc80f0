using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace Tessel.Core.Jobs;

/// <summary>Writes the parts of patterns/tessel-job.schema.json that the extension tables own: the
/// target kinds and families offered, and every target kind's parameters. The rest of the schema is
/// written by hand; a test checks that the file equals <see cref="Update"/> of itself.</summary>
public static class JobSchema
{
    private static readonly JsonSerializerOptions Layout = new()
    {
        WriteIndented = true,
        // Descriptions quote "<name>" and "≥"; the schema is read by editors, not embedded in HTML.
        Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
    };

    /// <summary>The schema text with kinds, families and target parameters taken from <paramref name="vocabulary"/>.</summary>
    public static string Update(string schemaText, JobVocabulary vocabulary)
    {
        var root = JsonNode.Parse(schemaText)!.AsObject();
        var target = root["properties"]!["target"]!["properties"]!.AsObject();
        target["kind"]!["enum"] = new JsonArray(vocabulary.TargetKinds.Select(k => (JsonNode)JsonValue.Create(k.Name)!).ToArray());
        root["properties"]!["tessellation"]!["properties"]!["family"]!["enum"] =
            new JsonArray(vocabulary.Families.Select(f => (JsonNode)JsonValue.Create(f.Name)!).ToArray());

        // Kind parameters sit between the fields every kind has (kind, units) and the footprint; a field
        // keeps its place, a new one goes before the footprint, one no kind declares any more is dropped.
        string[] common = ["kind", "units", "footprint"];
        var declared = vocabulary.TargetKinds.SelectMany(k => k.Parameters).Select(p => p.Name).Distinct().ToList();
        var order = target.Select(p => p.Key).Where(k => common.Contains(k) || declared.Contains(k)).ToList();
        foreach (var name in declared.Where(n => !order.Contains(n))) order.Insert(order.IndexOf("footprint"), name);
        var rebuilt = new JsonObject();
        foreach (var name in order)
        {
            var node = common.Contains(name) ? target[name]!.DeepClone() : Property(name, vocabulary);
            rebuilt[name] = node;
        }
        root["properties"]!["target"]!["properties"] = rebuilt;
        return root.ToJsonString(Layout) + "\n";
    }

    private static JsonObject Property(string name, JobVocabulary vocabulary)
    {
        var specs = vocabulary.TargetKinds.SelectMany(k => k.Parameters).Where(p => p.Name == name).ToList();
        var property = new JsonObject
        {
            ["type"] = specs[0].Type == ParameterType.Text ? "string" : "number",
            ["description"] = specs.Select(p => p.Description).FirstOrDefault(d => d is not null)
                ?? throw new InvalidOperationException($"target parameter '{name}' has no schema description in any kind"),
        };
        // A default is stated only where every kind that takes the field has the same one.
        if (specs[0].Default is double d && specs.All(p => p.Default == d)) property["default"] = d;
        if (specs.Any(p => p.Positive)) property["exclusiveMinimum"] = 0;
        return property;
    }
}
