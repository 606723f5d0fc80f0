namespace Tessel.Output.Report;

/// <summary>What the deviation colour bar of a preview shows and where it was drawn, so that callers
/// and tests can read back the limits the renderer used.</summary>
/// <param name="MinM">Deviation at the bottom end of the bar, metres at full scale (the smallest reported).</param>
/// <param name="MaxM">Deviation at the top end of the bar, metres at full scale (the largest reported).</param>
/// <param name="ScaleDenominator">Model scale 1:n used for the model-scale labels.</param>
/// <param name="Left">Left pixel column of the bar.</param>
/// <param name="Top">Top pixel row of the bar (colour of <paramref name="MaxM"/>).</param>
/// <param name="Right">Right pixel column of the bar (exclusive).</param>
/// <param name="Bottom">Bottom pixel row of the bar (exclusive; the row above shows <paramref name="MinM"/>).</param>
public sealed record ColourBar(double MinM, double MaxM, double ScaleDenominator, int Left, int Top, int Right, int Bottom)
{
    /// <summary>Lower limit in millimetres at model scale.</summary>
    public double MinModelMm => MinM * 1000 / ScaleDenominator;
    /// <summary>Upper limit in millimetres at model scale.</summary>
    public double MaxModelMm => MaxM * 1000 / ScaleDenominator;
    /// <summary>Lower limit in millimetres at full scale.</summary>
    public double MinFullMm => MinM * 1000;
    /// <summary>Upper limit in millimetres at full scale.</summary>
    public double MaxFullMm => MaxM * 1000;
}
