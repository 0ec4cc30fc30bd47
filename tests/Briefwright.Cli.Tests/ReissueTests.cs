using System.Text;
using System.Text.Json;
using Briefwright.Brief.Annex;
using Briefwright.Cli.Batch;
using Briefwright.Cli.Commands;
using Briefwright.Cli.Project;

namespace Briefwright.Cli.Tests;

/// <summary>Re-issuing on a schedule: batch ids, command-line conventions, project settings and init, the build log,
/// shards, solve's JSON shape and the CSV annex.</summary>
public class ReissueTests
{
    internal static (int Code, string Out, string Err) Run(
        string[] args,
        string? stdin = null,
        TimeProvider? clock = null)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CliApp.Run(args, output, error, input: stdin is null ? null : new StringReader(stdin), clock: clock);
        return (code, output.ToString(), error.ToString());
    }

    private static string[] A(params string[] args) => args;

    private static IReadOnlyList<JsonElement> LogLines(string dir) =>
        File.ReadAllLines(Path.Combine(dir, BuildLog.FileName)).Select(l => JsonDocument.Parse(l).RootElement.Clone())
            .ToList();

    /// <summary>A clock stopped at one instant, so the log's time can be asserted.</summary>
    private sealed class FixedClock(DateTimeOffset now) : TimeProvider
    {
        public override DateTimeOffset GetUtcNow() => now;
    }

    public class DuplicateIds
    {
        [Fact]
        public void A_variant_keeping_its_parents_id_is_refused_per_file_by_check_and_build_and_nothing_is_written()
        {
            // Given a variant written with extends that keeps its parent's brief.id
            var w = new Workspace("auroria-silverdale");
            string variant = Path.Combine(w.Dir, "silverdale-high-saving.yaml");
            File.WriteAllText(variant, "extends: auroria-silverdale.yaml\nproduction:\n  saving_rate: 25%\n");
            string parent = Path.Combine(w.Dir, "auroria-silverdale.yaml");

            // When the folder is checked, then both files get a positioned error and the exit code is 2
            var (code, output, error) = Run(A("check", w.Dir));
            Assert.Equal(2, code);
            Assert.Contains($"{variant}:1:10: brief.id: must be unique within the batch; this scenario keeps the id " +
                $"of the scenario it extends, which '{parent}' also uses: give it its own brief.id. Got " +
                "'auroria-silverdale'.", error);
            Assert.Contains($"{parent}:5:7: brief.id: must be unique within the batch; '{variant}' also uses it, and " +
                "their briefs would overwrite each other. Got 'auroria-silverdale'.", error);
            Assert.Contains("^", error);
            Assert.Contains("auroria-national.yaml: ok", output);

            // When it is built, then the others are built, the two are not, exit 2, and the log has their messages
            var (buildCode, _, buildError) = w.Build();
            Assert.Equal(2, buildCode);
            Assert.Contains($"{variant}:1:10: brief.id: must be unique", buildError);
            Assert.True(File.Exists(Path.Combine(w.Out, "auroria-national-2026-11-30.pdf")));
            Assert.DoesNotContain(Directory.GetFiles(w.Out), f => Path.GetFileName(f).StartsWith("auroria-silverdale"));
            var invalid = LogLines(w.Out).Where(l => l.GetProperty("status").GetString() == "invalid").ToList();
            Assert.Equal(2, invalid.Count);
            Assert.All(invalid, l => Assert.Contains(
                "brief.id: must be unique within the batch",
                l.GetProperty("messages")[0].GetString()));
        }

        [Fact]
        public void Scenarios_with_their_own_ids_pass()
        {
            var (code, _, error) = Run(A("check", CliAppTests.Demo()));
            Assert.True(code == 0, error);
        }
    }

    public class CommandLine
    {
        [Theory]
        [InlineData("build", "--qiet", "'--qiet' is not an option of build (did you mean '--quiet'?).")]
        [InlineData("check", "--jsn", "'--jsn' is not an option of check.")]
        [InlineData("solve", "--jsn", "'--jsn' is not an option of solve (did you mean '--json'?).")]
        public void An_unknown_option_is_a_usage_error_exit_2_with_a_suggestion_never_a_path(
            string command,
            string option,
            string message)
        {
            string outDir = Directory.CreateTempSubdirectory("bw-usage-").FullName;
            var (code, output, error) = Run(
                A(command, CliAppTests.Demo("auroria-silverdale.yaml"), option, "-o", outDir));
            if (command != "build") (code, output, error) = Run(
                A(command, CliAppTests.Demo("auroria-silverdale.yaml"), option));
            Assert.Equal(2, code);
            Assert.Equal("", output);
            Assert.Contains($"briefwright {command}: {message}", error);
            Assert.Contains($"Run 'briefwright {command} --help' for its options.", error);
            Assert.DoesNotContain("cannot read the scenario", error);
            if (command == "build")
            {
                // Nothing built; the usage error is in the log.
                Assert.Equal(new[] { BuildLog.FileName }, Directory.GetFiles(outDir).Select(Path.GetFileName));
                var line = Assert.Single(LogLines(outDir));
                Assert.Equal("usage", line.GetProperty("stage").GetString());
            }
        }

        [Fact]
        public void No_command_and_an_unknown_command_exit_2_with_a_suggestion()
        {
            var none = Run(A());
            Assert.Equal(2, none.Code);
            Assert.Contains(
                "briefwright: no command given. Commands: check, solve, build, diff, schema, init.",
                none.Err);
            var typo = Run(A("bulid", "regions"));
            Assert.Equal(2, typo.Code);
            Assert.Contains("briefwright: unknown command 'bulid' (did you mean 'build'?).", typo.Err);
        }

        [Theory]
        [InlineData("0")]
        [InlineData("-3")]
        [InlineData("abc")]
        [InlineData("1.5")]
        public void Jobs_must_be_a_whole_number_of_at_least_one(string jobs)
        {
            var w = new Workspace("auroria-silverdale");
            var (code, _, error) = w.Build("--jobs", jobs);
            Assert.Equal(2, code);
            Assert.Contains($"--jobs: must be a whole number from 1 to {BuildCommand.MaxJobs}. Got '{jobs}'.", error);
            Assert.DoesNotContain("System.", error);
            Assert.DoesNotContain(Directory.GetFiles(w.Out), f => !f.EndsWith(BuildLog.FileName));
        }

        [Fact]
        public void A_dash_reads_a_scenario_from_standard_input_for_check_solve_and_diff()
        {
            string national = File.ReadAllText(CliAppTests.Demo("auroria-national.yaml"));
            var check = Run(A("check", "-"), national);
            Assert.Equal(0, check.Code);
            Assert.Equal("<stdin>: ok (auroria-national, 4 options)\n", check.Out);

            var solve = Run(A("solve", "--json", "-"), national);
            Assert.Equal(0, solve.Code);
            using var doc = JsonDocument.Parse(solve.Out);
            Assert.Equal("auroria-national", doc.RootElement[0].GetProperty("scenario_id").GetString());

            var diff = Run(A("diff", CliAppTests.Demo("auroria-national.yaml"), "-"), national);
            Assert.Equal(0, diff.Code);

            var bad = Run(A("check", "-"), national.Replace("value: 22%", "value: 122%"));
            Assert.Equal(2, bad.Code);
            Assert.Contains(
                "<stdin>:52:12: production.saving_rate.value: must be at least 0.1% and less than 100%. Got '122%'.",
                bad.Err);
        }

        [Fact]
        public void Skip_flush_builds_the_same_bytes()
        {
            var w = new Workspace("auroria-silverdale");
            Assert.Equal(0, w.Build("-o", Path.Combine(w.Dir, "a")).Code);
            Assert.Equal(0, w.Build("-o", Path.Combine(w.Dir, "b"), "--skip-flush").Code);
            string pdf = "auroria-silverdale-2026-11-30.pdf";
            Assert.Equal(
                File.ReadAllBytes(Path.Combine(w.Dir, "a", pdf)),
                File.ReadAllBytes(Path.Combine(w.Dir, "b", pdf)));
            Assert.Equal(2, w.Build("--no-sync").Code); // the old spelling is gone
        }
    }

    public class Settings
    {
        [Fact]
        public void Init_lays_out_a_project_that_checks_and_builds_with_its_settings_and_never_overwrites()
        {
            // Given a new project made by init
            string dir = Path.Combine(Directory.CreateTempSubdirectory("bw-init-").FullName, "briefs");
            var (code, output, error) = Run(A("init", dir));
            Assert.True(code == 0, error);
            foreach (var f in new[] {
                InitCommand.ExampleScenario,
                InitCommand.Theme,
                InitCommand.Template,
                ProjectSettings.FileName,
                "scheduled/crontab.example",
                "scheduled/rebuild-briefs.yml" })
                Assert.True(File.Exists(Path.Combine(dir, f)), f);
            Assert.Contains("INVENTED", File.ReadAllText(Path.Combine(dir, InitCommand.ExampleScenario)));
            Assert.Contains("briefwright build", File.ReadAllText(Path.Combine(dir, "scheduled/crontab.example")));

            // Then check accepts everything in it: the scenario, the theme and the settings
            var check = Run(A("check", dir));
            Assert.True(check.Code == 0, check.Err);
            Assert.Contains($"{Path.Combine(dir, ProjectSettings.FileName)}: ok (project settings)", check.Out);
            Assert.Contains("ok (theme 'Example house style (invented)'", check.Out);

            // And a plain build uses the settings: its theme, template and output folder
            File.WriteAllText(Path.Combine(dir, InitCommand.ExampleScenario), File.ReadAllText(
                Path.Combine(dir, InitCommand.ExampleScenario))
                .Replace("draws: 2000", "draws: 60").Replace("sobol_samples: 256", "sobol_samples: 0").Replace(
                    "steps: 9",
                    "steps: 3"));
            var build = Run(A("build", dir, "-q", "--no-chart-images"));
            Assert.True(build.Code == 0, build.Err);
            using var manifest = JsonDocument.Parse(
                File.ReadAllText(Path.Combine(dir, "out", "auroria-example.manifest.json")));
            Assert.NotEqual("standard", manifest.RootElement.GetProperty("inputs").GetProperty("theme").GetString());
            Assert.True(File.Exists(Path.Combine(dir, "out", "auroria-example-2026-11-30.pdf")));

            // And a second init writes nothing
            var again = Run(A("init", dir));
            Assert.Equal(2, again.Code);
            Assert.Contains("already exists; init never overwrites a file.", again.Err);
        }

        [Fact]
        public void Settings_are_found_above_the_scenarios_folder_and_options_on_the_command_line_win()
        {
            // Given settings one folder above the scenarios, naming an output folder and a date
            var w = new Workspace("auroria-silverdale");
            string project = Directory.CreateTempSubdirectory("bw-project-").FullName;
            string regions = Path.Combine(project, "regions");
            Directory.Move(w.Dir, regions);
            File.WriteAllText(
                Path.Combine(project, ProjectSettings.FileName),
                "out: briefs\ndate: 2027-03-01\nchart_copies: false\njobs: 1\n");

            // When built from inside the folder, then the settings apply
            var (code, _, error) = Run(A("build", regions, "-q"));
            Assert.True(code == 0, error);
            Assert.True(File.Exists(Path.Combine(project, "briefs", "auroria-silverdale-2027-03-01.pdf")));
            Assert.DoesNotContain(Directory.GetFiles(Path.Combine(project, "briefs")), f => f.EndsWith(".svg"));

            // When options are given, then they win
            string other = Path.Combine(project, "other");
            var (code2, _, error2) = Run(
                A("build", Path.Combine(regions, "auroria-silverdale.yaml"), "-q", "-o", other,
                    "--date", "2027-04-01"));
            Assert.True(code2 == 0, error2);
            Assert.True(File.Exists(Path.Combine(other, "auroria-silverdale-2027-04-01.pdf")));
        }

        [Fact]
        public void A_bad_settings_file_is_a_positioned_error_exit_2_and_logged()
        {
            var w = new Workspace("auroria-silverdale");
            string settings = Path.Combine(w.Dir, ProjectSettings.FileName);
            File.WriteAllText(settings, "jobs: 0\nthem: house.theme.yaml\n");
            var (code, _, error) = w.Build();
            Assert.Equal(2, code);
            Assert.Contains($"{settings}:2:1: them: unknown key (did you mean 'theme'?). Got 'them'.", error);
            Assert.Contains($"{settings}:1:7: jobs: must be at least 1 and at most 256. Got '0'.", error);
            var line = Assert.Single(LogLines(w.Out));
            Assert.Equal("settings", line.GetProperty("stage").GetString());
            Assert.Equal(2, line.GetProperty("messages").GetArrayLength());
            Assert.Equal(2, Run(A("check", settings)).Code);
        }
    }

    public class Log
    {
        [Fact]
        public void Each_attempt_is_one_line_with_utc_time_version_input_hash_shard_outcome_and_positioned_messages()
        {
            // Given a folder with one good and one bad scenario, and a clock stopped at a known instant
            var w = new Workspace("auroria-silverdale");
            w.Edit(
                "auroria-silverdale.yaml",
                "short_title: Silverdale schooling brief",
                "short_title: Silverdale schooling brief\nproduction:\n  saving_rate: 122%\n  depreciation: -1%");
            var clock = new FixedClock(new DateTimeOffset(2030, 1, 2, 3, 4, 5, TimeSpan.FromHours(2)));

            // When it is built as shard 1 of 1
            var (code, _, _) = Run(A("build", w.Dir, "-q", "--no-chart-images", "--shard", "1/1"), clock: clock);
            Assert.Equal(2, code);

            // Then each line carries the time in UTC, the tool version, the shard and the outcome
            var lines = LogLines(w.Out);
            Assert.Equal(2, lines.Count);
            Assert.All(lines, l =>
            {
                Assert.Equal("2030-01-02T01:04:05.000Z", l.GetProperty("time").GetString());
                Assert.Equal(Brief.ToolInfo.Version, l.GetProperty("tool_version").GetString());
                Assert.Equal("1/1", l.GetProperty("shard").GetString());
                Assert.Equal("brief", l.GetProperty("kind").GetString());
            });
            var built = lines.Single(l => l.GetProperty("status").GetString() == "built");
            using var manifest = JsonDocument.Parse(
                File.ReadAllText(Path.Combine(w.Out, "auroria-national.manifest.json")));
            Assert.Equal(
                manifest.RootElement.GetProperty("hash").GetString(),
                built.GetProperty("input_hash").GetString());
            var failed = lines.Single(l => l.GetProperty("status").GetString() == "invalid");
            var messages = failed.GetProperty("messages").EnumerateArray().Select(m => m.GetString()!).ToList();
            Assert.Equal(2, messages.Count);
            Assert.Contains(messages, m => m.StartsWith(Path.Combine(w.Dir, "auroria-silverdale.yaml") + ":")
                && m.Contains("production.saving_rate: must be at least 0.1% and less than 100%. Got '122%'."));
            Assert.Contains(
                messages,
                m => m.Contains("production.depreciation: must be at least 0% and less than 100%. Got '-1%'."));

            // And nothing else the build writes carries a clock time
            foreach (var f in Directory.GetFiles(w.Out).Where(f => !f.EndsWith(BuildLog.FileName)))
                Assert.DoesNotContain("2030-01-02", File.ReadAllText(f, Encoding.Latin1));
        }

        [Fact]
        public void A_theme_error_is_logged_as_a_run_line_with_its_positioned_message()
        {
            var w = new Workspace("auroria-silverdale");
            File.WriteAllText(Path.Combine(w.Dir, "bad.theme.yaml"), "name: Bad (invented)\npaper: a5\n");
            var (code, _, _) = w.Build("--theme", Path.Combine(w.Dir, "bad.theme.yaml"));
            Assert.Equal(2, code);
            var line = Assert.Single(LogLines(w.Out));
            Assert.Equal("run", line.GetProperty("kind").GetString());
            Assert.Equal("theme", line.GetProperty("stage").GetString());
            Assert.StartsWith(
                Path.Combine(w.Dir, "bad.theme.yaml") + ":2:8: paper: must be one of a4, letter",
                line.GetProperty("messages")[0].GetString());
        }
    }

    public class Sharding
    {
        [Fact]
        public void Any_spelling_of_the_same_folder_gives_the_same_assignment()
        {
            string dir = Directory.CreateTempSubdirectory("bw-shard-").FullName;
            string regions = Path.Combine(dir, "regions");
            var spellings = new[] {
                Path.Combine(regions, "north.yaml"),
                regions + "/./north.yaml",
                Path.Combine(dir, "x", "..", "regions", "north.yaml"),
                regions + "//north.yaml" };
            Assert.Single(spellings.Select(s => Shards.Key(s, null)).Distinct());
            Assert.Single(spellings.Select(s => Shards.Key(s, dir)).Distinct());
            Assert.Equal("regions/north.yaml", Shards.Key(spellings[1], dir));
            // A relative spelling, resolved against the current folder, lands on the same key too.
            string relative = Path.GetRelativePath(Directory.GetCurrentDirectory(), regions) + "/north.yaml";
            Assert.Equal("regions/north.yaml", Shards.Key(relative, dir));
        }

        [Fact]
        public async Task All_shards_of_a_folder_run_at_once_into_one_output_folder_build_every_brief_exactly_once()
        {
            // Given the four demo briefs, and both shard jobs of two started at the same time, each naming the folder
            // its own way (two shards, so that neither is empty)
            var w = new Workspace();
            string outDir = Path.Combine(w.Dir, "shared-out");
            var spellings = new[] { w.Dir + "/", w.Dir + "/./" };
            var runs = Enumerable.Range(1, 2).Select(k => Task.Run(() =>
                Run(A(
                    "build",
                    spellings[k - 1],
                    "-o",
                    outDir,
                    "-q",
                    "--no-chart-images",
                    "--jobs",
                    "1",
                    "--shard",
                    $"{k}/2")))).ToArray();
            await Task.WhenAll(runs);

            // Then every job succeeds and every brief was built once, by one shard
            foreach (var r in runs) Assert.True((await r).Code == 0, (await r).Err);
            var built = LogLines(outDir).Where(l => l.GetProperty("status").GetString() == "built")
                .Select(l => l.GetProperty("id").GetString())
                .ToList();
            Assert.Equal(new[] {
                "auroria-eastmark",
                "auroria-national",
                "auroria-northport",
                "auroria-silverdale",
                "auroria-valdoree" }, built.Order());
            Assert.Equal(5, Directory.GetFiles(outDir, "*.pdf").Length);
            Assert.Equal(2, LogLines(outDir).Select(l => l.GetProperty("shard").GetString()).Distinct().Count());
        }
    }

    public class SolveJson
    {
        [Fact]
        public void Prints_a_list_whatever_the_number_of_files()
        {
            var one = Run(A("solve", "--json", CliAppTests.Demo("auroria-silverdale.yaml")));
            var two = Run(A(
                "solve",
                "--json",
                CliAppTests.Demo("auroria-silverdale.yaml"),
                CliAppTests.Demo("auroria-eastmark.yaml")));
            using var a = JsonDocument.Parse(one.Out);
            using var b = JsonDocument.Parse(two.Out);
            Assert.Equal(JsonValueKind.Array, a.RootElement.ValueKind);
            Assert.Equal(1, a.RootElement.GetArrayLength());
            Assert.Equal(2, b.RootElement.GetArrayLength());
            Assert.Equal("auroria-eastmark", b.RootElement[1].GetProperty("scenario_id").GetString());
        }
    }

    public class CsvAnnex
    {
        [Theory]
        [InlineData("=SUM(1,2)", "\"'=SUM(1,2)\"")]
        [InlineData("+1", "'+1")]
        [InlineData("-2 years", "'-2 years")]
        [InlineData("@cmd", "'@cmd")]
        [InlineData("\tx", "'\tx")]
        [InlineData("\rx", "\"'\rx\"")]
        [InlineData("Compulsory to 12 years", "Compulsory to 12 years")]
        [InlineData("a=b", "a=b")]
        public void Text_a_spreadsheet_would_run_as_a_formula_gets_a_quote_prefix(string text, string field)
        {
            // The usual prefix rule against CSV injection (common practice, as in the OWASP "CSV Injection" advice).
            Assert.Equal(field, Csv.Field(text));
        }

        [Fact]
        public void Negative_numbers_stay_numbers()
        {
            Assert.Equal("-0.5", Csv.Field(-0.5));
            Assert.Equal("-3", Csv.Field(-3));
        }

        [Fact]
        public void A_formula_label_is_neutralised_in_the_built_csv_and_the_byte_order_mark_is_on_request()
        {
            var w = new Workspace("auroria-silverdale");
            w.Edit("auroria-national.yaml", "label: Compulsory to 12 years", "label: \"=SUM(1,2)\"");
            Assert.Equal(0, w.Build("-o", Path.Combine(w.Dir, "plain")).Code);
            Assert.Equal(0, w.Build("-o", Path.Combine(w.Dir, "bom"), "--csv-bom").Code);
            byte[] plain = File.ReadAllBytes(Path.Combine(w.Dir, "plain", "auroria-national-2026-11-30.options.csv"));
            byte[] bom = File.ReadAllBytes(Path.Combine(w.Dir, "bom", "auroria-national-2026-11-30.options.csv"));
            Assert.Contains("\"'=SUM(1,2)\"", Encoding.UTF8.GetString(plain));
            Assert.NotEqual(0xEF, plain[0]);
            Assert.Equal(new byte[] { 0xEF, 0xBB, 0xBF }, bom[..3]);
            Assert.Equal(plain, bom[3..]);
            // The PDF and results do not change with the byte order mark.
            Assert.Equal(
                File.ReadAllBytes(Path.Combine(w.Dir, "plain", "auroria-national-2026-11-30.pdf")),
                File.ReadAllBytes(Path.Combine(w.Dir, "bom", "auroria-national-2026-11-30.pdf")));
        }
    }
}
