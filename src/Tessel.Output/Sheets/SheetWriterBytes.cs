using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Output.Sheets;

/// <summary>Runs a sheet writer into memory, for builds that gather every file before writing any.</summary>
public static class SheetWriterBytes
{
    /// <summary>The bytes <paramref name="writer"/> writes for <paramref name="sheets"/>.</summary>
    public static byte[] Of(ISheetWriter writer, IReadOnlyList<Sheet> sheets, LineStyleTable styles)
    {
        using var ms = new MemoryStream();
        writer.Write(sheets, styles, ms);
        return ms.ToArray();
    }
}
