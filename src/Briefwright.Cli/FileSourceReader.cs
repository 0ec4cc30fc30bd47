using Briefwright.Scenario;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Cli;

/// <summary>Reads inputs from disk through <see cref="SafeFile"/>: regular files only, at most the scenario size limit
/// (1 MiB) of text, and files that an input names only inside its project folder.</summary>
public sealed class FileSourceReader : ISourceReader
{
    public const long MaxBytes = YamlTreeReader.MaxBytes;

    public bool TryRead(string path, out string text, out string error) => Read(path, null, out text, out error);

    public bool TryReadInside(string path, string root, out string text, out string error) =>
        Read(path, root, out text, out error);

    public bool TryReadBytes(string path, string root, long maxBytes, out byte[] bytes, out string error) =>
        SafeFile.TryReadBytes(path, root, maxBytes, out bytes, out error);

    private static bool Read(string path, string? root, out string text, out string error)
    {
        text = "";
        if (!SafeFile.TryReadBytes(path, root, MaxBytes, out byte[] bytes, out error)) return false;
        text = SafeFile.Decode(bytes);
        return true;
    }
}
