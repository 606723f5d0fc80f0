using System.Globalization;

namespace Tessel.Output.Report;

/// <summary>Text for lengths in the report: millimetres with a sign and as many decimals as their size
/// deserves, always in the invariant culture.</summary>
public static class DeviationFormat
{
    /// <summary>Signed millimetres, e.g. "+1.25", "-0.031", "0".</summary>
    public static string SignedMm(double mm)
    {
        if (mm == 0) return "0";
        string digits = Unsigned(Math.Abs(mm));
        if (digits.Trim('0', '.').Length == 0) return "0";
        return (mm > 0 ? "+" : "-") + digits;
    }

    /// <summary>Millimetres without a sign, 3 to 4 significant digits.</summary>
    public static string Mm(double mm) => (mm < 0 ? "-" : "") + Unsigned(Math.Abs(mm));

    private static string Unsigned(double a)
    {
        string format = a >= 100 ? "F0" : a >= 10 ? "F1" : a >= 1 ? "F2" : a >= 0.1 ? "F3" : "F4";
        return a.ToString(format, CultureInfo.InvariantCulture);
    }
}
