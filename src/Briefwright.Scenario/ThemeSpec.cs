using System.Text.RegularExpressions;
using Briefwright.Scenario.Binding;
using Briefwright.Scenario.Diagnostics;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Scenario;

/// <summary>An organisation's look: name, paper size, colours (#RRGGBB), footer text and a PNG logo.</summary>
public sealed record ThemeSpec(string Name, string Paper, IReadOnlyDictionary<string, string> Colours, string? Footer, string? LogoPath)
{
    public static readonly string[] FontKeys = { "regular", "bold", "italic", "bold_italic" };

    /// <summary>TrueType files by style (regular, bold, italic, bold_italic), resolved to paths; empty for the bundled font.</summary>
    public IReadOnlyDictionary<string, string> FontPaths { get; init; } = new Dictionary<string, string>();

    public static readonly string[] ColourKeys = { "accent", "text", "muted", "rule", "box_fill", "header_fill" };

    public static ThemeSpec Default { get; } = new("briefwright standard", "a4", new Dictionary<string, string>(), null, null);
}

/// <summary>Reads a theme file (YAML) with the same positioned errors as scenarios.</summary>
public static partial class ThemeLoader
{
    [GeneratedRegex("^#[0-9A-Fa-f]{6}$")]
    private static partial Regex Hex();

    public static (ThemeSpec? Theme, IReadOnlyList<Diagnostic> Problems, SourceSet Sources) Load(string path, ISourceReader reader)
    {
        var sources = new SourceSet();
        if (!reader.TryRead(path, out string text, out string error))
            return (null, new[] { new Diagnostic(new SourceSpan(path, 1, 1), "", $"cannot read the theme ({error})", null) }, sources);
        sources.Add(path, text);
        var (root, problems) = YamlTreeReader.Read(path, text);
        if (root is null) return (null, problems, sources);
        var ctx = new BindContext();
        if (root is not YMapping top) { ctx.Report(root.At, "", "a theme must be a mapping", root.Kind); return (null, ctx.Problems, sources); }
        ctx.CheckKeys(top, "", "name", "paper", "colours", "footer", "logo", "fonts");
        string? name = ctx.Text(top, "name", "", required: true, maxLength: ThemeSchema.MaxName);
        string paper = ctx.Choice(top, "paper", "", required: false, "a4", "letter") ?? "a4";
        string? footer = ctx.Text(top, "footer", "", required: false, maxLength: ThemeSchema.MaxFooter);
        string? logo = ctx.Text(top, "logo", "", required: false);
        var colours = new Dictionary<string, string>();
        if (ctx.Mapping(top, "colours", "", required: false) is { } c)
        {
            ctx.CheckKeys(c, "colours", ThemeSpec.ColourKeys);
            foreach (var (key, value) in c.Entries)
            {
                if (!ThemeSpec.ColourKeys.Contains(key.Value)) continue;
                if (value is YScalar s && Hex().IsMatch(s.Value)) colours[key.Value] = s.Value;
                else ctx.Report(value.At, $"colours.{key.Value}", "must be a colour written #RRGGBB", BindContext.Show(value));
            }
        }
        var fonts = new Dictionary<string, string>();
        if (ctx.Mapping(top, "fonts", "", required: false) is { } f)
        {
            ctx.CheckKeys(f, "fonts", ThemeSpec.FontKeys);
            foreach (var key in ThemeSpec.FontKeys)
            {
                string? file = ctx.Text(f, key, "fonts", required: key == "regular");
                if (file is null) continue;
                if (!file.EndsWith(".ttf", StringComparison.OrdinalIgnoreCase))
                    ctx.Report(f[key]!.At, $"fonts.{key}", "must be a TrueType font file (.ttf)", $"'{file}'");
                else fonts[key] = ScenarioLoader.Resolve(path, file);
            }
        }
        if (logo is not null && !logo.EndsWith(".png", StringComparison.OrdinalIgnoreCase))
            ctx.Report(top["logo"]!.At, "logo", "must be a PNG file (.png)", $"'{logo}'");
        if (ctx.Problems.Count > 0 || name is null) return (null, ctx.Problems, sources);
        string? logoPath = logo is null ? null : ScenarioLoader.Resolve(path, logo);
        return (new ThemeSpec(name, paper, colours, footer, logoPath) { FontPaths = fonts }, ctx.Problems, sources);
    }
}
