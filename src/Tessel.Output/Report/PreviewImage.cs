namespace Tessel.Output.Report;

/// <summary>An encoded preview figure.</summary>
/// <param name="Png">PNG file bytes (deterministic for the same input).</param>
/// <param name="Width">Width in pixels.</param>
/// <param name="Height">Height in pixels.</param>
public sealed record PreviewImage(byte[] Png, int Width, int Height);
