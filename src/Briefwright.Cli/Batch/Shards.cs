using System.Text;

namespace Briefwright.Cli.Batch;

/// <summary>
/// Splits a list of scenario files into N shards by a hash of each path as given (FNV-1a, 64-bit), so that a
/// job-array scheduler can give shard K of N to each machine: shards are disjoint, together cover the list, and a
/// file stays in its shard when others are added.
/// </summary>
public static class Shards
{
    public static bool TryParse(string text, out int index, out int count)
    {
        index = count = 0;
        var parts = text.Split('/');
        return parts.Length == 2 && int.TryParse(parts[0], out index) && int.TryParse(parts[1], out count) && count >= 1 && index >= 1 && index <= count;
    }

    public static int Of(string path, int count)
    {
        ulong hash = 14695981039346656037UL;
        foreach (byte b in Encoding.UTF8.GetBytes(path.Replace('\\', '/')))
        {
            hash ^= b;
            hash *= 1099511628211UL;
        }
        return (int)(hash % (ulong)count) + 1;
    }

    public static IReadOnlyList<string> Select(IReadOnlyList<string> files, int index, int count) =>
        files.Where(f => Of(f, count) == index).ToList();
}
