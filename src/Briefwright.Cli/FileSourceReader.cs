using Briefwright.Scenario;

namespace Briefwright.Cli;

/// <summary>Reads inputs from disk, refusing files over the scenario size limit before loading them.</summary>
public sealed class FileSourceReader : ISourceReader
{
    public const long MaxBytes = 4L << 20;

    public bool TryRead(string path, out string text, out string error)
    {
        text = "";
        try
        {
            var info = new FileInfo(path);
            if (!info.Exists)
            {
                error = Directory.Exists(path) ? "it is a folder, not a file" : "no such file";
                return false;
            }
            if (info.Length > MaxBytes)
            {
                error = $"the file is {info.Length / 1024} KiB, over the {MaxBytes / 1024} KiB limit";
                return false;
            }
            text = File.ReadAllText(path);
            error = "";
            return true;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            error = ex.Message;
            return false;
        }
    }
}
