using System.Globalization;
using System.Text.Json.Nodes;
using Briefwright.Scenario;
using Briefwright.Scenario.Binding;
using Briefwright.Scenario.Diagnostics;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Cli.Project;

/// <summary>What a project settings field holds; the loader's checks and the JSON Schema both follow it.</summary>
public enum SettingKind
{
    /// <summary>A path, relative to the settings file's folder.</summary>
    Path,

    /// <summary><c>scenario</c> (each brief keeps its own brief.date) or a date written YYYY-MM-DD.</summary>
    DateRule,

    /// <summary>A whole number from 1 to <see cref="ProjectSettings.MaxJobs"/>.</summary>
    Jobs,

    /// <summary>true or false.</summary>
    Flag,

    /// <summary>A list of output format names (pdf, html, xlsx, docx).</summary>
    Formats,
}

/// <summary>One field of the settings file: its key, kind and the text shown in the schema and the docs.</summary>
public sealed record SettingField(string Key, SettingKind Kind, string Description);

/// <summary>
/// The defaults a folder of scenarios is built with (template, theme, output folder, date rule, jobs, chart copies,
/// CSV byte order mark), read from <see cref="FileName"/>: the nearest one in the scenarios' folder or a folder above
/// it. Options on the command line win over it. Paths inside it are relative to its own folder.
/// </summary>
public sealed record ProjectSettings(
    string File,
    string? Template,
    string? Theme,
    string? Out,
    DateOnly? Date,
    int? Jobs,
    bool? ChartCopies,
    bool? CsvByteOrderMark)
{
    /// <summary>The formats each brief is written in (the PDF always); null: the default, the PDF.</summary>
    public Brief.Formats.OutputFormat? Formats { get; init; }

    public const string FileName = "briefwright.settings.yaml";
    public const int MaxJobs = 256;

    /// <summary>
    /// Every field, in the order the docs list them. The loader accepts these keys only and the schema is made from
    /// this list.
    /// </summary>
    public static readonly IReadOnlyList<SettingField> Fields =
    [
        new("template", SettingKind.Path, "Template file (Scriban producing CommonMark). Default: the standard brief."),
        new("theme", SettingKind.Path,
            "Theme file (*.theme.yaml): organisation name, paper size, colours, footer, logo, fonts."),
        new("out", SettingKind.Path,
            "Folder the briefs are written to. Default: an 'out' folder beside each scenario."),
        new("date", SettingKind.DateRule,
            "Date rule: 'scenario' (each brief keeps its brief.date; the default) or one date written YYYY-MM-DD for " +
            "every brief."),
        new("jobs", SettingKind.Jobs, "Briefs built at once (1 to 256). Default: one per core."),
        new("chart_copies", SettingKind.Flag, "Write each chart as SVG and PNG beside the brief (default true)."),
        new("csv_byte_order_mark", SettingKind.Flag,
            "Start each CSV file with a UTF-8 byte order mark, for spreadsheet programs (default false)."),
        new("formats", SettingKind.Formats,
            "Files written for each brief: a list of pdf (always written), html (self-contained web page), xlsx " +
            "(spreadsheet workbook of the results tables), docx (editable document). Default: [pdf]."),
    ];

    /// <summary>The folder the settings file is in; its paths are relative to it.</summary>
    public string Folder => System.IO.Path.GetDirectoryName(System.IO.Path.GetFullPath(File))!;

    /// <summary>
    /// The nearest settings file in <paramref name="start"/>'s folder (or the folder itself) or one above it.
    /// </summary>
    public static string? Find(string start)
    {
        string full = System.IO.Path.GetFullPath(start == ScenarioInputsStdin ? "." : start);
        var dir = Directory.Exists(full) ? new DirectoryInfo(full) : new FileInfo(full).Directory;
        for (; dir is not null; dir = dir.Parent)
        {
            string candidate = System.IO.Path.Combine(dir.FullName, FileName);
            if (System.IO.File.Exists(candidate)) return candidate;
        }
        return null;
    }

    private const string ScenarioInputsStdin = Commands.ScenarioInputs.StdinName;

    public sealed record Loaded(ProjectSettings? Settings, IReadOnlyList<Diagnostic> Problems, SourceSet Sources);

    public static Loaded Load(string path, ISourceReader reader)
    {
        var sources = new SourceSet();
        if (!reader.TryRead(path, out string text, out string error))
            return new Loaded(null, [new Diagnostic(new SourceSpan(path, 1, 1), "",
                $"cannot read the project settings ({error})", null)], sources);
        sources.Add(path, text);
        var (root, problems) = YamlTreeReader.Read(path, text);
        if (problems.Count > 0) return new Loaded(null, problems, sources);
        var ctx = new BindContext();
        if (root is YScalar { IsNull: true } || root is null)
            return new Loaded(new ProjectSettings(path, null, null, null, null, null, null, null), [], sources);
        if (root is not YMapping top)
        {
            ctx.Report(root.At, "", "project settings must be a mapping of keys to values", root.Kind);
            return new Loaded(null, ctx.Problems, sources);
        }
        ctx.CheckKeys(top, "", Fields.Select(f => f.Key).ToArray());
        string folder = System.IO.Path.GetDirectoryName(path) ?? "";
        string? PathOf(string key) =>
            ctx.Text(top, key, "", required: false) is { } p ? System.IO.Path.Combine(folder, p) : null;
        string? template = PathOf("template"), theme = PathOf("theme"), outDir = PathOf("out");
        DateOnly? date = null;
        if (ctx.Text(top, "date", "", required: false) is { } rule && rule != "scenario")
        {
            if (DateOnly.TryParseExact(rule, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None,
                out var d)) date = d;
            else ctx.Report(top["date"]!.At, "date",
                "must be 'scenario' or a date written YYYY-MM-DD", BindContext.Show(top["date"]!));
        }
        int? jobs = null;
        if (top["jobs"] is { } jobsNode
            && ctx.Number(top, "jobs", "", ValueUnit.Number, Bounds.Closed(1, MaxJobs)) is { } j)
        {
            if (j != Math.Floor(j))
                ctx.Report(jobsNode.At, "jobs", "must be a whole number", BindContext.Show(jobsNode));
            else jobs = (int)j;
        }
        bool? chartCopies = ctx.Flag(top, "chart_copies", "");
        bool? bom = ctx.Flag(top, "csv_byte_order_mark", "");
        Brief.Formats.OutputFormat? formats = top["formats"] is { } formatsNode ? ReadFormats(ctx, formatsNode) : null;
        if (ctx.Problems.Count > 0) return new Loaded(null, ctx.Problems, sources);
        return new Loaded(
            new ProjectSettings(path, template, theme, outDir, date, jobs, chartCopies, bom) { Formats = formats },
            [], sources);
    }

    /// <summary>The <c>formats</c> list; null (with a problem reported) when it is not a list of known names.</summary>
    private static Brief.Formats.OutputFormat? ReadFormats(BindContext ctx, YNode formatsNode)
    {
        var names = formatsNode is YSequence seq
            ? seq.Items.Select(i => i is YScalar sc && !sc.IsNull ? sc.Value : null).ToList()
            : null;
        if (names is null || names.Count == 0 || names.Any(n => n is null))
            ctx.Report(formatsNode.At, "formats",
                "must be a list of format names " +
                $"({Brief.Formats.OutputFormats.Describe(Brief.Formats.OutputFormats.All)})",
                BindContext.Show(formatsNode));
        else if (names.Distinct(StringComparer.OrdinalIgnoreCase).Count() != names.Count)
            ctx.Report(formatsNode.At, "formats", "must name each format once", BindContext.Show(formatsNode));
        else if (Brief.Formats.OutputFormats.Parse(names!, out string? unknown) is { } parsed) return parsed;
        else
        {
            var item = ((YSequence)formatsNode).Items.First(i => ((YScalar)i).Value.Trim() == unknown);
            ctx.Report(item.At, "formats",
                "must be a list of format names " +
                $"({Brief.Formats.OutputFormats.Describe(Brief.Formats.OutputFormats.All)})",
                BindContext.Quote(unknown ?? ""));
        }
        return null;
    }

    /// <summary>JSON Schema (draft 2020-12) of the settings file, made from <see cref="Fields"/>.</summary>
    public static JsonObject Schema()
    {
        var properties = new JsonObject();
        foreach (var f in Fields)
        {
            properties[f.Key] = f.Kind switch
            {
                SettingKind.Path => new JsonObject
                {
                    ["type"] = "string", ["minLength"] = 1, ["description"] = f.Description,
                },
                SettingKind.DateRule => new JsonObject
                {
                    ["type"] = "string", ["description"] = f.Description,
                    ["anyOf"] = new JsonArray(
                        new JsonObject { ["const"] = "scenario" },
                        new JsonObject { ["pattern"] = "^[0-9]{4}-[0-9]{2}-[0-9]{2}$", ["format"] = "date" }),
                },
                SettingKind.Jobs => new JsonObject
                {
                    ["type"] = "integer", ["minimum"] = 1, ["maximum"] = MaxJobs, ["description"] = f.Description,
                },
                SettingKind.Formats => new JsonObject
                {
                    ["type"] = "array", ["minItems"] = 1, ["uniqueItems"] = true, ["description"] = f.Description,
                    ["items"] = new JsonObject { ["enum"] = new JsonArray(
                        Brief.Formats.OutputFormats.Names.Select(n => (JsonNode)n.Name).ToArray()) },
                },
                _ => new JsonObject { ["type"] = "boolean", ["description"] = f.Description },
            };
        }
        return new JsonObject
        {
            ["$schema"] = "https://json-schema.org/draft/2020-12/schema",
            ["title"] = "briefwright project settings (" + FileName + ")",
            ["type"] = "object",
            ["additionalProperties"] = false,
            ["properties"] = properties,
        };
    }
}
