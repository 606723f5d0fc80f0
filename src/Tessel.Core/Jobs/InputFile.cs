using System.Runtime.InteropServices;

namespace Tessel.Core.Jobs;

/// <summary>Checks and reads the files a job names (job file, mesh, height-map image): regular files
/// only, so that a device such as /dev/zero (which never ends) or a named pipe (whose open waits for a
/// writer forever) is refused with one line instead of exhausting memory or hanging; and no larger
/// than a cap, read without trusting the size the file system reports.</summary>
public static class InputFile
{
    /// <summary>Largest mesh file read: a binary STL of about 4 million triangles. A target surface
    /// needs far fewer; the fit samples it at the pattern's vertices.</summary>
    public const long MaxMeshBytes = 200L * 1024 * 1024;

    /// <summary>Largest height-map image file read (the pixel count is capped separately).</summary>
    public const long MaxImageBytes = 200L * 1024 * 1024;

    /// <summary>Throws <see cref="JobError"/> at <paramref name="field"/> unless <paramref name="path"/>
    /// is (or is a symbolic link to) an existing regular file of at most <paramref name="maxBytes"/>.</summary>
    public static void RequireRegular(string path, string field, string what, long maxBytes)
    {
        var info = new FileInfo(path);
        if (Directory.Exists(path)) throw new JobError(field, $"{path} is a folder, not {what}; check the path");
        if (!info.Exists) throw new JobError(field, $"{what} not found: {path}");
        if (KindOf(path) is { } kind && kind != "regular file")
            throw new JobError(field, $"{path} is a {kind}, not a regular file; give the path of the {what} itself");
        long length = new FileInfo(info.LinkTarget is null ? path : info.ResolveLinkTarget(true)?.FullName ?? path).Length;
        if (length > maxBytes)
            throw new JobError(field, $"{path} is {length / (1024.0 * 1024):0.#} MB; {what}s are limited to {maxBytes / (1024 * 1024)} MB, so reduce it: {path}");
    }

    /// <summary>Reads a file checked by <see cref="RequireRegular"/>, at most <paramref name="maxBytes"/>
    /// whatever it grows to meanwhile.</summary>
    public static byte[] ReadBounded(string path, string field, string what, long maxBytes)
    {
        RequireRegular(path, field, what, maxBytes);
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
        using var buffer = new MemoryStream();
        var chunk = new byte[1 << 16];
        int n;
        while ((n = stream.Read(chunk, 0, chunk.Length)) > 0)
        {
            if (buffer.Length + n > maxBytes)
                throw new JobError(field, $"{path} is larger than {maxBytes / (1024 * 1024)} MB; {what}s are limited to that, so reduce it: {path}");
            buffer.Write(chunk, 0, n);
        }
        return buffer.ToArray();
    }

    [DllImport("libc", EntryPoint = "statx", SetLastError = true)]
    private static extern int StatX(int directory, [MarshalAs(UnmanagedType.LPUTF8Str)] string path, int flags, uint mask, byte[] buffer);

    /// <summary>What kind of file system entry <paramref name="path"/> finally names ("regular file",
    /// "character device", ...), following symbolic links; null where that cannot be asked (not Linux).</summary>
    /// <remarks>statx(2) because its result layout is the same on every Linux architecture: stx_mode is
    /// the 16-bit field at byte 28 of the 256-byte struct statx (linux/stat.h).</remarks>
    public static string? KindOf(string path)
    {
        if (!OperatingSystem.IsLinux()) return null;
        const int AtCurrentDirectory = -100;
        const uint StatxType = 0x1;
        var buffer = new byte[256];
        try
        {
            if (StatX(AtCurrentDirectory, path, 0, StatxType, buffer) != 0) return null;
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException) { return null; }
        int mode = BitConverter.ToUInt16(buffer, 28) & 0xF000;
        return mode switch
        {
            0x8000 => "regular file",
            0x4000 => "folder",
            0x2000 => "character device",
            0x6000 => "block device",
            0x1000 => "named pipe (FIFO)",
            0xC000 => "socket",
            _ => "special file",
        };
    }
}
