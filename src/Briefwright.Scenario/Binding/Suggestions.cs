namespace Briefwright.Scenario.Binding;

/// <summary>"Did you mean" for unknown keys: the closest known key by edit distance, if close enough.</summary>
public static class Suggestions
{
    public static string? Closest(string given, IEnumerable<string> known)
    {
        string? best = null;
        int bestDistance = int.MaxValue;
        foreach (var k in known)
        {
            int d = Distance(given.ToLowerInvariant(), k);
            if (d < bestDistance) { best = k; bestDistance = d; }
        }
        return best is not null && bestDistance <= Math.Max(2, given.Length / 3) ? best : null;
    }

    public static int Distance(string a, string b)
    {
        var prev = new int[b.Length + 1];
        var cur = new int[b.Length + 1];
        for (int j = 0; j <= b.Length; j++) prev[j] = j;
        for (int i = 1; i <= a.Length; i++)
        {
            cur[0] = i;
            for (int j = 1; j <= b.Length; j++)
                cur[j] = Math.Min(Math.Min(cur[j - 1] + 1, prev[j] + 1), prev[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1));
            (prev, cur) = (cur, prev);
        }
        return prev[b.Length];
    }
}
