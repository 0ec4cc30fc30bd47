using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using Briefwright.Cli.Commands;
using Briefwright.Scenario;
using Briefwright.Scenario.Binding;
using Briefwright.Scenario.Yaml;
using Json.Schema;

namespace Briefwright.Cli.Tests;

/// <summary>
/// The published JSON Schemas against <c>check</c>: every demo and corpus file is validated by an independent JSON
/// Schema validator (JsonSchema.Net, draft 2020-12) and by <c>check</c>, and the verdicts are compared. The schema may
/// accept only what it cannot see (rules across fields and files, listed below with the reason); it never refuses what
/// <c>check</c> accepts.
/// </summary>
public class SchemaVerdictTests
{
    private static readonly string Corpus = Path.Combine(CliAppTests.RepoRoot(), "tests", "corpus");

    private static readonly Lazy<JsonSchema> Scenario = new(() => JsonSchema.FromText(
        SchemaCommand.Text("scenario"),
        baseUri: new Uri("https://schemas.invalid/briefwright/scenario.json")));
    private static readonly Lazy<JsonSchema> Theme = new(() => JsonSchema.FromText(
        SchemaCommand.Text("theme"),
        baseUri: new Uri("https://schemas.invalid/briefwright/theme.json")));
    private static readonly Lazy<JsonSchema> Settings = new(() => JsonSchema.FromText(
        SchemaCommand.Text("settings"),
        baseUri: new Uri("https://schemas.invalid/briefwright/settings.json")));

    /// <summary>
    /// Corpus files that <c>check</c> refuses for a reason a schema of one file cannot express, by the rule in their
    /// expected message. Anything else <c>check</c> refuses, the schema must refuse too.
    /// </summary>
    private static readonly string[] BeyondTheSchema =
    [
        "extends",                                  // the extended file, cycles and depth
        "cannot read",                              // files named inside: life tables, parents
        "baseline",                                 // exactly one baseline option
        "must be unique",                           // option ids unique
        "increasing", "must start at", "the first step", // order of brackets and schedule steps
        "above", "must differ", "must satisfy",     // relations between two fields
        "must name an option",                      // reform.headline_option names an option
        "population growth + technology growth",    // n + g + δ > 0
        "survival curve's maximum age",             // retirement within the survival curve
        "below the retirement age",                 // school entry and schooling before retirement
        "aliases", "nesting", "KiB",                // reading the text itself
        "project folder", "must name a scenario file", "must name a life table file", // where named files may be
        "TrueType", "PNG", "bits per channel", "pixels", // the contents of a theme's font and logo files
        "breaks a model rule", "must leave workers", "give reform.year", // the model's rules across fields and files
        "required field is missing",                // a distribution whose form an extends child switches
        "it names the output files",                // a trailing newline, which '$' in a schema pattern lets through
        "must be at least 0% and less than 100%", "must be at least 0 and at most", // a range's or a
        "must be greater than 0 and less than 0.9",  // distribution's end, held to its parameter's own bounds
        "break a model rule too often",             // the pilot draw
        "simulated years",                          // the uncertainty work limit, across three fields
    ];

    /// <summary>Files whose difference lies in the YAML text itself, of which JSON keeps no trace: quoting (a quoted
    /// number, which <c>check</c> refuses, reaches a validator as the same string an unquoted percentage would) and the
    /// number of digits written (check refuses numbers over 32 characters; JSON sees only the value).</summary>
    private static readonly string[] LostInJson = ["quoted-number.yaml", "overlong-number.yaml"];

