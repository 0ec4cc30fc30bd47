namespace Briefwright.Scenario;

/// <summary>Where input text comes from. The command line passes the file system; tests pass a dictionary.</summary>
public interface ISourceReader
{
    /// <summary>
    /// The file's text, or an error message saying why it could not be read. The message never quotes the file.
    /// </summary>
    bool TryRead(string path, out string text, out string error);

    /// <summary>
    /// A file that an input names (an extended scenario, a life table): read only when it is a regular file that is
    /// still inside <paramref name="root"/> once symbolic links are followed.
    /// </summary>
    bool TryReadInside(string path, string root, out string text, out string error) =>
        TryRead(path, out text, out error);

    /// <summary>
    /// A binary file that a theme names (logo, font), under the same rules and at most <paramref name="maxBytes"/>
    /// long.
    /// </summary>
    bool TryReadBytes(string path, string root, long maxBytes, out byte[] bytes, out string error)
    {
        bytes = Array.Empty<byte>();
        error = "binary files cannot be read by this reader";
        return false;
    }
}
