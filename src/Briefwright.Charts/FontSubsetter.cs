using System.Runtime.InteropServices;

namespace Briefwright.Charts;

/// <summary>
/// Cuts a TrueType font down to the characters charts can use, with HarfBuzz's subsetter (libHarfBuzzSharp, which
/// ScottPlot already ships). Skia embeds fonts whole, so without this every chart would carry the full font.
/// </summary>
public static partial class FontSubsetter
{
    private const string Lib = "libHarfBuzzSharp";
    private const uint NoHinting = 0x1;

    /// <summary>What chart labels use: ASCII, the Latin-1 letters of names, dashes and quotes, minus, middle dot, ×,
    /// ≤ ≥. Every glyph kept is embedded once per chart, so the set is kept small.</summary>
    public static readonly (int First, int Last)[] ChartCharacters =
    {
        (0x20, 0x7E), (0xB0, 0xB0), (0xB7, 0xB7), (0xC0, 0xFF), (0xD7, 0xD7), (0x2013, 0x2014), (0x2018, 0x201D),
        (0x2026, 0x2026), (0x2212, 0x2212), (0x2264, 0x2265),
    };

    /// <summary>Whether <paramref name="c"/> is in <see cref="ChartCharacters"/>.</summary>
    public static bool IsChartCharacter(int c) => ChartCharacters.Any(r => c >= r.First && c <= r.Last);

    /// <summary>
    /// Every character <paramref name="font"/> maps to a glyph (its cmap), read with HarfBuzz; null when the library
    /// is unavailable. Read once per font file (the bytes are the key).
    /// </summary>
    public static IReadOnlySet<int>? Characters(byte[] font)
    {
        lock (Coverage)
        {
            if (Coverage.TryGetValue(font, out var known)) return known;
        }
        HashSet<int>? set;
        try
        {
            set = Collect(font);
        }
        catch (Exception ex) when (ex is DllNotFoundException or EntryPointNotFoundException)
        {
            set = null;
        }
        lock (Coverage)
        {
            if (set is not null) Coverage.AddOrUpdate(font, set);
        }
        return set;
    }

    private static readonly System.Runtime.CompilerServices.ConditionalWeakTable<byte[], IReadOnlySet<int>> Coverage =
        new();

    private static unsafe HashSet<int> Collect(byte[] font)
    {
        fixed (byte* data = font)
        {
            IntPtr blob = hb_blob_create(data, (uint)font.Length, 0 /* duplicate */, IntPtr.Zero, IntPtr.Zero);
            IntPtr face = hb_face_create(blob, 0);
            IntPtr set = hb_set_create();
            try
            {
                hb_face_collect_unicodes(face, set);
                var result = new HashSet<int>();
                uint c = uint.MaxValue; // HB_SET_VALUE_INVALID: start before the first member
                while (hb_set_next(set, ref c) != 0) result.Add((int)c);
                return result;
            }
            finally
            {
                hb_set_destroy(set);
                hb_face_destroy(face);
                hb_blob_destroy(blob);
            }
        }
    }

    /// <summary>The subset font, or the input unchanged if the subsetter is unavailable or fails.</summary>
    public static byte[] Subset(byte[] font, (int First, int Last)[] ranges)
    {
        try
        {
            return TrySubset(font, ranges) ?? font;
        }
        catch (Exception ex) when (ex is DllNotFoundException or EntryPointNotFoundException)
        {
            return font;
        }
    }

    private static unsafe byte[]? TrySubset(byte[] font, (int First, int Last)[] ranges)
    {
        fixed (byte* data = font)
        {
            IntPtr blob = hb_blob_create(data, (uint)font.Length, 0 /* duplicate */, IntPtr.Zero, IntPtr.Zero);
            IntPtr face = hb_face_create(blob, 0);
            IntPtr input = hb_subset_input_create_or_fail();
            IntPtr subset = IntPtr.Zero, result = IntPtr.Zero;
            try
            {
                if (input == IntPtr.Zero) return null;
                IntPtr unicodes = hb_subset_input_unicode_set(input);
                foreach (var (first, last) in ranges) hb_set_add_range(unicodes, (uint)first, (uint)last);
                hb_subset_input_set_flags(input, NoHinting);
                subset = hb_subset_or_fail(face, input);
                if (subset == IntPtr.Zero) return null;
                result = hb_face_reference_blob(subset);
                byte* bytes = hb_blob_get_data(result, out uint length);
                if (bytes == null || length == 0) return null;
                return new ReadOnlySpan<byte>(bytes, (int)length).ToArray();
            }
            finally
            {
                if (result != IntPtr.Zero) hb_blob_destroy(result);
                if (subset != IntPtr.Zero) hb_face_destroy(subset);
                if (input != IntPtr.Zero) hb_subset_input_destroy(input);
                hb_face_destroy(face);
                hb_blob_destroy(blob);
            }
        }
    }

    [LibraryImport(Lib)] private static unsafe partial IntPtr hb_blob_create(
        byte* data, uint length, int mode, IntPtr userData, IntPtr destroy);
    [LibraryImport(Lib)] private static partial IntPtr hb_face_create(IntPtr blob, uint index);
    [LibraryImport(Lib)] private static partial IntPtr hb_subset_input_create_or_fail();
    [LibraryImport(Lib)] private static partial IntPtr hb_subset_input_unicode_set(IntPtr input);
    [LibraryImport(Lib)] private static partial void hb_set_add_range(IntPtr set, uint first, uint last);
    [LibraryImport(Lib)] private static partial void hb_subset_input_set_flags(IntPtr input, uint flags);
    [LibraryImport(Lib)] private static partial IntPtr hb_subset_or_fail(IntPtr source, IntPtr input);
    [LibraryImport(Lib)] private static partial IntPtr hb_face_reference_blob(IntPtr face);
    [LibraryImport(Lib)] private static unsafe partial byte* hb_blob_get_data(IntPtr blob, out uint length);
    [LibraryImport(Lib)] private static partial void hb_blob_destroy(IntPtr blob);
    [LibraryImport(Lib)] private static partial void hb_face_destroy(IntPtr face);
    [LibraryImport(Lib)] private static partial void hb_subset_input_destroy(IntPtr input);
    [LibraryImport(Lib)] private static partial IntPtr hb_set_create();
    [LibraryImport(Lib)] private static partial void hb_set_destroy(IntPtr set);
    [LibraryImport(Lib)] private static partial void hb_face_collect_unicodes(IntPtr face, IntPtr set);
    [LibraryImport(Lib)] private static partial int hb_set_next(IntPtr set, ref uint codepoint);
}
