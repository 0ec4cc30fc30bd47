namespace Briefwright.Scenario.Tests;

/// <summary>
/// Every file a scenario names stays inside the project folder, is of the kind its field needs, and is never quoted
/// when it is not a scenario; extends merges as documented and errors point at the file that wrote the value.
/// </summary>
public class ConfinementTests
{
    private static LoadResult LoadWith(string child, params (string Path, string Text)[] more)
    {
        var files = new Dictionary<string, string> {
            ["proj/s.yaml"] = child,
            ["secret.yaml"] = "password: hunter2\n",
            ["proj/notes.txt"] = "hunter2\n" };
        foreach (var (p, t) in more) files[p] = t;
        return new ScenarioLoader(new MemoryReader(files)).Load("proj/s.yaml");
    }

    private static string First(LoadResult r) => r.Problems.Count > 0 ? r.Problems[0].Message : "no problem";

    [Theory]
    [InlineData("/etc/shadow.yaml", "must be a path relative to the file that names it")]
    [InlineData("/proc/self/environ", "must name a scenario file (.yaml or .yml)")]
    [InlineData("C:/secrets/x.yaml", "absolute paths are not allowed")]
    [InlineData("~/x.yaml", "absolute paths are not allowed")]
    [InlineData("../secret.yaml", "'..' may not lead out of it")]
    [InlineData("sub/../../secret.yaml", "'..' may not lead out of it")]
    [InlineData("..\\\\secret.yaml", "'..' may not lead out of it")]
    [InlineData("notes.txt", "must name a scenario file (.yaml or .yml)")]
    public void Extends_outside_the_project_folder_or_of_another_kind_is_a_positioned_error_that_quotes_nothing(
        string target,
        string rule)
    {
        var r = LoadWith($"extends: \"{target}\"\nbrief:\n  id: x\n");
        Assert.False(r.Ok);
        var p = Assert.Single(r.Problems);
        Assert.StartsWith("proj/s.yaml:1:10: extends: ", p.Message);
        Assert.Contains(rule, p.Message);
        Assert.DoesNotContain("hunter2", string.Join("\n", r.Problems.Select(r.Sources.Render)));
    }

    [Fact]
    public void A_parent_inside_the_project_folder_is_read_and_a_root_given_widens_the_folder()
    {
        var inside = LoadWith(
            "extends: common/base.yaml\nbrief:\n  id: child\n",
            ("proj/common/base.yaml", MemoryReader.Valid));
        Assert.True(inside.Ok, First(inside));
        var files = new Dictionary<string, string> {
            ["proj/s.yaml"] = "extends: ../base.yaml\n",
            ["base.yaml"] = MemoryReader.Valid };
        Assert.False(new ScenarioLoader(new MemoryReader(files)).Load("proj/s.yaml").Ok);
        var widened = new ScenarioLoader(new MemoryReader(files), root: ".").Load("proj/s.yaml");
        Assert.True(widened.Ok, First(widened));
    }

    [Theory]
    [InlineData("/etc/passwd.csv", "absolute paths are not allowed")]
    [InlineData("../table.csv", "'..' may not lead out of it")]
    [InlineData("notes.txt", "must name a life table file (.csv)")]
    public void A_life_table_outside_the_project_folder_or_not_csv_is_refused_before_reading(string file, string rule)
    {
        var r = LoadWith(
            MemoryReader.With("form: rectangular\n    max_age: 80", $"form: life_table\n    file: \"{file}\""),
            ("table.csv", "age,survivors\n0,1\n100,0\n"));
        Assert.Contains(rule, First(r));
        Assert.StartsWith("proj/s.yaml:12:11: demography.survival.file: ", First(r));
    }

    [Fact]
    public void A_binary_life_table_is_refused_without_showing_its_lines()
    {
        var r = LoadWith(
            MemoryReader.With("form: rectangular\n    max_age: 80", "form: life_table\n    file: t.csv"),
            ("proj/t.csv", "hunter2\0,1\n"));
        Assert.Contains("binary", First(r));
        Assert.DoesNotContain("hunter2", string.Join("\n", r.Problems.Select(r.Sources.Render)));
    }

