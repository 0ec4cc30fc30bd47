using Briefwright.Model.Inputs;

namespace Briefwright.Scenario.Tests;

public class ScenarioLoaderTests
{
    private static string Single(LoadResult r)
    {
        Assert.Null(r.Document);
        return Assert.Single(r.Problems).Message;
    }

    public class ValidInput
    {
        [Fact]
        public void Binds_every_section_and_reads_percentages_as_fractions()
        {
            var r = MemoryReader.Load(MemoryReader.Valid);
            Assert.True(r.Ok, string.Join("\n", r.Problems));
            var d = r.Document!;
            Assert.Equal(0.01, d.Inputs.Demography.GrowthRate, 15);
            Assert.Equal(0.03, d.Inputs.Production.Depreciation, 15);
            Assert.Equal("base", d.Inputs.BaselineId);
            Assert.Equal(BracketReturns.HallJones, d.Inputs.HumanCapital.Returns);
            Assert.Equal(new DateOnly(2026, 11, 30), d.Brief.Date);
            Assert.Equal("draft", d.Brief.Status);
        }

        [Fact]
        public void Keeps_source_and_note_of_a_wrapped_parameter_for_the_assumptions_table()
        {
            var r = MemoryReader.Load(MemoryReader.With(
                "saving_rate: 0.2",
                "saving_rate: { value: 21%, source: Accounts (invented), note: Gross }"));
            var row = r.Document!.Assumptions.Single(a => a.Path == "production.saving_rate");
            Assert.Equal((0.21, "Accounts (invented)", "Gross"), (row.Value!.Value, row.Source, row.Note));
        }

        [Fact]
        public void Extends_a_parent_with_deep_merge_and_a_path_relative_to_the_child()
        {
            // The parent lies above the child's folder, so the project folder (--root) is given as the current one.
            var child = "extends: ../national.yaml\nbrief:\n  id: region\ndemography:\n  population_growth: -0.5%\n";
            var files = new Dictionary<string, string> {
                ["regions/r.yaml"] = child,
                ["national.yaml"] = MemoryReader.Valid };
            var r = new ScenarioLoader(new MemoryReader(files), root: ".").Load("regions/r.yaml");
            Assert.True(r.Ok, string.Join("\n", r.Problems));
            Assert.Equal("region", r.Document!.Brief.Id);
            Assert.Equal("Test brief", r.Document.Brief.Title);
            Assert.Equal(-0.005, r.Document.Inputs.Demography.GrowthRate, 15);
            Assert.Equal(65, r.Document.Inputs.Demography.RetirementAge);
        }

        [Fact]
        public void A_child_parameter_replaces_the_parents_source_and_note_whole()
        {
            var parent = MemoryReader.With(
                "population_growth: 1%",
                "population_growth: { value: 1%, source: P, note: Parent note }");
            var child = "extends: p.yaml\ndemography:\n  population_growth: { value: 2%, source: C }\n";
            var files = new Dictionary<string, string> { ["c.yaml"] = child, ["p.yaml"] = parent };
            var r = new ScenarioLoader(new MemoryReader(files)).Load("c.yaml");
            var row = r.Document!.Assumptions.Single(a => a.Path == "demography.population_growth");
            Assert.Equal((0.02, "C", (string?)null), (row.Value!.Value, row.Source, row.Note));
        }

        [Fact]
        public void Reads_a_life_table_with_any_radix_and_scales_it_to_one()
        {
            var text = MemoryReader.With("form: rectangular\n    max_age: 80", "form: life_table\n    file: lt.csv");
            var r = MemoryReader.Load(text, ("lt.csv", "age,survivors\n0,100000\n50,90000\n100,0\n"));
            Assert.True(r.Ok, string.Join("\n", r.Problems));
            Assert.Equal(0.95, r.Document!.Inputs.Demography.Survival.At(25), 12);
        }
    }

