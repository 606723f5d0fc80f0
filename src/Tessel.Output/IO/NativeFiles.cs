using System.Runtime.InteropServices;

namespace Tessel.Output.IO;

/// <summary>The two POSIX file operations .NET does not offer: a hard link, and an atomic exchange of
/// two directory entries (Linux renameat2 with RENAME_EXCHANGE, kernel 3.15 and later).</summary>
internal static class NativeFiles
{
    private const int AtCurrentDirectory = -100; // AT_FDCWD, linux/fcntl.h
    private const uint RenameExchange = 2;       // RENAME_EXCHANGE, linux/fs.h

    [DllImport("libc", EntryPoint = "link", SetLastError = true)]
    private static extern int Link([MarshalAs(UnmanagedType.LPUTF8Str)] string existing, [MarshalAs(UnmanagedType.LPUTF8Str)] string created);

    [DllImport("libc", EntryPoint = "renameat2", SetLastError = true)]
    private static extern int RenameAt2(int fromDirectory, [MarshalAs(UnmanagedType.LPUTF8Str)] string from, int toDirectory,
        [MarshalAs(UnmanagedType.LPUTF8Str)] string to, uint flags);

    /// <summary>Makes <paramref name="created"/> a second name of the file at <paramref name="existing"/>
    /// (any kind but a directory). False where the file system or platform cannot.</summary>
    public static bool TryHardLink(string existing, string created)
    {
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS() && !OperatingSystem.IsFreeBSD()) return false;
        try { return Link(existing, created) == 0; }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException) { return false; }
    }

    /// <summary>Swaps the entries <paramref name="a"/> and <paramref name="b"/> in one step, so that no
    /// moment sees either name missing. False where the kernel, C library or file system cannot
    /// (the caller then falls back to two renames).</summary>
    public static bool TryExchange(string a, string b)
    {
        if (!OperatingSystem.IsLinux()) return false;
        try { return RenameAt2(AtCurrentDirectory, a, AtCurrentDirectory, b, RenameExchange) == 0; }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException) { return false; }
    }
}
