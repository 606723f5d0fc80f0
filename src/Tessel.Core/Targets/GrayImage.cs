namespace Tessel.Core.Targets;

/// <summary>A decoded grayscale image: <see cref="Levels"/>[row * Width + column], 0 = black,
/// 1 = white, row 0 at the top (the far, +y edge of the plan).</summary>
public sealed record GrayImage(int Width, int Height, double[] Levels);

/// <summary>Reads an image file into gray levels. Core has no image codec; the output project
/// supplies one, so Core stays free of native dependencies.</summary>
/// <exception cref="Jobs.JobError">When the file is missing or not a readable image.</exception>
public delegate GrayImage GrayImageDecoder(string path);
