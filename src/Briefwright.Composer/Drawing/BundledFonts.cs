using System.Collections.Concurrent;
using Briefwright.Composer.Document;
using PdfSharp.Fonts;

namespace Briefwright.Composer.Drawing;

/// <summary>
/// The fonts shipped with the tool (Liberation Sans, SIL OFL), served from embedded resources so output never
/// depends on fonts installed on the host. Each face's bytes are read once and never change.
/// </summary>
public static class BundledFonts
{
    public const string Family = "Briefwright Sans";

    private static readonly IReadOnlyDictionary<RunStyle, Lazy<byte[]>> Faces =
        new[] { RunStyle.Regular, RunStyle.Bold, RunStyle.Italic, RunStyle.BoldItalic }
            .ToDictionary(s => s, s => new Lazy<byte[]>(() => Load(FaceName(s))));

    public static string FaceName(RunStyle style) => style switch
    {
        RunStyle.Bold => "LiberationSans-Bold",
        RunStyle.Italic => "LiberationSans-Italic",
        RunStyle.BoldItalic => "LiberationSans-BoldItalic",
        _ => "LiberationSans-Regular",
    };

    public static byte[] Bytes(RunStyle style) => Faces[style].Value;

    private static byte[] Load(string face)
    {
        using var stream = typeof(BundledFonts).Assembly.GetManifestResourceStream($"fonts.{face}.ttf")
            ?? throw new InvalidOperationException($"Bundled font {face} is missing from the build.");
        // Read at its exact size: a growing copy of a font (hundreds of KB) would churn the large-object heap.
        var bytes = new byte[stream.Length];
        stream.ReadExactly(bytes);
        return bytes;
    }

    /// <summary>Makes PDFsharp find the bundled fonts (and every <see cref="FontFaces"/> made so far).</summary>
    public static void Install() => PdfFontResolver.Install();
}

/// <summary>
/// A font family given as TrueType files (a theme's fonts), made by the caller and handed to the brief's
/// <see cref="RenderSession"/>. Its <see cref="Family"/> name is derived from the bytes, so that the same files give
/// the same name in every run, and a name always stands for the same bytes.
/// </summary>
public sealed class FontFaces
{
    public FontFaces(byte[] regular, byte[] bold, byte[] italic, byte[] boldItalic)
    {
        Family = "Theme " + Sha256Hex.Upper(regular.Concat(bold).Concat(italic).Concat(boldItalic).ToArray())[..12];
        Faces = new Dictionary<RunStyle, byte[]>
        {
            [RunStyle.Regular] = regular, [RunStyle.Bold] = bold,
            [RunStyle.Italic] = italic, [RunStyle.BoldItalic] = boldItalic,
        };
    }

    /// <summary>The family name the brief's text is set in.</summary>
    public string Family { get; }

    /// <summary>Each style's TrueType bytes.</summary>
    public IReadOnlyDictionary<RunStyle, byte[]> Faces { get; }
}

/// <summary>
/// The one piece of process-wide state in the layout library, because PDFsharp takes a single global font resolver
/// (<c>GlobalFontSettings.FontResolver</c>) and asks it for faces by name: an append-only, thread-safe table from a
/// face name to its bytes. A theme family's name is derived from its bytes (<see cref="FontFaces"/>), so an entry never
/// changes meaning once added; which family a brief is set in is its <see cref="RenderSession"/>'s, never this table's.
/// </summary>
internal sealed class PdfFontResolver : IFontResolver
{
    private static readonly ConcurrentDictionary<string, byte[]> Registered = new();
    private static readonly Lazy<PdfFontResolver> Installed = new(() =>
    {
        var resolver = new PdfFontResolver();
        GlobalFontSettings.FontResolver = resolver;
        return resolver;
    });

    public static void Install() => _ = Installed.Value;

    /// <summary>Adds the faces of <paramref name="fonts"/> (once per family) and installs the resolver.</summary>
    public static void Register(FontFaces fonts)
    {
        foreach (var (style, bytes) in fonts.Faces)
            Registered.TryAdd($"{fonts.Family}|{style}", bytes);
        Install();
    }

    public FontResolverInfo? ResolveTypeface(string familyName, bool bold, bool italic)
    {
        var style = (bold, italic) switch
        {
            (true, true) => RunStyle.BoldItalic, (true, _) => RunStyle.Bold,
            (_, true) => RunStyle.Italic, _ => RunStyle.Regular,
        };
        return Registered.ContainsKey($"{familyName}|{style}")
            ? new FontResolverInfo($"{familyName}|{style}") : new FontResolverInfo(BundledFonts.FaceName(style));
    }

    public byte[]? GetFont(string faceName) =>
        Registered.TryGetValue(faceName, out var bytes) ? bytes
        : BundledFonts.Bytes(new[] { RunStyle.Regular, RunStyle.Bold, RunStyle.Italic, RunStyle.BoldItalic }
            .First(s => BundledFonts.FaceName(s) == faceName));
}
