using Briefwright.Scenario.Binding;
using Briefwright.TestSupport;

namespace Briefwright.Scenario.Tests;

/// <summary>The field catalogue against the page that documents it and the binder that applies it.</summary>
public class FieldCatalogueTests
{
    private const string Begin = "<!-- field-reference:begin -->\n", End = "<!-- field-reference:end -->";

    [Fact]
    public void The_field_reference_in_the_scenario_format_page_is_the_catalogue()
    {
        string path = Path.Combine(RepositoryRoot.Path, "docs", "scenario-format.md");
        string page = File.ReadAllText(path);
        int from = page.IndexOf(Begin, StringComparison.Ordinal) + Begin.Length, to = page.IndexOf(
            End,
            StringComparison.Ordinal);
        Assert.True(from >= Begin.Length && to >= from, "the page has no field-reference markers");
        string expected = ScenarioFields.ReferenceTable();
        if (Environment.GetEnvironmentVariable("BRIEFWRIGHT_UPDATE_DOCS") == "1")
            File.WriteAllText(path, page[..from] + expected + page[to..]);
        else
            Assert.Equal(expected, page[from..to]);
    }

    [Fact]
    public void Every_mapping_lists_each_key_once_per_variant_and_every_path_has_its_parents()
    {
        var paths = ScenarioFields.All.Select(f => f.Path).ToHashSet();
        foreach (var f in ScenarioFields.All)
        {
            if (f.Parent.Length > 0) Assert.Contains(f.Parent, paths);
            if (f.Kind is FieldKind.List) Assert.Contains(f.Path + "[]", paths);
            if (f.Kind is FieldKind.ParameterMap) Assert.Contains(f.Path + ".*", paths);
            if (f.Kind is FieldKind.Variants)
            {
                var selector = ScenarioFields.Get(f.Path + "." + f.Selector);
                foreach (string v in selector.Choices)
                {
                    var keys = ScenarioFields.Children(f.Path, v).Select(c => c.Key).ToList();
                    Assert.Equal(keys.Distinct().Count(), keys.Count);
                }
                // Every field of the mapping belongs to a variant its selector offers.
                Assert.All(
                    ScenarioFields.Children(f.Path),
                    c => Assert.All(c.Variants, v => Assert.Contains(v, selector.Choices)));
            }
        }
        Assert.Equal(ScenarioBinder.TopLevelKeys, ScenarioFields.Keys(""));
    }

    /// <summary>
    /// Each number field of the national demo's sections at each end of its interval and just past it: the binder
    /// refuses exactly the values the catalogue's bounds exclude, with the catalogue's rule text. Cross-field rules
    /// (retirement within the survival curve, n + g + δ) are not in play at the ends tried here, or are named.
    /// </summary>
    [Theory]
    [InlineData("demography.population_growth", "demography:\n  population_growth: {0}")]
    [InlineData("demography.school_entry_age", "demography:\n  school_entry_age: {0}")]
    [InlineData("demography.participation", "demography:\n  participation: {0}")]
    [InlineData("production.saving_rate", "production:\n  saving_rate: {0}")]
    [InlineData("production.capital_share", "production:\n  capital_share: {0}")]
    [InlineData("production.technology_growth", "production:\n  technology_growth: {0}")]
    [InlineData("brief.edition", "brief:\n  edition: {0}")]
    [InlineData("reform.phase_in_cohorts", "reform:\n  phase_in_cohorts: {0}")]
    [InlineData("reform.horizon_years", "reform:\n  horizon_years: {0}")]
    public void The_binder_refuses_exactly_what_the_catalogue_bounds_exclude(string path, string yaml)
    {
        var f = ScenarioFields.Get(path);
        double step = Math.Max(Math.Abs(f.Bounds.Max - f.Bounds.Min) * 1e-3, 1e-4);
        if (f.Whole) step = 1;
        foreach (double v in new[] { f.Bounds.Min, f.Bounds.Max, f.Bounds.Min - step, f.Bounds.Max + step })
        {
            string text = string.Format(
                System.Globalization.CultureInfo.InvariantCulture,
                yaml,
                v.ToString("R", System.Globalization.CultureInfo.InvariantCulture));
            var r = MemoryReader.Load("extends: base.yaml\n" + text, ("base.yaml", MemoryReader.Valid));
            var own = r.Problems.Where(p => p.Message.Contains(" " + path + ": must be ", StringComparison.Ordinal))
                .ToList();
            if (f.Bounds.Contains(v)) Assert.Empty(own);
            else Assert.Contains(own, p => p.Message.Contains(f.Bounds.Rule(false), StringComparison.Ordinal));
        }
    }
}
