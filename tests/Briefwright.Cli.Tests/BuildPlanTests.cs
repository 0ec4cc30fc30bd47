using System.Text.Json;
using Briefwright.Cli.Batch;
using Briefwright.Cli.Project;

namespace Briefwright.Cli.Tests;

/// <summary>
/// <c>build --plan</c>: what a build would do and why, from the same planner, writing nothing at all.
/// </summary>
public class BuildPlanTests
{
    private static (int Code, string Out, string Err) Run(params string[] args) => ReissueTests.Run(args);

    /// <summary>Every file (by SHA-256) and folder under <paramref name="dir"/>, the output folder included.</summary>
    private static SortedDictionary<string, string> Tree(string dir) =>
        new(Directory.GetFileSystemEntries(dir, "*", SearchOption.AllDirectories)
            .ToDictionary(
                p => Path.GetRelativePath(dir, p),
                p => Directory.Exists(p) ? "folder" : EditionFolder.Sha256(p)), StringComparer.Ordinal);

    private static (int Code, string Out, string Err) PlanWritingNothing(Workspace w, params string[] args)
    {
        var before = Tree(w.Dir);
        var result = Run(["build", w.Dir, "--plan", .. args]);
        Assert.Equal(before, Tree(w.Dir));
        return result;
    }

    private static JsonElement Json(string output)
    {
        using var doc = JsonDocument.Parse(output);
        Assert.Equal(JsonValueKind.Array, doc.RootElement.ValueKind);
        return doc.RootElement.Clone();
    }

    [Fact]
    public void Says_for_each_path_what_a_build_would_do_and_why_and_the_build_then_does_it()
    {
        // A new brief: built new; no output folder is made by the plan.
        var w = new Workspace("auroria-national");
        var (code, output, _) = PlanWritingNothing(w, "--no-chart-images");
        Assert.Equal(0, code);
        Assert.False(Directory.Exists(w.Out));
        Assert.Contains("auroria-national  build new        1  auroria-national-2026-11-30.pdf", output);
        Assert.Contains("1 brief(s): 1 build new. Plan only: nothing was written.", output);
        Assert.Equal(0, w.Build().Code);

        // Nothing changed: skip.
        var skip = Json(PlanWritingNothing(w, "--no-chart-images", "--json").Out)[0];
        Assert.Equal("skip", skip.GetProperty("action").GetString());
        Assert.Equal(1, skip.GetProperty("edition").GetInt32());

        // A new date: re-dated, with the dates named.
        var redate = Json(PlanWritingNothing(w, "--no-chart-images", "--json", "--date", "2026-12-31").Out)[0];
        Assert.Equal("redate", redate.GetProperty("action").GetString());
        Assert.Equal("auroria-national-2026-12-31", redate.GetProperty("files").GetString());
        Assert.Contains("the date (2026-11-30 → 2026-12-31)", redate.GetProperty("why").GetString());
        Assert.Equal("archive/auroria-national/edition-1", redate.GetProperty("archive").GetString());

        // Chart copies switched on: the same edition, nothing archived.
        var copies = Json(PlanWritingNothing(w, "--json").Out)[0];
        Assert.Equal("rewrite", copies.GetProperty("action").GetString());
        Assert.Equal(
            ["outputs.chart_copies"],
            copies.GetProperty("changed").EnumerateArray().Select(e => e.GetString()));
        Assert.False(copies.TryGetProperty("archive", out _));

        // An assumption changed: new edition 2 under its own name, and the build does exactly that.
        w.Edit("auroria-national.yaml", "value: 22%", "value: 23%");
        var (code2, text, _) = PlanWritingNothing(w, "--no-chart-images");
        Assert.Equal(0, code2);
        Assert.Contains("auroria-national  new edition        2  auroria-national-2026-11-30-edition-2.pdf", text);
        Assert.Contains("changed: the scenario's content: a new edition 2 after edition 1; the current files are " +
            "kept first in archive/auroria-national/edition-1.", text);
        var planned = Json(PlanWritingNothing(w, "--no-chart-images", "--json").Out)[0];
        Assert.Equal(["content"], planned.GetProperty("changed").EnumerateArray().Select(e => e.GetString()));
        Assert.Equal(0, w.Build().Code);
        var built = Snapshot.AssertWhole(w.Out);
        Assert.Equal(
            (planned.GetProperty("edition").GetInt32(), planned.GetProperty("files").GetString()),
            (built.Edition, built.Stem));
    }

