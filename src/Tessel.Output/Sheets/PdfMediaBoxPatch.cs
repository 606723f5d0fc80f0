using System.Globalization;
using System.Text;

namespace Tessel.Output.Sheets;

/// <summary>Rewrites the page MediaBox entries of a SkiaSharp-written PDF to exact point sizes and
/// fixes the cross-reference table to match.</summary>
/// <remarks>
/// Skia stores the page size as whole points, which makes an A4 page 0.11 pt (0.04 mm) too tall and
/// 0.28 pt too narrow. ISO 32000-1 allows real numbers in a MediaBox, so each "/MediaBox [0 0 w h]"
/// is replaced by the exact size; because that changes byte lengths, every offset in the classic
/// cross-reference table (fixed 20-byte entries, ISO 32000-1 7.5.4) after a replacement and the
/// startxref value are shifted by the same amount. Anything other than the single-subsection
/// table Skia writes is refused rather than guessed at.
/// </remarks>
internal static class PdfMediaBoxPatch
{
    private static readonly byte[] MediaBoxMarker = Encoding.ASCII.GetBytes("/MediaBox [0 0 ");

    /// <summary>Returns <paramref name="pdf"/> with the k-th page's MediaBox set to <paramref name="pageSizesPt"/>[k].</summary>
    public static byte[] Apply(byte[] pdf, IReadOnlyList<(double Width, double Height)> pageSizesPt)
    {
        int xrefOffset = ReadStartXref(pdf);
        var (entryOffsets, entriesStart) = ReadXref(pdf, xrefOffset);

        // Find the MediaBoxes (all of them lie in page objects before the xref table).
        var replacements = new List<(int Start, int Length, byte[] Text)>();
        int page = 0;
        for (int at = pdf.AsSpan(0, xrefOffset).IndexOf(MediaBoxMarker); at >= 0;)
        {
            int close = Array.IndexOf(pdf, (byte)']', at);
            string[] numbers = Encoding.ASCII.GetString(pdf, at + MediaBoxMarker.Length, close - at - MediaBoxMarker.Length)
                .Split(' ', StringSplitOptions.RemoveEmptyEntries);
            if (page >= pageSizesPt.Count || numbers.Length != 2)
                throw new InvalidOperationException("Unexpected MediaBox layout in the PDF from SkiaSharp.");
            var (w, h) = pageSizesPt[page];
            // Sanity check that this box belongs to that page: Skia's value is within a point of it.
            if (Math.Abs(double.Parse(numbers[0], CultureInfo.InvariantCulture) - w) > 1
                || Math.Abs(double.Parse(numbers[1], CultureInfo.InvariantCulture) - h) > 1)
                throw new InvalidOperationException($"MediaBox {page + 1} does not match its sheet's size.");
            byte[] text = Encoding.ASCII.GetBytes($"/MediaBox [0 0 {SheetNumberFormat.Trimmed(w, 4)} {SheetNumberFormat.Trimmed(h, 4)}]");
            replacements.Add((at, close + 1 - at, text));
            page++;
            int next = pdf.AsSpan(close, xrefOffset - close).IndexOf(MediaBoxMarker);
            at = next < 0 ? -1 : close + next;
        }
        if (page != pageSizesPt.Count)
            throw new InvalidOperationException($"The PDF has {page} MediaBox entries for {pageSizesPt.Count} pages.");

        int Shift(int offset) => replacements.Where(r => r.Start < offset).Sum(r => r.Text.Length - r.Length);

        var output = new MemoryStream(pdf.Length + 32 * replacements.Count);
        int copied = 0;
        foreach (var (start, length, text) in replacements)
        {
            output.Write(pdf, copied, start - copied);
            output.Write(text);
            copied = start + length;
        }
        output.Write(pdf, copied, pdf.Length - copied);
        byte[] patched = output.ToArray();

        // Rewrite the in-use entries' 10-digit offsets; free entries keep theirs.
        int newEntriesStart = entriesStart + Shift(entriesStart);
        for (int i = 0; i < entryOffsets.Length; i++)
        {
            if (entryOffsets[i] < 0) continue;
            byte[] digits = Encoding.ASCII.GetBytes((entryOffsets[i] + Shift(entryOffsets[i])).ToString("D10", CultureInfo.InvariantCulture));
            digits.CopyTo(patched, newEntriesStart + 20 * i);
        }

        // startxref is the last number in the file; rewrite the tail.
        int startxref = LastIndexOf(patched, "startxref\n");
        string tail = $"startxref\n{(xrefOffset + Shift(xrefOffset)).ToString(CultureInfo.InvariantCulture)}\n%%EOF\n";
        return [.. patched.AsSpan(0, startxref), .. Encoding.ASCII.GetBytes(tail)];
    }

    private static int ReadStartXref(byte[] pdf)
    {
        int at = LastIndexOf(pdf, "startxref\n");
        if (at < 0) throw new InvalidOperationException("No startxref in the PDF from SkiaSharp.");
        int i = at + "startxref\n".Length, value = 0;
        for (; i < pdf.Length && pdf[i] is >= (byte)'0' and <= (byte)'9'; i++) value = value * 10 + (pdf[i] - '0');
        return value;
    }

    /// <summary>Reads a single-subsection xref table: each entry's offset (-1 for free entries) and
    /// where the entries start.</summary>
    private static (int[] Offsets, int EntriesStart) ReadXref(byte[] pdf, int xrefOffset)
    {
        int lineEnd(int from) => Array.IndexOf(pdf, (byte)'\n', from);
        int headerEnd = lineEnd(xrefOffset);
        if (Encoding.ASCII.GetString(pdf, xrefOffset, headerEnd - xrefOffset).Trim() != "xref")
            throw new InvalidOperationException("startxref does not point at a classic xref table.");
        int subEnd = lineEnd(headerEnd + 1);
        string[] sub = Encoding.ASCII.GetString(pdf, headerEnd + 1, subEnd - headerEnd - 1).Trim().Split(' ');
        int count = int.Parse(sub[1], CultureInfo.InvariantCulture);
        int entriesStart = subEnd + 1;
        var offsets = new int[count];
        for (int i = 0; i < count; i++)
        {
            string entry = Encoding.ASCII.GetString(pdf, entriesStart + 20 * i, 20);
            offsets[i] = entry[17] == 'n' ? int.Parse(entry.AsSpan(0, 10), CultureInfo.InvariantCulture) : -1;
        }
        string after = Encoding.ASCII.GetString(pdf, entriesStart + 20 * count, 7);
        if (after != "trailer") throw new InvalidOperationException("The PDF's xref table has more than one subsection.");
        return (offsets, entriesStart);
    }

    private static int LastIndexOf(byte[] data, string ascii) => data.AsSpan().LastIndexOf(Encoding.ASCII.GetBytes(ascii));
}
