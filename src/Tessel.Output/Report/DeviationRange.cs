namespace Tessel.Output.Report;

/// <summary>The smallest and largest signed vertex deviation of a model: the limits every report view
/// (colour bar, tables, summaries) shows, computed in one place so they always agree.</summary>
public static class DeviationRange
{
    /// <summary>(min, max) of <see cref="ReportModel.VertexDeviationM"/> in metres at full scale; (0, 0) when empty.</summary>
    public static (double MinM, double MaxM) Of(ReportModel model)
    {
        var d = model.VertexDeviationM;
        if (d.Length == 0) return (0, 0);
        double min = d[0], max = d[0];
        foreach (double v in d)
        {
            if (!double.IsFinite(v)) throw new ArgumentException("deviation holds a value that is not finite");
            min = Math.Min(min, v); max = Math.Max(max, v);
        }
        return (min, max);
    }
}
