namespace Tessel.Output.Report;

/// <summary>One fit on the accuracy/buildability trade-off curve: how far the faces may depart from
/// developable (the tolerance the fit was run with) against how far the result lies from the target.</summary>
/// <param name="ToleranceDeg">Developability tolerance epsilon in degrees (angle-sum defect allowed per vertex).</param>
/// <param name="ShapeErrorM">Shape error of the fit: RMS distance to the target in metres at full scale.</param>
/// <param name="Chosen">True for the fit the build went on with (highlighted in plots).</param>
public readonly record struct ParetoPoint(double ToleranceDeg, double ShapeErrorM, bool Chosen = false);
