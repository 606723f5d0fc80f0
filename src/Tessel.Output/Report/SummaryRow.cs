namespace Tessel.Output.Report;

/// <summary>One line of the report's summary table, already formatted for people to read.</summary>
/// <param name="Label">What the figure is ("vertices", "max deviation (full scale)").</param>
/// <param name="Value">The figure with its unit ("412", "3.2 mm").</param>
public sealed record SummaryRow(string Label, string Value);