    [Fact]
    public void A_binary_scenario_is_reported_without_showing_its_first_line()
    {
        var r = LoadWith("SECRET=hunter2\0PATH=/bin\n");
        Assert.Equal(
            "proj/s.yaml:1:1: file is binary, not YAML text. Got a NUL byte.",
            r.Sources.Render(r.Problems[0]));
    }

    [Fact]
    public void A_child_that_switches_a_distribution_replaces_the_parents_parameters_and_errors_point_at_the_child()
    {
        string parent = MemoryReader.Valid + "\nuncertainty:\n  seed: 1\n  parameters:\n" +
            "    saving_rate: { distribution: uniform, low: 10%, high: 30% }\n";
        string child
            = "extends: p.yaml\nuncertainty:\n  parameters:\n    saving_rate: { distribution: normal, mean: 20% }\n";
        var r = LoadWith(child, ("proj/p.yaml", parent));
        Assert.True(r.Problems.Count == 1, string.Join("\n", r.Problems));
        var p = r.Problems[0];
        // The parent's low and high are not inherited (they would be unknown keys of a normal distribution), and the
        // missing sd is reported in the child, where the distribution was written.
        Assert.StartsWith(
            "proj/s.yaml:4:18: uncertainty.parameters.saving_rate.sd: required field is missing",
            p.Message);
    }

    [Fact]
    public void Ids_may_not_end_in_a_newline_and_messages_show_control_characters_as_escapes()
    {
        var r = MemoryReader.Load(MemoryReader.With("id: test-brief", "id: \"test\\n\""));
        Assert.Equal("s.yaml:2:7: brief.id: must be 1–64 lower-case letters, digits, '-' or '_', starting with a " +
            "letter or digit (it names the output files). Got 'test\\n'.", First(r));
    }

    [Theory]
    [InlineData("saving_rate: !!str 0.2", "must be a number or a percentage. Got '0.2'.")]
    [InlineData(
        "saving_rate: !custom 0.2",
        "unsupported YAML tag; only !!str, !!int, !!float, !!bool and !!null are read. Got '!custom'.")]
    [InlineData(
        "saving_rate: !!binary aGk=",
        "unsupported YAML tag; only !!str, !!int, !!float, !!bool and !!null are read. Got '!!binary'.")]
    public void Tagged_scalars_are_read_per_their_tag(string line, string expected)
    {
        var r = MemoryReader.Load(MemoryReader.With("saving_rate: 0.2", line));
        Assert.EndsWith(expected, First(r));
    }

    [Fact]
    public void A_scalar_tagged_as_a_number_is_a_number_even_when_quoted()
    {
        var r = MemoryReader.Load(MemoryReader.With("saving_rate: 0.2", "saving_rate: !!float \"0.2\""));
        Assert.True(r.Ok, First(r));
        Assert.Equal(0.2, r.Document!.Inputs.Production.SavingRate);
    }

    [Fact]
    public void A_file_one_byte_over_the_limit_reports_its_exact_size()
    {
        string text = MemoryReader.Valid + "\n#"
            + new string('x', Yaml.YamlTreeReader.MaxBytes - MemoryReader.Valid.Length - 1);
        Assert.Equal(Yaml.YamlTreeReader.MaxBytes + 1, System.Text.Encoding.UTF8.GetByteCount(text));
        Assert.Equal(
            "s.yaml:1:1: file is larger than the limit for a scenario of 1 MiB (1,048,576 bytes). Got 1,048,577 bytes.",
            First(MemoryReader.Load(text)));
    }

    [Theory]
    [InlineData("/work/p", "/work/p/a.yaml", true)]
    [InlineData("/work/p", "/work/p", true)]
    [InlineData("/work/p", "/work/pq/a.yaml", false)]
    [InlineData("/work/p/", "/work/p/a.yaml", true)]
    [InlineData("/", "/etc/passwd", true)]
    public void Inside_means_the_folder_itself_or_below_it_never_a_sibling_with_the_same_prefix(
        string root,
        string path,
        bool inside)
    {
        Assert.Equal(inside, ProjectRoot.IsInside(path, root));
    }
}
