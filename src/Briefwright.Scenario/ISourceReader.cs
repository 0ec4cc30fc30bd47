namespace Briefwright.Scenario;

/// <summary>Where input text comes from. The command line passes the file system; tests pass a dictionary.</summary>
public interface ISourceReader
{
    /// <summary>The file's text, or an error message saying why it could not be read.</summary>
    bool TryRead(string path, out string text, out string error);
}