    /// <summary>A YAML tree as JSON, typed by the YAML 1.2 core schema (as editors' YAML support reads it): plain
    /// true/false are booleans, plain numbers are numbers, plain null/~/empty is null, everything else a
    /// string.</summary>
    public static JsonNode? ToJson(YNode node) => node switch
    {
        YMapping m => new JsonObject(m.Entries.GroupBy(e => e.Key.Value)
            .Select(g => new KeyValuePair<string, JsonNode?>(g.Key, ToJson(g.Last().Value)))),
        YSequence s => new JsonArray(s.Items.Select(ToJson).ToArray()),
        YScalar { Quoted: true } q => JsonValue.Create(q.Value),
        YScalar { IsNull: true } => null,
        YScalar { Value: "true" or "True" or "TRUE" } => JsonValue.Create(true),
        YScalar { Value: "false" or "False" or "FALSE" } => JsonValue.Create(false),
        YScalar p when Regex.IsMatch(p.Value, "^[-+]?[0-9]+$") && long.TryParse(p.Value, out long l)
            => JsonValue.Create(l),
        YScalar p when Regex.IsMatch(p.Value, "^[-+]?(\\.[0-9]+|[0-9]+(\\.[0-9]*)?)([eE][-+]?[0-9]+)?$")
            => JsonValue.Create(double.Parse(p.Value, System.Globalization.CultureInfo.InvariantCulture)),
        YScalar p => JsonValue.Create(p.Value),
        _ => throw new InvalidOperationException(node.Kind),
    };

    private static bool SchemaAccepts(JsonSchema schema, JsonNode? json)
    {
        using var doc = JsonDocument.Parse(json?.ToJsonString() ?? "null");
        // Format assertion on, as validators offer it: "format": "date" then refuses 2026-02-30 as check does.
        return schema.Evaluate(doc.RootElement, new EvaluationOptions { RequireFormatValidation = true }).IsValid;
    }

    private static bool? SchemaVerdict(string file)
    {
        var (root, problems) = YamlTreeReader.Read(file, File.ReadAllText(file));
        if (root is null || problems.Count > 0) return null; // not YAML a validator could read
        var schema = file.EndsWith(".theme.yaml")
            ? Theme.Value
            : Path.GetFileName(file) == Project.ProjectSettings.FileName ? Settings.Value : Scenario.Value;
        return SchemaAccepts(schema, ToJson(root));
    }

    private static (bool Ok, string Error) CheckVerdict(string file)
    {
        var error = new StringWriter();
        int code = CliApp.Run(new[] { "check", file }, new StringWriter(), error);
        return (code == 0, error.ToString());
    }

    [Fact]
    public void Every_demo_and_corpus_file_gets_the_same_verdict_from_the_schema_as_from_check_where_a_schema_can_tell()
    {
        var files = Directory.GetFiles(CliAppTests.Demo(), "*.yaml").Concat(Directory.GetFiles(Corpus, "*.yaml"))
            .Order(StringComparer.Ordinal)
            .ToList();
        Assert.True(files.Count > 140, $"{files.Count} files");
        var disagreements = new List<string>();
        int compared = 0, checkRefusals = 0, schemaRefusals = 0;
        foreach (var file in files)
        {
            var schema = SchemaVerdict(file);
            var (ok, error) = CheckVerdict(file);
            if (!ok) checkRefusals++;
            if (schema is null)
            {
                if (ok) disagreements.Add($"{Path.GetFileName(file)}: check accepts a file the YAML reader refuses");
                continue;
            }
            compared++;
            if (schema == false) schemaRefusals++;
            string first = error.Split('\n')[0];
            string rule = Regex.Match(first, @"^.*?:\d+:\d+: (?:[^\s:]+: )?(.*)$") is { Success: true } m
                ? m.Groups[1].Value
                : first;
            if (schema == false && ok) disagreements.Add($"{Path.GetFileName(file)}: schema refuses, check accepts");
            else if (schema == true && !ok && !first.StartsWith(file + ":") && Path.GetFileName(file) is var name
                && !LostInJson.Contains(name))
                continue; // the problem is in another file it names (a life table): beyond a schema of this one
            else if (schema == true && !ok
                && !BeyondTheSchema.Any(r => rule.Contains(r, StringComparison.OrdinalIgnoreCase))
                && !LostInJson.Contains(Path.GetFileName(file)))
                disagreements.Add($"{Path.GetFileName(file)}: schema accepts, check refuses: {first}");
        }
        Assert.True(disagreements.Count == 0, string.Join("\n", disagreements));
        Assert.True(compared > 120, $"{compared} compared");
        Assert.True(
            schemaRefusals > 80,
            $"the schema refused only {schemaRefusals} of {checkRefusals} files check refuses");
    }

