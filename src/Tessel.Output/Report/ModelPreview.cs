namespace Tessel.Output.Report;

/// <summary>The shaded folded-model preview and the colour bar it was drawn with.</summary>
public sealed record ModelPreview(PreviewImage Image, ColourBar Bar);
