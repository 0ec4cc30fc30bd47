using System.Text;

namespace Briefwright.Cli.Batch;

/// <summary>
/// Splits a list of scenario files into N shards by a hash (FNV-1a, 64-bit) of each file's path relative to its
/// scenarios folder (the project folder holding the settings file, else the file's own folder), with '/' separators,
/// so that <c>regions</c>, <c>./regions/</c> and an absolute path give the same assignment. A job-array scheduler can
/// give shard K of N to each machine: shards are disjoint, together cover the list, and a file stays in its shard when
/// others are added.
/// </summary>
public static class Shards
{
    public static bool TryParse(string text, out int index, out int count)
    {
        index = count = 0;
        var parts = text.Split('/');
        return parts.Length == 2 && int.TryParse(parts[0], out index) && int.TryParse(parts[1], out count)
            && count >= 1 && index >= 1 && index <= count;
    }

    /// <summary>The text a file's shard is computed from: its path relative to <paramref name="root"/> when it lies
    /// inside it, else its file name; normalised ('.' and '..' folded, '/' separators).</summary>
    public static string Key(string file, string? root)
    {
        string full = Path.GetFullPath(file);
        if (root is not null)
        {
            string relative = Path.GetRelativePath(Path.GetFullPath(root), full);
            if (!relative.StartsWith("..", StringComparison.Ordinal) && !Path.IsPathRooted(relative))
                return relative.Replace('\\', '/');
        }
        return Path.GetFileName(full);
    }

    public static int Of(string key, int count)
    {
        ulong hash = 14695981039346656037UL;
        foreach (byte b in Encoding.UTF8.GetBytes(key.Replace('\\', '/')))
        {
            hash ^= b;
            hash *= 1099511628211UL;
        }
        return (int)(hash % (ulong)count) + 1;
    }

    public static IReadOnlyList<string> Select(IReadOnlyList<string> files, int index, int count, string? root = null)
        => files.Where(f => Of(Key(f, root), count) == index).ToList();
}
