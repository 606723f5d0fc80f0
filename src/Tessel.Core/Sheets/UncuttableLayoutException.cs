namespace Tessel.Core.Sheets;

/// <summary>The flat layout cannot be cut as parts (facets lie on each other, or a part does not close into
/// one outline): the sheets are refused with this reason instead of being written wrong.</summary>
public sealed class UncuttableLayoutException(string message) : Exception(message);
