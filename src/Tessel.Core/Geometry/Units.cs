namespace Tessel.Core.Geometry;

/// <summary>Length units a job may use. Everything inside the pipeline is in metres at full scale;
/// fabrication output is in millimetres at model scale.</summary>
public static class Units
{
    /// <summary>Metres per one unit of the named length unit (SI, exact for the inch and foot by definition).</summary>
    public static bool TryMetresPer(string unit, out double metres)
    {
        metres = unit switch
        {
            "m" => 1.0,
            "cm" => 0.01,
            "mm" => 0.001,
            "in" => 0.0254,
            "ft" => 0.3048,
            _ => double.NaN,
        };
        return !double.IsNaN(metres);
    }

    public static readonly string[] Known = ["m", "cm", "mm", "in", "ft"];
}
