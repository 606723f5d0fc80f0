using System.Globalization;

namespace Tessel.Output.Sheets;

/// <summary>Fixed, culture-independent number text for the text-based writers, so output is the
/// same byte for byte on every machine.</summary>
internal static class SheetNumberFormat
{
    /// <summary>Millimetres rounded to 0.1 micrometre (far below any cutter's resolution), without
    /// trailing zeros, never "-0".</summary>
    public static string Mm(double value) => Trimmed(value, 4);

    /// <summary>A value rounded to <paramref name="decimals"/> places without trailing zeros, never "-0".</summary>
    public static string Trimmed(double value, int decimals)
    {
        if (!double.IsFinite(value)) throw new ArgumentException($"Cannot write the non-finite number {value}.");
        double rounded = Math.Round(value, decimals, MidpointRounding.AwayFromZero);
        if (rounded == 0) rounded = 0; // folds -0 into 0
        return rounded.ToString("0." + new string('#', decimals), CultureInfo.InvariantCulture);
    }

    /// <summary>A value with exactly <paramref name="decimals"/> places (DXF readers like a fixed form).</summary>
    public static string Fixed(double value, int decimals)
    {
        if (!double.IsFinite(value)) throw new ArgumentException($"Cannot write the non-finite number {value}.");
        double rounded = Math.Round(value, decimals, MidpointRounding.AwayFromZero);
        if (rounded == 0) rounded = 0;
        return rounded.ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
    }
}
