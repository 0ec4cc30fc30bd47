using System.Diagnostics;

namespace Briefwright.Cli;

/// <summary>
/// Writes a file to a temporary name in a hidden folder beside it and renames it into place, so a crash or kill
/// never leaves half a file under the real name and never destroys the previous file. Temporary files left by a
/// killed process are removed by the next build in that folder.
/// </summary>
public static class AtomicFile
{
    public const string TempFolder = ".briefwright-tmp";

    /// <param name="durable">Flush to the disk before the rename (the brief, its results and the manifest), so a power
    /// cut cannot leave an empty file under the real name; annex files skip it for speed.</param>
    public static void Write(string path, byte[] bytes, bool durable = true)
    {
        string dir = Path.GetDirectoryName(Path.GetFullPath(path))!;
        string tempDir = Path.Combine(dir, TempFolder);
        Directory.CreateDirectory(tempDir);
        string temp = Path.Combine(tempDir, $"{Path.GetFileName(path)}.{Environment.ProcessId}.{Guid.NewGuid():N}.tmp");
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None))
            {
                stream.Write(bytes);
                stream.Flush(flushToDisk: durable);
            }
            File.Move(temp, path, overwrite: true);
        }
        catch
        {
            try { File.Delete(temp); } catch (IOException) { }
            throw;
        }
    }

    /// <summary>Removes temporary files of processes that are no longer running.</summary>
    public static void CleanStale(string dir)
    {
        string tempDir = Path.Combine(dir, TempFolder);
        if (!Directory.Exists(tempDir)) return;
        foreach (var file in Directory.EnumerateFiles(tempDir, "*.tmp"))
        {
            var parts = Path.GetFileName(file).Split('.');
            if (parts.Length >= 3 && int.TryParse(parts[^3], out int pid) && pid != Environment.ProcessId && !Alive(pid))
                try { File.Delete(file); } catch (IOException) { }
        }
        if (!Directory.EnumerateFileSystemEntries(tempDir).Any())
            try { Directory.Delete(tempDir); } catch (IOException) { }
    }

    private static bool Alive(int pid)
    {
        try
        {
            using var p = Process.GetProcessById(pid);
            return !p.HasExited;
        }
        catch (ArgumentException)
        {
            return false;
        }
    }
}