    [Fact]
    public void A_new_tool_version_is_settled_by_the_results_before_the_plan_says_anything()
    {
        var w = new Workspace("auroria-national");
        Assert.Equal(0, w.Build().Code);
        // The manifest as an earlier release would have written it (its own check made again, so it stays valid).
        var m = Snapshot.AssertWhole(w.Out);
        var inputs = m.Inputs.ToDictionary();
        inputs["tool"] = "0.1.0";
        File.WriteAllBytes(
            Manifest.PathFor(w.Out, m.Id),
            (m with { Inputs = inputs, Hash = "fingerprint-of-an-earlier-release" }).ToBytes());

        var plan = Json(PlanWritingNothing(w, "--no-chart-images", "--json").Out)[0];
        Assert.Equal("rewrite", plan.GetProperty("action").GetString());
        Assert.Equal(1, plan.GetProperty("edition").GetInt32());
        Assert.Contains($"the tool version (0.1.0 → {Brief.ToolInfo.Version})", plan.GetProperty("why").GetString());
        Assert.Equal(0, w.Build().Code);
        Assert.Equal(1, Snapshot.AssertWhole(w.Out).Edition); // the same results: the same edition
    }

    [Fact]
    public void Writes_nothing_on_invalid_input_usage_errors_a_bad_theme_or_leftovers_of_an_interrupted_build()
    {
        var w = new Workspace("auroria-national");
        Assert.Equal(0, w.Build().Code);
        string yaml = Path.Combine(w.Dir, "auroria-national.yaml");

        Assert.Equal(2, PlanWritingNothing(w, "--bogus").Code);
        File.WriteAllText(Path.Combine(w.Dir, "bad.theme.yaml"), "name: Bad (invented)\npaper: a5\n");
        Assert.Equal(2, PlanWritingNothing(w, "--theme", Path.Combine(w.Dir, "bad.theme.yaml")).Code);
        Assert.Equal(2, PlanWritingNothing(w, "--jobs", "0").Code);

        // An interrupted build's staging folder is left for the next build, and the plan says so.
        Directory.CreateDirectory(
            Path.Combine(w.Out, EditionFolder.TempFolderName, "auroria-national.0123456789abcdef", "new"));
        var (code, output, _) = PlanWritingNothing(w, "--no-chart-images");
        Assert.Equal(0, code);
        Assert.Contains("is running or was interrupted", output);

        // An invalid scenario: exit 2, its positioned messages on stderr and in the plan.
        w.Edit("auroria-national.yaml", "value: 22%", "value: 122%");
        var (bad, json, err) = PlanWritingNothing(w, "--json");
        Assert.Equal(2, bad);
        Assert.Contains(
            $"{yaml}:52:12: production.saving_rate.value: must be at least 0.1% and less than 100%. Got '122%'.",
            err);
        var entry = Json(json)[0];
        Assert.Equal("invalid", entry.GetProperty("action").GetString());
        Assert.StartsWith($"{yaml}:52:12:", entry.GetProperty("messages")[0].GetString());
    }

    [Fact]
    public void Brief_edition_below_an_issued_edition_is_invalid_in_the_plan_too()
    {
        var w = new Workspace("auroria-national");
        w.Edit("auroria-national.yaml", "edition: 1", "edition: 3");
        Assert.Equal(0, w.Build().Code);
        w.Edit("auroria-national.yaml", "edition: 3", "edition: 2");
        var (code, output, err) = PlanWritingNothing(w, "--no-chart-images");
        Assert.Equal(2, code);
        Assert.Contains("brief.edition: must not be below edition 3", output);
        Assert.Contains("brief.edition: must not be below edition 3", err);
    }

    [Fact]
    public void Uses_the_project_settings_as_a_build_would_and_json_is_only_for_plans()
    {
        var w = new Workspace("auroria-national");
        File.WriteAllText(
            Path.Combine(w.Dir, ProjectSettings.FileName),
            "out: briefs\ndate: 2027-03-01\nchart_copies: false\n");
        var plan = Json(PlanWritingNothing(w, "--json").Out)[0];
        Assert.Equal("auroria-national-2027-03-01", plan.GetProperty("files").GetString());
        Assert.Equal(Path.Combine(w.Dir, "briefs"), plan.GetProperty("out").GetString());

        var (code, _, err) = Run("build", w.Dir, "--json");
        Assert.Equal(2, code);
        Assert.Contains("--json is for --plan", err);
    }

    [Fact]
    public void Build_help_explains_the_plan_and_the_edition_rule()
    {
        var (code, output, _) = Run("build", "--help");
        Assert.Equal(0, code);
        Assert.Contains("--plan", output);
        Assert.Contains("a new date alone re-dates the current edition", output);
        Assert.Contains("output switches never make an edition", output);
    }
}