    public class Problems
    {
        [Theory]
        [InlineData(
            "population_growth: 1%",
            "population_growth: 12%",
            "s.yaml:7:22: demography.population_growth: must be at least -10% and at most 10%. Got '12%'.")]
        [InlineData(
            "saving_rate: 0.2",
            "saving_rate: 1.2",
            "s.yaml:14:16: production.saving_rate: must be at least 0.001 and less than 1. Got '1.2'.")]
        [InlineData(
            "capital_share: 0.33",
            "capital_share: 0",
            "s.yaml:15:18: production.capital_share: must be greater than 0 and less than 0.9. Got '0'.")]
        [InlineData(
            "saving_rate: 0.2",
            "saving_rate: abc",
            "s.yaml:14:16: production.saving_rate: must be a number or a percentage. Got 'abc'.")]
        [InlineData(
            "saving_rate: 0.2",
            "saving_rate: .nan",
            "s.yaml:14:16: production.saving_rate: must be a number or a percentage. Got '.nan'.")]
        [InlineData(
            "saving_rate: 0.2",
            "saving_rate: NaN",
            "s.yaml:14:16: production.saving_rate: must be a finite number. Got 'NaN'.")]
        [InlineData("school_entry_age: 6", "school_entry_age: 6%",
            "s.yaml:8:21: demography.school_entry_age: must be a plain number; a percent sign is only allowed for " +
            "rates. Got '6%'.")]
        [InlineData(
            "retirement_age: 65",
            "retirment_age: 65",
            "s.yaml:9:3: demography.retirment_age: unknown key (did you mean 'retirement_age'?). Got 'retirment_age'.")]
        [InlineData(
            "date: 2026-11-30",
            "date: 30/11/2026",
            "s.yaml:5:9: brief.date: must be a date written YYYY-MM-DD. Got '30/11/2026'.")]
        [InlineData("id: test-brief", "id: ../etc",
            "s.yaml:2:7: brief.id: must be 1–64 lower-case letters, digits, '-' or '_', starting with a letter or " +
            "digit (it names the output files). Got '../etc'.")]
        [InlineData("form: rectangular", "form: rectangle",
            "s.yaml:11:11: demography.survival.form: must be one of rectangular, gompertz_makeham, life_table (did " +
            "you mean 'rectangular'?). Got 'rectangle'.")]
        [InlineData(
            "max_age: 80",
            "max_age: 60",
            "s.yaml:9:19: demography.retirement_age: must not exceed the survival curve's maximum age (60). Got 65.")]
        [InlineData("schooling_years: 12", "schooling_years: 12\n    retirement_age: 18",
            "s.yaml:24:22: options[1].schooling_years: school-entry age plus schooling must be below the retirement " +
            "age (6 + 12 = 18, retirement at 18). Got 12.")]
        [InlineData("depreciation: 3%\n  technology_growth: 2%",
            "depreciation: 0%\n  technology_growth: -2%",
                "s.yaml:16:17: production.depreciation: population growth + technology growth + depreciation must be " +
                "at least 0.1%, or the model's results are not finite (1% + -2% + 0% = -1%). Got 0%.")]
        [InlineData(
            "id: more",
            "id: base",
            "s.yaml:22:9: options[1].id: option ids must be unique (also used by options[0]). Got 'base'.")]
        [InlineData(
            "  organisation: Test Institute (invented)\n",
            "",
            "s.yaml:2:3: brief.organisation: required field is missing.")]
        public void Are_reported_with_position_field_rule_and_value(string find, string replace, string expected)
        {
            var r = MemoryReader.Load(MemoryReader.With(find, replace));
            Assert.Null(r.Document);
            Assert.Equal(expected, r.Problems[0].Message);
        }

        [Fact]
        public void A_misspelt_required_key_reports_the_suggestion_and_the_missing_field()
        {
            var r = MemoryReader.Load(MemoryReader.With("retirement_age: 65", "retirment_age: 65"));
            Assert.Equal("s.yaml:7:3: demography.retirement_age: required field is missing.", r.Problems[1].Message);
            Assert.Equal(2, r.Problems.Count);
        }

        [Fact]
        public void Are_all_reported_at_once()
        {
            var text = MemoryReader.With("saving_rate: 0.2", "saving_rate: 2")
                .Replace("capital_share: 0.33", "capital_share: x")
                .Replace("school_entry_age: 6", "school_age: 6");
            var r = MemoryReader.Load(text);
            Assert.Equal(4, r.Problems.Count); // unknown key, missing entry age, two bad numbers
        }

