using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using Briefwright.Scenario;
using UglyToad.PdfPig;

namespace Briefwright.Brief.Tests;

/// <summary>
/// Invented stress scenarios (tests/stress), one per branch of the brief's wording, each built into a PDF whose
/// extracted text is checked against its own results data: no word of increase beside a fall or the reverse, no
/// "peak" where the optimum is at the edge of the range, and every number in page 1's key findings equal to a page-1
/// fact of the results JSON after rounding.
/// </summary>
public class StressScenarioTests
{
    public static TheoryData<string> Scenarios()
    {
        var data = new TheoryData<string>();
        foreach (var f in Directory.GetFiles(Path.Combine(Demo.Root, "tests", "stress"), "*.yaml").Order()) data.Add(
            Path.GetFileNameWithoutExtension(f));
        return data;
    }

    private static readonly Dictionary<string, (BuiltBrief Brief, ScenarioDocument Scenario)> Cache = new();

    private static (BuiltBrief Brief, ScenarioDocument Scenario, JsonElement Json, string[] Pages) Build(string name)
    {
        (BuiltBrief, ScenarioDocument) built;
        lock (Cache)
        {
            if (!Cache.TryGetValue(name, out built))
            {
                var result = new ScenarioLoader(new Demo.DiskReader()).Load(
                    Path.Combine(Demo.Root, "tests", "stress", name + ".yaml"));
                Assert.True(result.Ok, string.Join("\n", result.Problems));
                Cache[name] = built =
                    (BriefBuilder.Build(result.Document!, StandardTemplate.Template), result.Document!);
            }
        }
        using var pdf = PdfDocument.Open(built.Item1.Pdf);
        var pages = pdf.GetPages().Select(p => string.Join(" ", p.GetWords().Select(w => w.Text))).ToArray();
        return (built.Item1, built.Item2, JsonDocument.Parse(built.Item1.ResultsJson).RootElement.Clone(), pages);
    }

    [Theory]
    [MemberData(nameof(Scenarios))]
    public void Every_stress_brief_passes_the_PDF_UA_machine_checks(string name)
    {
        var findings = PdfUa.PdfUaChecker.Check(Build(name).Brief.Pdf);
        Assert.True(findings.Count == 0, string.Join("\n", findings));
    }

    [Fact]
    public void There_is_a_stress_scenario_for_every_branch_the_issue_names() =>
        Assert.True(Directory.GetFiles(Path.Combine(Demo.Root, "tests", "stress"), "*.yaml").Length >= 12);

    private static readonly Regex Rising = new(
        @"\b(raise|raises|rise|rises|increase|increases|higher|above)\b[^.;:()]{0,50}?(−\d[\d.,]*%)");
    private static readonly Regex Falling = new(
        @"\b(lower|lowers|fall|falls|decrease|decreases|below|dip)\b[^.;:()]{0,50}?(\+\d[\d.,]*%)");

    [Theory]
    [MemberData(nameof(Scenarios))]
    public void No_word_of_increase_stands_beside_a_fall_or_the_reverse(string name)
    {
        var (_, scenario, json, pages) = Build(name);
        string text = string.Join(" ", pages);
        Assert.DoesNotMatch(Rising, text);
        Assert.DoesNotMatch(Falling, text);
        // Each option's sentence on page 1 uses the verb its own change calls for.
        string page1 = pages[0];
        foreach (var o in json.GetProperty("options").EnumerateArray()
            .Where(o => !o.GetProperty("is_baseline").GetBoolean()))
        {
            double change = o.GetProperty("change_vs_baseline_pct").GetDouble();
            string expected = Math.Round(change, 1) > 0
                ? "would raise"
                : Math.Round(change, 1) < 0 ? "would lower" : "would leave";
            string who = o.GetProperty("id").GetString() == json.GetProperty("headline").GetProperty("option_id")
                .GetString()
                ? Regex.Escape(Squash(Wording(scenario.OptionName(o.GetProperty("id").GetString()!))))
                : Regex.Escape(Squash(o.GetProperty("label").GetString()!)) + ":";
            var m = Regex.Match(Squash(page1), who + @"would(raise|lower|leave)");
            Assert.True(m.Success, $"{name}: no sentence for {o.GetProperty("id")} on page 1:\n{page1}");
            Assert.Equal(Squash(expected), "would" + m.Groups[1].Value);
        }
        // The headline direction in the results data agrees with the lead sentence.
        var direction = json.GetProperty("headline").GetProperty("direction").GetString();
        Assert.Contains(
            direction switch { "rise" => "wouldraise", "fall" => "wouldlower", _ => "wouldleave" },
            Squash(page1));
    }

    private static string Wording(string name) => char.ToUpperInvariant(name[0]) + name[1..];

