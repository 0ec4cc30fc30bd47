using System.Text.Json;

namespace Briefwright.Cli.Tests;

public class CliAppTests
{
    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CliApp.Run(args, output, error);
        return (code, output.ToString(), error.ToString());
    }

    internal static string Demo(string file = "") => Path.Combine(RepoRoot(), "briefs-demo", file);

    internal static string RepoRoot() => RepositoryRoot.Path;

    public class Check
    {
        [Fact]
        public void Accepts_every_demo_scenario_in_the_folder()
        {
            var (code, output, error) = Run("check", Demo());
            Assert.Equal(0, code);
            Assert.Equal("", error);
            // five scenarios and the theme
            Assert.Equal(6, output.Split('\n', StringSplitOptions.RemoveEmptyEntries).Length);
        }

        [Fact]
        public void Exits_with_2_and_positioned_errors_on_invalid_input()
        {
            string dir = Directory.CreateTempSubdirectory("bw-").FullName;
            string bad = Path.Combine(dir, "bad.yaml");
            File.WriteAllText(
                bad,
                File.ReadAllText(Demo("auroria-national.yaml")).Replace("value: 22%", "value: 122%"));
            var (code, _, error) = Run("check", bad);
            Assert.Equal(2, code);
            Assert.Contains(
                $"{bad}:52:12: production.saving_rate.value: must be at least 0.1% and less than 100%. Got '122%'.",
                error);
            Assert.Contains("^", error);
            Assert.DoesNotContain("   at ", error); // no stack trace
        }
    }

    public class Solve
    {
        [Fact]
        public void Json_uses_the_documented_field_names()
        {
            var (code, output, _) = Run("solve", "--json", Demo("auroria-national.yaml"));
            Assert.Equal(0, code);
            using var doc = JsonDocument.Parse(output);
            var root = Assert.Single(doc.RootElement.EnumerateArray());
            Assert.Equal("auroria-national", root.GetProperty("scenario_id").GetString());
            var option = root.GetProperty("options")[1];
            foreach (var name in new[] {
                "id",
                "schooling_years",
                "worker_share",
                "human_capital_per_worker",
                "output_per_person",
                "change_vs_baseline_pct" })
                Assert.True(option.TryGetProperty(name, out _), name);
            var optimum = root.GetProperty("optimum");
            Assert.Equal("numerical", optimum.GetProperty("method").GetString());
            Assert.Equal(2, optimum.GetProperty("within_1pct").GetArrayLength());
            Assert.True(optimum.GetProperty("local_maxima").GetArrayLength() >= 1);
            Assert.True(optimum.GetProperty("output_per_person").GetDouble() >= option.GetProperty("output_per_person")
                .GetDouble());
        }

        [Fact]
        public void Prints_a_table_with_every_option()
        {
            var (code, output, _) = Run("solve", Demo("auroria-silverdale.yaml"));
            Assert.Equal(0, code);
            Assert.Contains("current-law (baseline)", output);
            Assert.Contains("plus-two-retire-67", output);
            Assert.Contains("Output-maximising schooling E*", output);
        }
    }

    [Fact]
    public void Help_lists_the_commands()
    {
        var (code, output, _) = Run("--help");
        Assert.Equal(0, code);
        Assert.Contains("check", output);
        Assert.Contains("solve", output);
    }
}

public class SchemaAndDiffTests
{
    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        return (CliApp.Run(args, output, error), output.ToString(), error.ToString());
    }

    [Fact]
    public void Published_schema_matches_the_schema_command_and_names_every_section()
    {
        var (code, output, _) = Run("schema");
        Assert.Equal(0, code);
        Assert.Equal(File.ReadAllText(Path.Combine(CliAppTests.RepoRoot(), "docs", "scenario.schema.json")), output);
        using var doc = System.Text.Json.JsonDocument.Parse(output);
        var sections = doc.RootElement.GetProperty("$defs").GetProperty("complete").GetProperty("properties")
            .EnumerateObject()
            .Select(p => p.Name)
            .Order();
        Assert.Equal(Briefwright.Scenario.Binding.ScenarioBinder.TopLevelKeys.Order(), sections);
    }

    [Fact]
    public void Diff_of_two_scenarios_lists_changed_assumptions_with_sources_and_exits_1()
    {
        var (code, output, _) = Run(
            "diff",
            CliAppTests.Demo("auroria-national.yaml"),
            CliAppTests.Demo("auroria-eastmark.yaml"));
        Assert.Equal(1, code);
        Assert.Contains("Population growth rate (demography.population_growth): 0.90% → 1.60%  [source: Eastmark " +
            "provincial projection 2025 (invented)]", output);
        Assert.Contains("School-entry age (demography.school_entry_age): 6 → 5", output);
    }

    [Fact]
    public void Diff_of_a_scenario_with_itself_finds_nothing_and_exits_0()
    {
        var (code, output, _) = Run(
            "diff",
            CliAppTests.Demo("auroria-silverdale.yaml"),
            CliAppTests.Demo("auroria-silverdale.yaml"));
        Assert.Equal(0, code);
        Assert.Equal("No assumption or headline result differs.\n", output);
    }
}
