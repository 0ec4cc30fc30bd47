using System.Text.Json.Nodes;

namespace Briefwright.Scenario;

/// <summary>
/// JSON Schema (draft 2020-12) of a theme file, made from the same key lists and limits <see cref="ThemeLoader"/>
/// checks.
/// </summary>
public static class ThemeSchema
{
    public const int MaxName = 120;
    public const int MaxFooter = 160;

    private static JsonObject Text(string description, int maxLength, string? pattern = null)
    {
        var o = new JsonObject { ["type"] = "string", ["maxLength"] = maxLength, ["description"] = description };
        if (pattern is not null) o["pattern"] = pattern;
        return o;
    }

    public static JsonObject Build()
    {
        var colours = new JsonObject();
        foreach (var key in ThemeSpec.ColourKeys)
            colours[key] = new JsonObject { ["type"] = "string", ["pattern"] = "^#[0-9A-Fa-f]{6}$" };
        var fonts = new JsonObject();
        foreach (var key in ThemeSpec.FontKeys)
            fonts[key] = Text($"TrueType file for {key.Replace('_', ' ')} text, relative to the theme", 400,
                "\\.[tT][tT][fF]$");
        return new JsonObject
        {
            ["$schema"] = "https://json-schema.org/draft/2020-12/schema",
            ["title"] = "briefwright theme (*.theme.yaml)",
            ["type"] = "object",
            ["additionalProperties"] = false,
            ["required"] = new JsonArray("name"),
            ["properties"] = new JsonObject
            {
                ["name"] = Text("Organisation or house-style name", MaxName),
                ["paper"] = new JsonObject
                {
                    ["enum"] = new JsonArray("a4", "letter"), ["description"] = "Paper size (default a4)",
                },
                ["colours"] = new JsonObject
                {
                    ["type"] = "object", ["additionalProperties"] = false, ["properties"] = colours,
                    ["description"] = "Colours written #RRGGBB",
                },
                ["chart_colours"] = new JsonObject
                {
                    ["type"] = "array",
                    ["minItems"] = ThemeSpec.MinChartColours,
                    ["maxItems"] = ThemeSpec.MaxChartColours,
                    ["items"] = new JsonObject { ["type"] = "string", ["pattern"] = "^#[0-9A-Fa-f]{6}$" },
                    ["description"] = "Colours of the options in charts, one per option in scenario order (cycled " +
                        "when there are more options); default: the standard palette, chosen to stay apart with " +
                        "colour-vision deficiencies and in greyscale",
                },
                ["footer"] = Text("Footer text on every page", MaxFooter),
                ["logo"] = Text("PNG logo, relative to the theme", 400, "\\.[pP][nN][gG]$"),
                ["fonts"] = new JsonObject
                {
                    ["type"] = "object", ["additionalProperties"] = false, ["required"] = new JsonArray("regular"),
                    ["properties"] = fonts,
                },
            },
        };
    }
}
