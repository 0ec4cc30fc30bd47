using System.Text.RegularExpressions;
using Briefwright.Scenario.Binding;
using Briefwright.Scenario.Diagnostics;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Scenario;

/// <summary>An organisation's look: name, paper size, colours (#RRGGBB), footer text and a PNG logo.</summary>
public sealed record ThemeSpec(string Name, string Paper, IReadOnlyDictionary<string, string> Colours, string? Footer,
    string? LogoPath)
{
    public static readonly string[] FontKeys = { "regular", "bold", "italic", "bold_italic" };

    /// <summary>
    /// TrueType files by style (regular, bold, italic, bold_italic), resolved to paths; empty for the bundled font.
    /// </summary>
    public IReadOnlyDictionary<string, string> FontPaths { get; init; } = new Dictionary<string, string>();

    public static readonly string[] ColourKeys = { "accent", "text", "muted", "rule", "box_fill", "header_fill" };

    /// <summary>
    /// The options' colours in charts, in scenario order (#RRGGBB each); empty for the standard palette.
    /// </summary>
    public IReadOnlyList<string> ChartColours { get; init; } = Array.Empty<string>();

    /// <summary>How many chart colours a theme may give.</summary>
    public const int MinChartColours = 2, MaxChartColours = 8;

    public static ThemeSpec Default { get; } =
        new("briefwright standard", "a4", new Dictionary<string, string>(), null, null);

    /// <summary>The logo as read and checked by <see cref="ThemeLoader"/>: PNG bytes and size in pixels.</summary>
    public (byte[] Png, int Width, int Height)? Logo { get; init; }

    /// <summary>The font files as read and checked by <see cref="ThemeLoader"/>, by style.</summary>
    public IReadOnlyDictionary<string, byte[]> FontFiles { get; init; } = new Dictionary<string, byte[]>();
}

/// <summary>Reads a theme file (YAML) with the same positioned errors as scenarios, and its logo and fonts, which must
/// lie inside the project folder (<see cref="ProjectRoot"/>: the theme's folder, or <c>root</c>) and are checked
/// whole (<see cref="ThemeAssets"/>) before anything uses them.</summary>
public static partial class ThemeLoader
{
    [GeneratedRegex(@"^#[0-9A-Fa-f]{6}\z")]
    private static partial Regex Hex();

    public static (ThemeSpec? Theme, IReadOnlyList<Diagnostic> Problems, SourceSet Sources) Load(string path,
        ISourceReader reader, string? projectRoot = null)
    {
        var sources = new SourceSet();
        if (!reader.TryRead(path, out string text, out string error))
            return (null, new[] { new Diagnostic(new SourceSpan(path, 1, 1), "",
                $"cannot read the theme ({error})", null) }, sources);
        if (!text.Contains('\0')) sources.Add(path, text);
        string project = ProjectRoot.For(path, projectRoot);
        var (root, problems) = YamlTreeReader.Read(path, text, "theme");
        if (root is null) return (null, problems, sources);
        var ctx = new BindContext();
        if (root is not YMapping top)
        {
            ctx.Report(root.At, "", "a theme must be a mapping", root.Kind);
            return (null, ctx.Problems, sources);
        }
        ctx.CheckKeys(top, "", "name", "paper", "colours", "chart_colours", "footer", "logo", "fonts");
        string? name = ctx.Text(top, "name", "", required: true, maxLength: ThemeSchema.MaxName);
        string paper = ctx.Choice(top, "paper", "", required: false, "a4", "letter") ?? "a4";
        string? footer = ctx.Text(top, "footer", "", required: false, maxLength: ThemeSchema.MaxFooter);
        string? logo = ctx.Text(top, "logo", "", required: false);
        var colours = ReadColours(ctx, top);
        var chartColours = ReadChartColours(ctx, top);
        var (fonts, fontFiles) = ReadFonts(reader, ctx, path, project, top);
        var (logoImage, logoPath) = ReadLogo(reader, ctx, path, project, top, logo);
        if (ctx.Problems.Count > 0 || name is null) return (null, ctx.Problems, sources);
        var theme = new ThemeSpec(name, paper, colours, footer, logoPath)
        {
            FontPaths = fonts, FontFiles = fontFiles, Logo = logoImage, ChartColours = chartColours,
        };
        return (theme, ctx.Problems, sources);
    }

    /// <summary><c>colours</c>: each known key's colour written #RRGGBB.</summary>
    private static Dictionary<string, string> ReadColours(BindContext ctx, YMapping top)
    {
        var colours = new Dictionary<string, string>();
        if (ctx.Mapping(top, "colours", "", required: false) is { } c)
        {
            ctx.CheckKeys(c, "colours", ThemeSpec.ColourKeys);
            foreach (var (key, value) in c.Entries)
            {
                if (!ThemeSpec.ColourKeys.Contains(key.Value)) continue;
                if (value is YScalar s && Hex().IsMatch(s.Value)) colours[key.Value] = s.Value;
                else ctx.Report(value.At, $"colours.{key.Value}",
                    "must be a colour written #RRGGBB", BindContext.Show(value));
            }
        }
        return colours;
    }

