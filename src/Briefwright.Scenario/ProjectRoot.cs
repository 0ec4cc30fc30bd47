namespace Briefwright.Scenario;

/// <summary>
/// The confinement rule: every file a scenario or theme names (extends, life tables, logos, fonts) is written as a
/// path relative to the file that names it and must resolve inside the project folder: the folder of the scenario or
/// theme given on the command line, or the folder given with <c>--root</c>. Absolute paths and <c>..</c> that lead
/// out of it are refused before anything is opened.
/// </summary>
public static class ProjectRoot
{
    public const string Rule = "inside the project folder (the folder of the file given on the command line, or " +
        "--root)";

    /// <summary>
    /// The project folder of a top-level input: <paramref name="given"/> when set, else the input's own folder.
    /// </summary>
    public static string For(string topFile, string? given) =>
        Path.GetFullPath(given ?? (Path.GetDirectoryName(Path.GetFullPath(topFile)) ?? "."));

    /// <summary>
    /// Resolves <paramref name="named"/>, written inside <paramref name="from"/>, to a path (relative to the current
    /// folder when it lies below it, as the loader shows paths); null with the broken rule when it may not be read.
    /// </summary>
    public static string? Resolve(string from, string named, string root, out string rule)
    {
        rule = "";
        if (named.Length == 0 || named.Any(char.IsControl))
        {
            rule = "must be a file name without control characters";
            return null;
        }
        bool drive = named.Length >= 2 && named[1] == ':' && char.IsAsciiLetter(named[0]);
        if (Path.IsPathRooted(named) || drive || named[0] is '/' or '\\' or '~'
            || named.Contains("://", StringComparison.Ordinal))
        {
            rule = $"must be a path relative to the file that names it, {Rule}; absolute paths are not allowed";
            return null;
        }
        string full = Path.GetFullPath(
            Path.Combine(Path.GetDirectoryName(Path.GetFullPath(from)) ?? root, named.Replace('\\', '/')));
        if (!IsInside(full, Path.GetFullPath(root)))
        {
            rule = $"must stay {Rule}; '..' may not lead out of it";
            return null;
        }
        return ScenarioLoader.Display(full);
    }

    /// <summary>Whether <paramref name="full"/> is <paramref name="root"/> or below it (both full paths).</summary>
    public static bool IsInside(string full, string root)
    {
        string r = Path.TrimEndingDirectorySeparator(root);
        if (r.EndsWith(Path.DirectorySeparatorChar) || r.EndsWith(Path.AltDirectorySeparatorChar))
            return full.StartsWith(r, StringComparison.Ordinal);
        return full == r || full.StartsWith(r + Path.DirectorySeparatorChar, StringComparison.Ordinal);
    }
}
