namespace Tessel.Output.Report;

/// <summary>One iteration of the constrained least-squares solver as the report plots it.</summary>
/// <param name="Iteration">Iteration number, 0 for the starting point.</param>
/// <param name="Objective">Value of the least-squares objective (dimensionless or m^2, as the solver reports it; must be &gt; 0 to plot on a log axis).</param>
/// <param name="MaxResidual">Largest absolute constraint residual (must be &gt; 0 to plot on a log axis).</param>
public readonly record struct ConvergenceStep(int Iteration, double Objective, double MaxResidual);
