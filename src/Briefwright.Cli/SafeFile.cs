using System.Runtime.InteropServices;
using System.Text;

namespace Briefwright.Cli;

/// <summary>
/// Reads input files without trusting them: only regular files (a FIFO would block for ever, /dev/zero never ends,
/// /proc files report a size of 0), with the size checked before reading and the read bounded anyway, and, for files
/// that an input names, only when the file is still inside the project folder once every symbolic link is followed.
/// Error messages say why a file was refused and never quote it.
/// </summary>
public static unsafe class SafeFile
{
    public static bool TryReadBytes(string path, string? root, long maxBytes, out byte[] bytes, out string error)
    {
        bytes = Array.Empty<byte>();
        try
        {
            if (Directory.Exists(path)) { error = "it is a folder, not a file"; return false; }
            var info = new FileInfo(path);
            if (!info.Exists)
            {
                error = info.LinkTarget is not null
                    ? "it is a symbolic link to a file that does not exist"
                    : "no such file";
                return false;
            }
            if (Kind(path) is { } kind && kind != "a regular file")
            {
                error = $"it is {kind}, not a regular file";
                return false;
            }
            string? real = RealPath(path);
            if (real is not null && (real.StartsWith("/proc/", StringComparison.Ordinal)
                || real.StartsWith("/sys/", StringComparison.Ordinal)
                || real.StartsWith("/dev/", StringComparison.Ordinal)))
            {
                error = "it is a system file (under /proc, /sys or /dev), not a regular file";
                return false;
            }
            if (root is not null && real is not null && RealPath(root) is { } realRoot
                && !Scenario.ProjectRoot.IsInside(real, realRoot))
            {
                error = "a symbolic link leads it out of the project folder";
                return false;
            }
            if (info.Length > maxBytes) { error = TooLarge(info.Length, maxBytes); return false; }
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 1);
            var buffer = new byte[(int)Math.Min(maxBytes + 1, Math.Max(info.Length, 4096))];
            int total = 0;
            while (true)
            {
                if (total == buffer.Length)
                {
                    if (buffer.Length > maxBytes) { error = TooLarge(total, maxBytes, atLeast: true); return false; }
                    Array.Resize(ref buffer, (int)Math.Min(maxBytes + 1, (long)buffer.Length * 2));
                }
                int n = stream.Read(buffer, total, buffer.Length - total);
                if (n == 0) break;
                total += n;
            }
            if (total > maxBytes) { error = TooLarge(total, maxBytes, atLeast: true); return false; }
            bytes = total == buffer.Length ? buffer : buffer[..total];
            error = "";
            return true;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or NotSupportedException)
        {
            error = ex is UnauthorizedAccessException ? "permission denied" : ex.Message;
            return false;
        }
    }

    /// <summary>Text with its byte-order mark honoured (UTF-8 without one), as File.ReadAllText reads it.</summary>
    public static string Decode(byte[] bytes)
    {
        using var reader = new StreamReader(
            new MemoryStream(bytes), Encoding.UTF8, detectEncodingFromByteOrderMarks: true);
        return reader.ReadToEnd();
    }

    private static string TooLarge(long size, long max, bool atLeast = false) =>
        $"the file is {(atLeast ? "more than " : "")}{Scenario.Numbers.Count(atLeast ? max : size)} bytes, over the " +
        $"limit of {Scenario.Numbers.Count(max)} bytes";

    // statx(2) and realpath(3) from the C library, found at run time (no import needed where they do not exist).
    private static readonly Lazy<(nint Statx, nint RealPath)> Libc = new(() =>
    {
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS() && !OperatingSystem.IsFreeBSD()) return (0, 0);
        foreach (var name in new[] { "libc.so.6", "libc", "/usr/lib/libSystem.dylib" })
            if (NativeLibrary.TryLoad(name, out nint lib))
            {
                NativeLibrary.TryGetExport(lib, "statx", out nint statx);
                NativeLibrary.TryGetExport(lib, "realpath", out nint real);
                return (statx, real);
            }
        return (0, 0);
    });

    /// <summary>What the path is once links are followed ("a regular file", "a FIFO", "a device"...), or null when the
    /// system cannot say.</summary>
    public static string? Kind(string path)
    {
        nint statx = Libc.Value.Statx;
        if (statx == 0) return null;
        byte[] name = Encoding.UTF8.GetBytes(path + "\0");
        byte* buffer = stackalloc byte[256];
        int rc;
        fixed (byte* p = name)
            rc = ((delegate* unmanaged<int, byte*, int, uint, byte*, int>)statx)(
                -100 /* AT_FDCWD */, p, 0, 0x1 /* STATX_TYPE */, buffer);
        if (rc != 0) return null;
        int mode = *(ushort*)(buffer + 28) & 0xF000;
        return mode switch
        {
            0x8000 => "a regular file",
            0x4000 => "a folder",
            0x1000 => "a named pipe",
            0x2000 or 0x6000 => "a device",
            0xC000 => "a socket",
            _ => "a special file",
        };
    }

    /// <summary>The path with every symbolic link, "." and ".." resolved, or null when the system cannot say.</summary>
    public static string? RealPath(string path)
    {
        nint real = Libc.Value.RealPath;
        if (real == 0) return null;
        byte[] name = Encoding.UTF8.GetBytes(path + "\0");
        byte* resolved = stackalloc byte[4097];
        nint result;
        fixed (byte* p = name)
            result = (nint)((delegate* unmanaged<byte*, byte*, byte*>)real)(p, resolved);
        return result == 0 ? null : Marshal.PtrToStringUTF8((nint)resolved);
    }
}
