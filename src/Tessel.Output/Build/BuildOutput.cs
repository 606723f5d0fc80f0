using System.Globalization;
using System.Text;
using System.Text.Json;

namespace Tessel.Output.Build;

/// <summary>Everything a build produces, gathered in memory before anything is written: files by
/// relative path and figures by section. Stages add to it; <see cref="BuildRunner"/> writes it.</summary>
/// <remarks>Collecting first means an error in any stage leaves the output folder untouched.</remarks>
public sealed class BuildOutput
{
    private readonly List<(string Path, byte[] Bytes)> _files = new();
    private readonly List<(string Section, string Name, object Value)> _figures = new();

    /// <summary>Why the build stopped short (written to the summary as "problem"), or null.</summary>
    public string? Problem { get; set; }

    /// <summary>A few aligned lines for the end of a build on the terminal, or null.</summary>
    public string? Terminal { get; set; }

    /// <summary>Files in the order they were added.</summary>
    public IReadOnlyList<(string Path, byte[] Bytes)> Files => _files;

    /// <summary>Figures in the order they were added.</summary>
    public IReadOnlyList<(string Section, string Name, object Value)> Figures => _figures;

    /// <summary>Adds a file at <paramref name="relativePath"/> ('/'-separated, inside the output folder).</summary>
    /// <exception cref="ArgumentException">The path is rooted, climbs out with "..", or was already added.</exception>
    public void AddFile(string relativePath, byte[] bytes)
    {
        if (string.IsNullOrWhiteSpace(relativePath) || Path.IsPathRooted(relativePath) || relativePath.Contains('\\')
            || relativePath.Split('/').Any(p => p is "" or "." or ".."))
            throw new ArgumentException($"output path must be a plain relative path inside the output folder: '{relativePath}'");
        if (_files.Any(f => f.Path == relativePath) || relativePath == BuildRunner.SummaryFile)
            throw new ArgumentException($"output file added twice: '{relativePath}'");
        _files.Add((relativePath, bytes));
    }

    /// <summary>Adds a number (SI units; say which in the name, e.g. "maxHeightM").</summary>
    public void AddFigure(string section, string name, double value) => _figures.Add((section, name, value));

    /// <summary>Adds a whole number.</summary>
    public void AddFigure(string section, string name, long value) => _figures.Add((section, name, value));

    /// <summary>Adds a text.</summary>
    public void AddFigure(string section, string name, string value) => _figures.Add((section, name, value));

    /// <summary>Adds a yes/no figure.</summary>
    public void AddFigure(string section, string name, bool value) => _figures.Add((section, name, value));

    /// <summary>The summary.json bytes: the job, every other file with its size, every figure by section.
    /// Deterministic: no timestamps, invariant number formatting, insertion order.</summary>
    public byte[] SummaryJson(string jobName, string? description)
    {
        using var ms = new MemoryStream();
        using (var w = new Utf8JsonWriter(ms, new JsonWriterOptions { Indented = true }))
        {
            w.WriteStartObject();
            w.WriteString("job", jobName);
            if (description is not null) w.WriteString("description", description);
            w.WriteBoolean("complete", Problem is null);
            if (Problem is not null) w.WriteString("problem", Problem);
            w.WriteStartArray("files");
            foreach (var (path, bytes) in _files)
            {
                w.WriteStartObject();
                w.WriteString("path", path);
                w.WriteNumber("bytes", bytes.Length);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteStartObject("figures");
            foreach (var section in _figures.Select(f => f.Section).Distinct())
            {
                w.WriteStartObject(section);
                foreach (var (_, name, value) in _figures.Where(f => f.Section == section))
                {
                    switch (value)
                    {
                        case double d when double.IsFinite(d):
                            w.WritePropertyName(name);
                            w.WriteRawValue(d.ToString("R", CultureInfo.InvariantCulture));
                            break;
                        case double: w.WriteNull(name); break;
                        case long l: w.WriteNumber(name, l); break;
                        case bool b: w.WriteBoolean(name, b); break;
                        default: w.WriteString(name, (string)value); break;
                    }
                }
                w.WriteEndObject();
            }
            w.WriteEndObject();
            w.WriteEndObject();
        }
        ms.WriteByte((byte)'\n');
        return ms.ToArray();
    }
}