    /// <summary><c>chart_colours</c>: a list of colours written #RRGGBB, one per option in scenario order.</summary>
    private static List<string> ReadChartColours(BindContext ctx, YMapping top)
    {
        var chartColours = new List<string>();
        if (top["chart_colours"] is { } cc)
        {
            if (cc is not YSequence seq || seq.Items.Count < ThemeSpec.MinChartColours
                || seq.Items.Count > ThemeSpec.MaxChartColours)
                ctx.Report(cc.At, "chart_colours",
                    $"must be a list of {ThemeSpec.MinChartColours} to {ThemeSpec.MaxChartColours} colours written " +
                    "#RRGGBB, one per option in scenario order", BindContext.Show(cc));
            else
                for (int i = 0; i < seq.Items.Count; i++)
                {
                    if (seq.Items[i] is YScalar s && Hex().IsMatch(s.Value)) chartColours.Add(s.Value);
                    else ctx.Report(seq.Items[i].At, $"chart_colours[{i}]",
                        "must be a colour written #RRGGBB", BindContext.Show(seq.Items[i]));
                }
        }
        return chartColours;
    }

    /// <summary><c>fonts</c>: each style's TrueType file, inside the project folder and checked whole; its full
    /// path and its bytes by style.</summary>
    private static (Dictionary<string, string> Paths, Dictionary<string, byte[]> Files) ReadFonts(ISourceReader reader,
        BindContext ctx, string path, string project, YMapping top)
    {
        var fonts = new Dictionary<string, string>();
        var fontFiles = new Dictionary<string, byte[]>();
        if (ctx.Mapping(top, "fonts", "", required: false) is { } f)
        {
            ctx.CheckKeys(f, "fonts", ThemeSpec.FontKeys);
            foreach (var key in ThemeSpec.FontKeys)
            {
                string? file = ctx.Text(f, key, "fonts", required: key == "regular");
                if (file is null) continue;
                var at = f[key]!.At;
                if (!file.EndsWith(".ttf", StringComparison.OrdinalIgnoreCase))
                    ctx.Report(at, $"fonts.{key}", "must be a TrueType font file (.ttf)", BindContext.Quote(file));
                else if (ReadAsset(reader, ctx, path, file, project, at, $"fonts.{key}",
                    ThemeAssets.MaxFontBytes, "font") is { } bytes)
                {
                    if (ThemeAssets.CheckTrueType(bytes) is { } rule)
                        ctx.Report(at, $"fonts.{key}", rule, BindContext.Quote(file));
                    else
                    {
                        fonts[key] = ProjectRoot.Resolve(path, file, project, out _)!;
                        fontFiles[key] = bytes;
                    }
                }
            }
        }
        return (fonts, fontFiles);
    }

    /// <summary><c>logo</c>: a PNG file inside the project folder, checked whole; its bytes and size, and its full
    /// path (nulls when none is named or it is refused).</summary>
    private static ((byte[], int, int)? Image, string? Path) ReadLogo(ISourceReader reader, BindContext ctx,
        string path, string project, YMapping top, string? logo)
    {
        (byte[], int, int)? logoImage = null;
        string? logoPath = null;
        if (logo is not null)
        {
            var at = top["logo"]!.At;
            if (!logo.EndsWith(".png", StringComparison.OrdinalIgnoreCase))
                ctx.Report(at, "logo", "must be a PNG file (.png)", BindContext.Quote(logo));
            else if (ReadAsset(reader, ctx, path, logo, project, at, "logo",
                ThemeAssets.MaxLogoBytes, "logo") is { } png)
            {
                if (ThemeAssets.CheckPng(png, out int w, out int h) is { } rule)
                    ctx.Report(at, "logo", rule, BindContext.Quote(logo));
                else
                {
                    logoImage = (png, w, h);
                    logoPath = ProjectRoot.Resolve(path, logo, project, out _);
                }
            }
        }
        return (logoImage, logoPath);
    }

    private static byte[]? ReadAsset(ISourceReader reader, BindContext ctx, string theme, string file, string project,
        SourceSpan at, string field, long maxBytes, string what)
    {
        if (ProjectRoot.Resolve(theme, file, project, out string rule) is not { } full)
        {
            ctx.Report(at, field, rule, BindContext.Quote(file));
            return null;
        }
        if (!reader.TryReadBytes(full, project, maxBytes, out byte[] bytes, out string error))
        {
            ctx.Report(at, field, $"cannot read the {what} ({error})", BindContext.Quote(file));
            return null;
        }
        return bytes;
    }
}
