using ScottPlot;
using SkiaSharp;

namespace Briefwright.Charts;

/// <summary>
/// Serves the brief's body font to ScottPlot from bytes (no host fonts). ScottPlot caches typefaces by name,
/// so the resolver registers one fixed family name per process.
/// </summary>
public sealed class ChartFont : ScottPlot.IFontResolver
{
    public const string Family = "Briefwright Chart Sans";
    private static readonly object Gate = new();
    private static readonly ChartFont Resolver = new();
    private static bool installed;
    private readonly Dictionary<string, (SKTypeface Regular, SKTypeface Bold)> families = new();
    private readonly Dictionary<string, (byte[] Regular, byte[] Bold)> sources = new();

    private static readonly AsyncLocal<string?> CurrentFamily = new();

    /// <summary>
    /// The family charts are drawn in on this thread of work (a theme's fonts replace the bundled one); other
    /// threads, such as a warm-up running beside a real brief, keep their own.
    /// </summary>
    public static string Current => CurrentFamily.Value ?? Family;

    private static SKTypeface Typeface(byte[] ttf, IReadOnlyCollection<int>? extra = null)
    {
        var ranges = extra is null ? FontSubsetter.ChartCharacters : FontSubsetter.ChartCharacters.Concat(extra.Select(c => (c, c))).ToArray();
        return SKTypeface.FromData(SKData.CreateCopy(FontSubsetter.Subset(ttf, ranges)));
    }

    public static void Install(byte[] regularTtf, byte[] boldTtf) => Register(Family, regularTtf, boldTtf);

    /// <summary>Whether <see cref="Install"/> has run in this process.</summary>
    public static bool IsInstalled
    {
        get { lock (Gate) return installed; }
    }

    /// <summary>Registers a family by name (once) and makes ScottPlot resolve it from these bytes.</summary>
    public static void Register(string family, byte[] regularTtf, byte[] boldTtf)
    {
        lock (Gate)
        {
            if (!installed)
            {
                Fonts.FontResolvers.Insert(0, Resolver);
                Fonts.Default = Family;
                installed = true;
            }
            if (!Resolver.families.ContainsKey(family))
            {
                Resolver.families[family] = (Typeface(regularTtf), Typeface(boldTtf));
                Resolver.sources[family] = (regularTtf, boldTtf);
            }
        }
    }

    /// <summary>
    /// The family to draw charts in when their texts use <paramref name="characters"/>: <paramref name="family"/>
    /// itself when they all lie in <see cref="FontSubsetter.ChartCharacters"/>, else a variant of it (registered here,
    /// once per set) cut to those ranges plus every other character used, whatever its script. Characters the font
    /// does not carry are left out here; <c>GlyphCheck</c> refuses them before any chart is drawn.
    /// </summary>
    public static string Variant(string family, IEnumerable<int> characters)
    {
        var extra = characters.Where(c => c >= 0x20 && !FontSubsetter.IsChartCharacter(c)).Distinct().Order().ToList();
        if (extra.Count == 0) return family;
        string name = family + " " + Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(
            System.Text.Encoding.UTF8.GetBytes(string.Join(",", extra))))[..12];
        lock (Gate)
        {
            if (!Resolver.families.ContainsKey(name))
            {
                if (!Resolver.sources.TryGetValue(family, out var bytes))
                    throw new InvalidOperationException($"The chart font family '{family}' is not registered.");
                Resolver.families[name] = (Typeface(bytes.Regular, extra), Typeface(bytes.Bold, extra));
            }
        }
        return name;
    }

    /// <summary>Draws this thread of work's charts in <paramref name="family"/> (registered before) from now on.</summary>
    public static void Use(string family) => CurrentFamily.Value = family;

    public SKTypeface? CreateTypeface(string fontName, FontWeight weight, FontSlant slant, FontSpacing spacing) =>
        families.TryGetValue(fontName, out var f) ? (weight >= FontWeight.SemiBold ? f.Bold : f.Regular) : null;

    public SKTypeface? CreateTypeface(string fontName, bool bold, bool italic) =>
        families.TryGetValue(fontName, out var f) ? (bold ? f.Bold : f.Regular) : null;
}
