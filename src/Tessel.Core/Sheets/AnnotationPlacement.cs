using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>The outcome of placing annotations into a region of a sheet.</summary>
/// <param name="Sheet">The sheet with the annotation lines appended.</param>
/// <param name="Omitted">Blocks that did not fit ("title", "print check", "legend", "cautions");
/// put them on a cover sheet (<see cref="SheetAnnotations.CoverSheet"/>) or enlarge the strip.</param>
/// <param name="UsedHeightMm">Height of the region actually used, from its top edge.</param>
public sealed record AnnotationPlacement(Sheet Sheet, IReadOnlyList<string> Omitted, double UsedHeightMm);