    [Fact]
    public void The_cases_the_issue_names_get_the_right_verdict()
    {
        string national = File.ReadAllText(CliAppTests.Demo("auroria-national.yaml"));
        JsonNode? Json(string yaml) => ToJson(YamlTreeReader.Read("x.yaml", yaml).Root!);
        // An extends child (the demo's Silverdale) is valid on its own.
        Assert.True(
            SchemaAccepts(Scenario.Value, Json(File.ReadAllText(CliAppTests.Demo("auroria-silverdale.yaml")))),
            "extends child");
        // An unquoted date, read as a string by a YAML 1.2 reader, is valid.
        Assert.True(SchemaAccepts(Scenario.Value, Json(national)), "demo with unquoted date");
        // The README's own error example: a saving rate of 122% is refused, as check refuses it.
        Assert.False(SchemaAccepts(Scenario.Value, Json(national.Replace("value: 22%", "value: 122%"))), "122%");
        // A typo in a key is refused.
        Assert.False(SchemaAccepts(
            Scenario.Value,
            Json(national.Replace("form: gompertz_makeham", "form: gompertz_makeham\n    maxage: 110"))), "maxage");
        // A date that is not YYYY-MM-DD is refused.
        Assert.False(
            SchemaAccepts(Scenario.Value, Json(national.Replace("date: 2026-11-30", "date: 30/11/2026"))),
            "date");
    }

    [Theory]
    [InlineData("22%", true)]
    [InlineData("99.99%", true)]
    [InlineData("100%", false)]
    [InlineData("0%", false)]
    [InlineData("0.0%", false)]
    [InlineData("0.01%", true)]
    [InlineData("122%", false)]
    [InlineData("-1%", false)]
    [InlineData("22 %", true)]
    public void Percent_strings_obey_an_open_interval(string text, bool valid) =>
        Assert.Equal(valid, Regex.IsMatch(text, ScenarioSchema.PercentPattern(Bounds.Open(0, 1))));

    [Theory]
    [InlineData("-10%", true)]
    [InlineData("-10.0%", true)]
    [InlineData("-10.5%", false)]
    [InlineData("-0.4%", true)]
    [InlineData("0%", true)]
    [InlineData("10%", true)]
    [InlineData("10.01%", false)]
    [InlineData("9.99%", true)]
    [InlineData("11%", false)]
    public void Percent_strings_obey_a_closed_interval_around_zero(string text, bool valid) =>
        Assert.Equal(valid, Regex.IsMatch(text, ScenarioSchema.PercentPattern(Bounds.Closed(-0.1, 0.1))));

    [Theory]
    [InlineData("theme")]
    [InlineData("settings")]
    [InlineData("scenario")]
    public void Each_published_schema_matches_the_schema_command(string kind)
    {
        var output = new StringWriter();
        Assert.Equal(0, CliApp.Run(new[] { "schema", kind }, output, new StringWriter()));
        Assert.Equal(
            File.ReadAllText(Path.Combine(CliAppTests.RepoRoot(), "docs", $"{kind}.schema.json")),
            output.ToString());
    }

    [Fact]
    public void The_settings_schema_follows_the_settings_fields()
    {
        using var doc = JsonDocument.Parse(SchemaCommand.Text("settings"));
        Assert.Equal(
            Project.ProjectSettings.Fields.Select(f => f.Key),
            doc.RootElement.GetProperty("properties").EnumerateObject().Select(p => p.Name));
        Assert.True(SchemaAccepts(
            Settings.Value,
            JsonNode.Parse("""{"out":"briefs","date":"2027-01-01","jobs":2,"chart_copies":false}""")));
        Assert.False(SchemaAccepts(Settings.Value, JsonNode.Parse("""{"jobs":0}""")));
        Assert.False(SchemaAccepts(Settings.Value, JsonNode.Parse("""{"them":"x.theme.yaml"}""")));
    }

    [Fact]
    public void Check_checks_a_theme_with_positioned_errors()
    {
        var (ok, error) = CheckVerdict(Path.Combine(Corpus, "theme-bad-paper.theme.yaml"));
        Assert.False(ok);
        Assert.Matches(@"theme-bad-paper\.theme\.yaml:\d+:\d+: paper: must be one of a4, letter", error);
        Assert.True(CheckVerdict(CliAppTests.Demo("auroria-institute.theme.yaml")).Ok);
    }
}
