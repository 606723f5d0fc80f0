using System.Globalization;

namespace Tessel.Core.Pipeline;

/// <summary>Small helpers that keep progress lines and summaries grammatical.</summary>
public static class Wording
{
    /// <summary>"1 part", "3 parts", "1 seam", "12 sheets": the count and the noun in the right number.</summary>
    public static string Count(long n, string singular, string? plural = null) =>
        n.ToString("#,0", CultureInfo.InvariantCulture) + " " + (n == 1 ? singular : plural ?? singular + "s");

    /// <summary>The fitter's stop reason without a leading "converged: ", for lines that already say
    /// whether the fit converged.</summary>
    public static string StopDetail(string stopReason) =>
        stopReason.StartsWith("converged: ", StringComparison.Ordinal) ? stopReason["converged: ".Length..] : stopReason;
}
