using System.Collections.Concurrent;
using Briefwright.Composer.Document;
using PdfSharp.Fonts;

namespace Briefwright.Composer.Drawing;

/// <summary>
/// The fonts shipped with the tool (Liberation Sans, SIL OFL), served from embedded resources so output never
/// depends on fonts installed on the host. Loaded once per process.
/// </summary>
public sealed class BundledFonts : IFontResolver
{
    public const string Family = "Briefwright Sans";
    private static readonly ConcurrentDictionary<string, byte[]> Cache = new();
    private static readonly object Gate = new();
    private static bool installed;

    public static string FaceName(RunStyle style) => style switch
    {
        RunStyle.Bold => "LiberationSans-Bold",
        RunStyle.Italic => "LiberationSans-Italic",
        RunStyle.BoldItalic => "LiberationSans-BoldItalic",
        _ => "LiberationSans-Regular",
    };

    public static byte[] Bytes(RunStyle style) => Load(FaceName(style));

    private static byte[] Load(string face) => Cache.GetOrAdd(face, name =>
    {
        using var stream = typeof(BundledFonts).Assembly.GetManifestResourceStream($"fonts.{name}.ttf")
            ?? throw new InvalidOperationException($"Bundled font {name} is missing from the build.");
        // Read at its exact size: a growing copy of a font (hundreds of KB) would churn the large-object heap.
        var bytes = new byte[stream.Length];
        stream.ReadExactly(bytes);
        return bytes;
    });

    /// <summary>Registers the resolver with PDFsharp once; PDFsharp allows a single global resolver.</summary>
    public static void Install()
    {
        lock (Gate)
        {
            if (installed) return;
            GlobalFontSettings.FontResolver = new BundledFonts();
            installed = true;
        }
    }

    private static readonly ConcurrentDictionary<string, byte[]> Registered = new();

    /// <summary>
    /// Registers a font family given as TrueType files (a theme's fonts) and returns its name, derived from the
    /// bytes so that the same files give the same name in every run.
    /// </summary>
    public static string Register(byte[] regular, byte[] bold, byte[] italic, byte[] boldItalic)
    {
        string family = "Theme " + Sha256Hex.Upper(regular.Concat(bold).Concat(italic).Concat(boldItalic).ToArray())[..12];
        Registered.TryAdd($"{family}|{RunStyle.Regular}", regular);
        Registered.TryAdd($"{family}|{RunStyle.Bold}", bold);
        Registered.TryAdd($"{family}|{RunStyle.Italic}", italic);
        Registered.TryAdd($"{family}|{RunStyle.BoldItalic}", boldItalic);
        return family;
    }

    public FontResolverInfo? ResolveTypeface(string familyName, bool bold, bool italic)
    {
        var style = (bold, italic) switch { (true, true) => RunStyle.BoldItalic, (true, _) => RunStyle.Bold, (_, true) => RunStyle.Italic, _ => RunStyle.Regular };
        return Registered.ContainsKey($"{familyName}|{style}") ? new FontResolverInfo($"{familyName}|{style}") : new FontResolverInfo(FaceName(style));
    }

    public byte[]? GetFont(string faceName) => Registered.TryGetValue(faceName, out var bytes) ? bytes : Load(faceName);
}
