namespace Tessel.Core.Jobs;

/// <summary>The job's <c>outputs</c> section: which files to write. summary.json is always written.</summary>
public sealed record OutputsSpec(bool Obj, bool Png, bool Svg, bool Dxf, bool Pdf, bool Stl, bool Report);
