namespace Briefwright.Model;

/// <summary>
/// Value equality for records that hold arrays or lists: a record compares such members by reference, so two results
/// computed alike would differ. Those records override <c>Equals</c> and <c>GetHashCode</c> with these.
/// </summary>
internal static class Same
{
    /// <summary>The same items in the same order (doubles compared as <see cref="double.Equals(double)"/>: NaN
    /// equals NaN).</summary>
    public static bool Items<T>(IReadOnlyList<T>? a, IReadOnlyList<T>? b) =>
        Items(a, b, EqualityComparer<T>.Default.Equals);

    public static bool Items<T>(IReadOnlyList<T>? a, IReadOnlyList<T>? b, Func<T, T, bool> equal)
    {
        if (ReferenceEquals(a, b)) return true;
        if (a is null || b is null || a.Count != b.Count) return false;
        for (int i = 0; i < a.Count; i++)
            if (!equal(a[i], b[i])) return false;
        return true;
    }

    /// <summary>A hash of the length and the first and last items (cheap; equal lists hash alike).</summary>
    public static int Hash<T>(IReadOnlyList<T>? a) =>
        a is null || a.Count == 0 ? 0 : HashCode.Combine(a.Count, a[0], a[^1]);
}