        [Fact]
        public void Brackets_must_start_at_zero_and_increase()
        {
            var text = MemoryReader.Valid + "\nhuman_capital:\n  returns:\n    form: brackets\n    brackets:\n" +
                "      - { from: 0, rate: 10% }\n      - { from: 8, rate: 8% }\n      - { from: 6, rate: 6% }\n";
            Assert.Equal("s.yaml:31:17: human_capital.returns.brackets[2].from: brackets must start at increasing " +
                "years (previous bracket starts at 8). Got '6'.", Single(MemoryReader.Load(text)));
        }

        [Fact]
        public void Gompertz_Makeham_parameters_must_be_positive()
        {
            var text = MemoryReader.With(
                "form: rectangular\n    max_age: 80",
                "form: gompertz_makeham\n    a: 0.0002\n    b: -1e-6\n    c: 1.1");
            Assert.Equal(
                "s.yaml:13:8: demography.survival.b: must be greater than 0 and less than 1. Got '-1e-6'.",
                Single(MemoryReader.Load(text)));
        }

        [Fact]
        public void Life_table_must_not_increase()
        {
            var text = MemoryReader.With("form: rectangular\n    max_age: 80", "form: life_table\n    file: lt.csv");
            var r = MemoryReader.Load(text, ("lt.csv", "0,1\n50,0.9\n60,0.95\n100,0\n"));
            Assert.Equal("lt.csv:3:4: demography.survival.file: survivors must not increase with age (previous row: " +
                "0.9). Got 0.95.", Single(r));
        }

        [Fact]
        public void Duplicate_keys_name_the_first_occurrence()
        {
            var text = MemoryReader.With("school_entry_age: 6", "school_entry_age: 6\n  school_entry_age: 7");
            Assert.Equal("s.yaml:9:3: demography.school_entry_age: duplicate key; first given at line 8. Got " +
                "'school_entry_age' again.", Single(MemoryReader.Load(text)));
        }

        [Fact]
        public void Malformed_yaml_is_a_positioned_syntax_error()
        {
            var msg = Single(MemoryReader.Load("brief:\n  id: [unclosed\n"));
            Assert.StartsWith("s.yaml:3:1: YAML syntax error", msg);
        }

        [Fact]
        public void An_empty_file_says_what_a_scenario_needs()
        {
            Assert.Equal("s.yaml:1:1: file is empty; a scenario needs at least the brief, demography and options " +
                "sections. Got nothing.", Single(MemoryReader.Load("# only a comment\n")));
        }

        [Fact]
        public void Cyclic_extends_is_reported_with_the_cycle()
        {
            var files = new Dictionary<string, string> {
                ["a.yaml"] = "extends: b.yaml\n",
                ["b.yaml"] = "extends: a.yaml\n" };
            var r = new ScenarioLoader(new MemoryReader(files)).Load("a.yaml");
            Assert.Equal(
                "b.yaml:1:10: extends: scenarios extend each other in a cycle (a.yaml → b.yaml → a.yaml). Got " +
                "'a.yaml'.",
                Single(r));
        }

        [Fact]
        public void Missing_extends_points_at_the_extends_line()
        {
            var r = MemoryReader.Load("extends: nowhere.yaml\n");
            Assert.Equal(
                "s.yaml:1:10: extends: cannot read the extended scenario (no such file). Got 'nowhere.yaml'.",
                Single(r));
        }

        [Fact]
        public void Rendering_shows_the_source_line_with_a_caret_under_the_column()
        {
            var r = MemoryReader.Load(MemoryReader.With("saving_rate: 0.2", "saving_rate: 2"));
            var lines = r.Sources.Render(r.Problems[0]).Split('\n');
            Assert.Equal("      saving_rate: 2", lines[1]);
            Assert.Equal("                   ^", lines[2]);
        }
    }
}

public class SizeLimitTests
{
    [Fact]
    public void A_scenario_over_the_size_limit_is_refused_with_a_positioned_error()
    {
        string huge = MemoryReader.Valid + "\n# " + new string('x', 1_100_000) + "\n";
        var r = MemoryReader.Load(huge);
        int bytes = System.Text.Encoding.UTF8.GetByteCount(huge);
        Assert.Equal("s.yaml:1:1: file is larger than the limit for a scenario of 1 MiB (1,048,576 bytes). Got " +
            $"{bytes:N0} bytes.", Assert.Single(r.Problems).Message);
    }
}
