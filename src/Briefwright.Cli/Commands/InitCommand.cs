using System.CommandLine;
using Briefwright.Brief;
using Briefwright.Cli.Project;

namespace Briefwright.Cli.Commands;

/// <summary>
/// <c>init [FOLDER]</c>: lays out a new project: an invented example scenario, a theme, a copy of the standard
/// template, the project settings file, and an example scheduled job (a cron line and a CI pipeline file) to copy.
/// Never overwrites a file: if any would be replaced, nothing is written.
/// </summary>
public static class InitCommand
{
    public const string ExampleScenario = "auroria-example.yaml";
    public const string Theme = "house.theme.yaml";
    public const string Template = "templates/brief.md";

    public static IReadOnlyList<(string Path, string Text)> Files() =>
    [
        (ExampleScenario, ExampleScenarioText()),
        (Theme, ThemeText),
        (Template, StandardTemplate.Text),
        (ProjectSettings.FileName, SettingsText),
        ("scheduled/crontab.example", CrontabText),
        ("scheduled/rebuild-briefs.yml", PipelineText),
    ];

    private const string ThemeText = """
                # INVENTED example theme made by `briefwright init`: replace the name, colours and footer with your
                # organisation's. Fields: docs/themes.md; schema: `briefwright schema theme`.
                name: Example house style (invented)
                paper: a4
                colours:
                  accent: "#2F5D50"
                  text: "#1B1F24"
                  muted: "#5A6270"
                  rule: "#B9C4CE"
                  box_fill: "#EEF4F1"
                  header_fill: "#DCE9E3"
                footer: "Example Institute (invented) · Model illustration, not a forecast"

                """;

    private const string SettingsText = $"""
                # briefwright project settings: the defaults `briefwright build` uses for the scenarios in this folder
                # (and folders below it). Options on the command line win. Paths are relative to this file.
                # Fields: README ("Rebuilds, editions and the data annex"); schema: `briefwright schema settings`.
                template: {Template}
                theme: {Theme}
                out: out
                # 'scenario': each brief keeps its own brief.date; or one date for every brief, written YYYY-MM-DD.
                date: scenario
                jobs: 2
                chart_copies: true
                csv_byte_order_mark: false

                """;

    private const string CrontabText = """
                # Rebuild the briefs of this project at 06:00 UTC on the first day of every month (install with
                # `crontab -e`; replace /srv/briefs with this folder and /opt/briefwright with where the tool is).
                # Unchanged briefs are skipped; every attempt is logged in out/build-log.jsonl.
                CRON_TZ=UTC

                """ +
        "0 6 1 * * cd /srv/briefs && /opt/briefwright/briefwright build . --quiet || " +
        "echo \"briefwright: exit $?, see out/build-log.jsonl\" >&2\n";

    private const string PipelineText = """
                # Example CI pipeline (the common YAML workflow format of hosted CI services): rebuilds the briefs on a
                # schedule and when a scenario changes, and keeps the output folder as the run's artifact.
                name: rebuild-briefs
                on:
                  schedule:
                    - cron: "0 6 1 * *"
                  push:
                    paths: ["**.yaml", "templates/**"]
                jobs:
                  build:
                    runs-on: ubuntu-latest
                    steps:
                      - uses: actions/checkout@v4
                      - uses: actions/setup-dotnet@v4
                        with:
                          dotnet-version: "10.0.x"
                      - name: Check every scenario, the theme and the settings
                        run: briefwright check .
                      - name: Build the briefs (skips unchanged ones)
                        run: briefwright build . --quiet
                      - uses: actions/upload-artifact@v4
                        if: always()
                        with:
                          name: briefs
                          path: out/

                """;

    private static string ExampleScenarioText()
    {
        using var stream = typeof(InitCommand).Assembly.GetManifestResourceStream("init.example-scenario.yaml")
            ?? throw new InvalidOperationException("The example scenario is missing from the build.");
        string text = new StreamReader(stream).ReadToEnd();
        return "# Made by `briefwright init` as a starting point: copy it for each brief, change brief.id, and " +
               "replace every\n# invented number and source with your own.\n" +
               text.Replace("id: auroria-national", "id: auroria-example");
    }

    public static Command Create(TextWriter output, TextWriter error)
    {
        var folder = new Argument<string>("folder")
        {
            Description = "Where to lay out the project (created if missing; default: the current folder). Existing " +
                "files are never overwritten.",
            Arity = ArgumentArity.ZeroOrOne,
            DefaultValueFactory = _ => ".",
        };
        var command = new Command("init",
            "Start a project: an invented example scenario, a theme, a copy of the standard template, the project " +
            "settings file (" + ProjectSettings.FileName + ") and an example scheduled job (a cron line and a CI " +
            "pipeline file). Then: briefwright check FOLDER; briefwright build FOLDER.") { folder };
        command.SetAction(parse =>
        {
            string dir = parse.GetValue(folder)!;
            var files = Files();
            var existing = files.Select(f => Path.Combine(dir, f.Path))
                .Where(p => File.Exists(p) || Directory.Exists(p))
                .ToList();
            if (existing.Count > 0)
            {
                foreach (var e in existing) error.WriteLine($"{e}: already exists; init never overwrites a file.");
                error.WriteLine(
                    $"briefwright init: nothing written. Choose an empty folder, or move these files away.");
                return ExitCodes.InvalidInput;
            }
            try
            {
                foreach (var (path, text) in files)
                {
                    string full = Path.Combine(dir, path);
                    Directory.CreateDirectory(Path.GetDirectoryName(Path.GetFullPath(full))!);
                    // A new file only (FileMode.CreateNew): init never replaces anything, even one made meanwhile.
                    using (var stream = new FileStream(full, FileMode.CreateNew, FileAccess.Write))
                        stream.Write(System.Text.Encoding.UTF8.GetBytes(text));
                    output.WriteLine($"wrote {full}");
                }
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                error.WriteLine($"{dir}: cannot write the project ({ex.Message}).");
                return ExitCodes.Failed;
            }
            output.WriteLine($"Next: briefwright check {dir}   then   briefwright build {dir}   (briefs go to " +
                $"{Path.Combine(dir, "out")}).");
            return ExitCodes.Ok;
        });
        return command;
    }
}
