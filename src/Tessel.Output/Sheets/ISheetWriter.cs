using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Output.Sheets;

/// <summary>Writes fabrication sheets to a stream in one file format. Implementations are
/// deterministic: the same sheets and styles give the same bytes (no clocks, invariant culture,
/// fixed number formatting). The caller owns the stream and handles files atomically.</summary>
public interface ISheetWriter
{
    /// <summary>File extension including the dot, e.g. ".svg".</summary>
    string FileExtension { get; }

    /// <summary>True when one file holds exactly one sheet (SVG, DXF, PNG); false when one file holds
    /// every sheet (PDF, one page per sheet).</summary>
    bool OneFilePerSheet { get; }

    /// <summary>Writes <paramref name="sheets"/> to <paramref name="output"/>. When
    /// <see cref="OneFilePerSheet"/> is true the list must hold exactly one sheet.</summary>
    void Write(IReadOnlyList<Sheet> sheets, LineStyleTable styles, Stream output);
}
