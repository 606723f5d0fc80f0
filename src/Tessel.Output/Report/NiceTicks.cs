namespace Tessel.Output.Report;

/// <summary>Round tick values for plot axes: steps of 1, 2 or 5 times a power of ten, so that labels
/// read as short decimals.</summary>
public static class NiceTicks
{
    /// <summary>Axis range widened outward to whole steps, and the ticks inside it.</summary>
    /// <param name="min">Smallest data value.</param>
    /// <param name="max">Largest data value.</param>
    /// <param name="targetCount">Roughly how many intervals the axis should have.</param>
    /// <returns>The widened range [Low, High] and the tick values from Low to High inclusive.</returns>
    public static (double Low, double High, double[] Ticks) For(double min, double max, int targetCount = 5)
    {
        if (!double.IsFinite(min) || !double.IsFinite(max)) throw new ArgumentException("axis range must be finite");
        if (max < min) (min, max) = (max, min);
        if (max - min < 1e-300 * Math.Max(1, Math.Abs(max)) || max == min)
        {
            // A single value still needs a visible axis: open it by one unit of its own magnitude.
            double pad = min == 0 ? 1 : Math.Abs(min) * 0.5;
            min -= pad; max += pad;
        }
        double step = Step((max - min) / Math.Max(1, targetCount));
        // Round away from the data by a whisker so values on a tick stay on it despite rounding.
        double low = Math.Floor(min / step + 1e-9) * step;
        double high = Math.Ceiling(max / step - 1e-9) * step;
        int count = (int)Math.Round((high - low) / step) + 1;
        var ticks = new double[count];
        for (int i = 0; i < count; i++)
        {
            ticks[i] = low + i * step;
            if (Math.Abs(ticks[i]) < step * 1e-9) ticks[i] = 0; // no "-0" labels
        }
        return (low, high, ticks);
    }

    /// <summary>The 1-2-5 step nearest above a raw step.</summary>
    public static double Step(double raw)
    {
        if (!(raw > 0)) return 1;
        double power = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        double m = raw / power;
        double nice = m <= 1 + 1e-9 ? 1 : m <= 2 + 1e-9 ? 2 : m <= 5 + 1e-9 ? 5 : 10;
        return nice * power;
    }

    /// <summary>Shortest invariant-culture label that shows a tick at the precision of its step.</summary>
    public static string Label(double value, double step)
    {
        int decimals = step >= 1 ? 0 : (int)Math.Ceiling(-Math.Log10(step) - 1e-9);
        return value.ToString("F" + Math.Min(decimals, 12), System.Globalization.CultureInfo.InvariantCulture);
    }
}
