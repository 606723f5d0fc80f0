namespace Tessel.Output.IO;

/// <summary>Writes a file so that readers see either the old file or the complete new one, never a
/// half-written one: the bytes go to a temporary name in the same folder, which is then renamed.</summary>
public static class AtomicFile
{
    /// <summary>Writes <paramref name="bytes"/> to <paramref name="path"/> through a temporary sibling file.</summary>
    /// <exception cref="IOException">Or <see cref="UnauthorizedAccessException"/> when the folder is not writable.</exception>
    public static void Write(string path, ReadOnlySpan<byte> bytes)
    {
        string temp = WriteTemporary(path, bytes);
        try
        {
            Commit(temp, path);
        }
        catch
        {
            Discard(temp);
            throw;
        }
    }

    /// <summary>First half of a write of many files: the bytes go to a temporary sibling of
    /// <paramref name="path"/>, whose name is returned for <see cref="Commit"/>.</summary>
    public static string WriteTemporary(string path, ReadOnlySpan<byte> bytes)
    {
        string full = Path.GetFullPath(path);
        string temp = Path.Combine(Path.GetDirectoryName(full) ?? ".", "." + Path.GetFileName(full) + "." + Environment.ProcessId + ".partial");
        try
        {
            using var fs = new FileStream(temp, FileMode.Create, FileAccess.Write, FileShare.None);
            fs.Write(bytes);
            fs.Flush(true);
        }
        catch
        {
            Discard(temp);
            throw;
        }
        return temp;
    }

    /// <summary>Second half: renames a temporary file from <see cref="WriteTemporary"/> over its target.</summary>
    public static void Commit(string temporary, string path) => File.Move(temporary, Path.GetFullPath(path), overwrite: true);

    /// <summary>Removes a temporary file, ignoring one that is already gone.</summary>
    public static void Discard(string temporary)
    {
        try { if (File.Exists(temporary)) File.Delete(temporary); } catch (IOException) { } catch (UnauthorizedAccessException) { }
    }
}