    [Theory]
    [MemberData(nameof(Scenarios))]
    public void An_optimum_at_the_edge_of_the_range_is_never_called_a_peak(string name)
    {
        var (brief, _, json, pages) = Build(name);
        if (!json.GetProperty("optimum").GetProperty("at_boundary").GetBoolean()) return;
        Assert.DoesNotContain("peak", string.Join(" ", pages), StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("peak", brief.Markdown, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void The_stress_set_reaches_the_corner_the_falling_and_the_several_maxima_branches()
    {
        Assert.True(Build("s02-corner-at-zero").Json.GetProperty("optimum").GetProperty("at_boundary").GetBoolean());
        Assert.Equal(
            0,
            Build("s02-corner-at-zero").Json.GetProperty("optimum").GetProperty("schooling_years").GetDouble());
        Assert.Equal(
            "fall",
            Build("s01-falling-output").Json.GetProperty("headline").GetProperty("direction").GetString());
        Assert.Equal("none", Build("s13-no-change").Json.GetProperty("headline").GetProperty("direction").GetString());
        Assert.True(
            Build("s10-several-maxima").Json.GetProperty("optimum").GetProperty("local_maxima").GetArrayLength() > 1);
        Assert.Contains(
            Build("s08-combined-option").Json.GetProperty("lever_decomposition").EnumerateArray(),
            l => l.GetProperty("is_combined").GetBoolean());
        Assert.Equal(
            JsonValueKind.Null,
            Build("s07-never-pays-back").Json.GetProperty("headline").GetProperty("break_even_calendar_year")
                .ValueKind);
        // At the longest feasible schooling nobody works, so output per person is zero there: the optimum can come
        // close to that edge (s03) but never sit on it.
        var near = Build("s03-optimum-near-maximum").Json.GetProperty("optimum");
        Assert.False(near.GetProperty("at_boundary").GetBoolean());
        Assert.True(
            near.GetProperty("feasible_max_schooling").GetDouble()
            - near.GetProperty("schooling_years").GetDouble() < 2);
    }

    [Theory]
    [MemberData(nameof(Scenarios))]
    public void A_draft_carries_a_marker_on_every_page_and_a_final_brief_none(string name)
    {
        var (_, scenario, _, pages) = Build(name);
        foreach (var page in pages)
            Assert.Equal(scenario.Brief.Status != "final", page.Contains("DRAFT", StringComparison.Ordinal));
    }

    /// <summary>
    /// Numbers the template writes itself ("In 90% of the model runs", "less than 0.05%"), not results.
    /// </summary>
    private static readonly string[] Constants = { "90%", "0.05%" };

    [Theory]
    [MemberData(nameof(Scenarios))]
    public void Every_number_in_the_key_findings_is_a_page_one_fact_of_the_results_data(string name)
    {
        var (_, scenario, json, pages) = Build(name);
        string page1 = pages[0];
        int start = page1.IndexOf("Key findings", StringComparison.Ordinal), end = page1.IndexOf(
            "Figure 1.",
            StringComparison.Ordinal);
        Assert.True(start >= 0 && end > start, $"{name}: key findings box or Figure 1 not found on page 1:\n{page1}");
        string box = page1[start..end];
        // Names of options and appraisal rules are the scenario's own words, not results.
        var names = scenario.Inputs.Options
            .SelectMany(o => new[] { o.Label, scenario.OptionName(o.Id), Wording(scenario.OptionName(o.Id)) })
            .Concat(scenario.Analysis.Discounts.SelectMany(d => new[] { d.Label, scenario.RuleName(d.Id) }))
            .OrderByDescending(n => n.Length);
        foreach (var n in names) box = box.Replace(n, " ");
        var facts = PageOneFacts(json);
        var numbers = Regex.Matches(box, @"[+−-]?\d[\d,]*(\.\d+)?%?").Select(m => m.Value).ToList();
        Assert.NotEmpty(numbers);
        foreach (var token in numbers)
        {
            if (Constants.Contains(token)) continue;
            string digits = token.TrimStart('+', '−', '-').TrimEnd('%').Replace(",", "");
            int decimals = digits.Contains('.') ? digits.Length - digits.IndexOf('.') - 1 : 0;
            double shown = double.Parse(digits, CultureInfo.InvariantCulture);
            Assert.True(
                facts.Any(f =>
                    Math.Abs(Math.Abs(Math.Round(f, decimals, MidpointRounding.AwayFromZero)) - shown) < 1e-9
                    || Math.Abs(Math.Abs(Math.Round(f, decimals)) - shown) < 1e-9),
                $"{name}: '{token}' on page 1 is not a page-1 fact of the results data. Box:\n{box}");
        }
    }

    /// <summary>
    /// The results data page 1 may quote: the headline block, each option's change and schooling, and the lever split.
    /// </summary>
    private static List<double> PageOneFacts(JsonElement json)
    {
        var facts = new List<double>();
        void Collect(JsonElement e)
        {
            switch (e.ValueKind)
            {
                case JsonValueKind.Number: facts.Add(e.GetDouble()); break;
                case JsonValueKind.Object: foreach (var p in e.EnumerateObject()) Collect(p.Value); break;
                case JsonValueKind.Array: foreach (var i in e.EnumerateArray()) Collect(i); break;
            }
        }
        Collect(json.GetProperty("headline"));
        if (json.GetProperty("headline").GetProperty("probability_gain") is { ValueKind: JsonValueKind.Number } p)
            facts.Add(100 * p.GetDouble());
        Collect(json.GetProperty("lever_decomposition"));
        foreach (var o in json.GetProperty("options").EnumerateArray())
        {
            facts.Add(o.GetProperty("change_vs_baseline_pct").GetDouble());
            facts.Add(o.GetProperty("schooling_years").GetDouble());
        }
        return facts;
    }

    private static string Squash(string s) => Regex.Replace(s, @"\s+", "");
}
