using Briefwright.Model.Core;
using Briefwright.Model.Inputs;

namespace Briefwright.Scenario.Tests;

/// <summary>
/// check rejects what the model cannot solve: each case here once passed validation and then crashed the solver or
/// printed a non-finite or 110-digit number. Each bound is also shown to be enough: the scenario at the bound solves
/// to finite, positive numbers.
/// </summary>
public class ModelBoundsTests
{
    private static string First(LoadResult r) => r.Problems.Count > 0 ? r.Problems[0].Message : "no problem";

    private static LoadResult Load(string find, string replace, params (string, string)[] more) =>
        MemoryReader.Load(MemoryReader.With(find, replace), more);

    [Theory]
    [InlineData(
        "saving_rate: 0.2",
        "saving_rate: 1e-300",
        "s.yaml:14:16: production.saving_rate: must be at least 0.001 and less than 1. Got '1e-300'.")]
    [InlineData(
        "capital_share: 0.33",
        "capital_share: 0.9999999",
        "s.yaml:15:18: production.capital_share: must be greater than 0 and less than 0.9. Got '0.9999999'.")]
    public void Bounds_that_keep_results_finite_are_checked(string find, string replace, string expected)
    {
        Assert.Equal(expected, First(Load(find, replace)));
    }

    [Fact]
    public void Population_growth_technology_growth_and_depreciation_must_add_up_to_at_least_a_tenth_of_a_percent()
    {
        var r = MemoryReader.Load(MemoryReader.Valid.Replace("population_growth: 1%", "population_growth: -5%").Replace(
            "technology_growth: 2%",
            "technology_growth: 5%").Replace("depreciation: 3%", "depreciation: 1e-300"));
        Assert.Equal("s.yaml:16:17: production.depreciation: population growth + technology growth + depreciation " +
            "must be at least 0.1%, or the model's results are not finite (-5% + 5% + 0% = 0%). Got 0%.", First(r));
    }

    [Fact]
    public void At_the_bounds_the_model_gives_finite_positive_results()
    {
        // Worst corner of the documented bounds: s = 0.1%, α just below 0.9, n + g + δ = 0.1%, and the other way round.
        foreach (var (s, a, n) in new[] {
            ("0.1%", "0.8999", "-9%"),
            ("99.9%", "0.8999", "-9%"),
            ("0.1%", "0.8999", "10%") })
        {
            string text = MemoryReader.Valid.Replace("saving_rate: 0.2", $"saving_rate: {s}")
                .Replace("capital_share: 0.33", $"capital_share: {a}")
                .Replace("population_growth: 1%", $"population_growth: {n}")
                .Replace(
                    "depreciation: 3%",
                    n == "-9%" ? "depreciation: 7.2%" : "depreciation: 3%");
            var r = MemoryReader.Load(text);
            Assert.True(r.Ok, First(r));
            var solved = BalancedGrowth.Solve(r.Document!.Inputs, gridPoints: 40);
            Assert.All(solved.Options, o => Assert.True(
                double.IsFinite(o.OutputPerPerson) && o.OutputPerPerson > 0 && double.IsFinite(o.ChangeVsBaselinePct),
                $"{s} {a} {n}: {o.OutputPerPerson}"));
        }
    }

    [Fact]
    public void A_life_table_where_everyone_dies_at_age_one_leaves_no_workers_and_is_refused()
    {
        var r = Load(
            "form: rectangular\n    max_age: 80",
            "form: life_table\n    file: t.csv",
            ("t.csv", "age,survivors\n0,1000\n1,0\n100,0\n"));
        Assert.Equal("s.yaml:12:11: demography.survival: the survival curve must leave workers: almost nobody is " +
            "alive at 17, when schooling ends under options[0] (base); at least 0.000001 of a cohort must be. Got " +
            "0.", First(r));
    }

    [Fact]
    public void A_default_reform_year_outside_the_model_years_is_reported_at_the_brief_date()
    {
        var r = Load("date: 2026-11-30", "date: 2300-06-30");
        Assert.StartsWith(
            "s.yaml:5:9: brief.date: the reform starts the year after the brief's date unless reform.year is given",
            First(r));
    }

    [Theory]
    [InlineData(
        "school_entry_age: [0, 64]",
        "sensitivity.ranges.school_entry_age[1].high: must be at least 0 and at most 30. Got '64'.")]
    [InlineData(
        "school_entry_age: [0, 30]",
        "with school_entry_age at 30 the scenario breaks a model rule (schooling of option base reaches retirement)")]
    [InlineData("depreciation: [0, 99%]", "no problem")]
    [InlineData(
        "depreciation: [0, 100%]",
        "sensitivity.ranges.depreciation[1].high: must be at least 0% and less than 100%. Got '100%'.")]
    [InlineData(
        "population_growth: [-10%, 1%]",
        "with population_growth at -10% the scenario breaks a model rule (n + g + δ below 0.1%)")]
    [InlineData("capital_share: [0.3, 0.95]", "must be greater than 0 and less than 0.9. Got '0.95'.")]
    public void Sensitivity_ranges_follow_the_same_rules_as_the_values(string range, string expected)
    {
        var text = MemoryReader.With("retirement_age: 65", "retirement_age: 40")
            + $"\nsensitivity:\n  ranges:\n    {range}\n";
        if (!range.StartsWith("school")) text = MemoryReader.Valid + $"\nsensitivity:\n  ranges:\n    {range}\n";
        var r = MemoryReader.Load(text);
        Assert.Contains(expected, First(r));
    }

    [Fact]
    public void A_grid_whose_corner_breaks_a_rule_is_reported()
    {
        var text = MemoryReader.Valid + "\nsensitivity:\n  grids:\n    - { x: population_growth, x_range: [-2%, 1%], " +
            "y: technology_growth, y_range: [-2%, 2%] }\n";
        string first = First(MemoryReader.Load(text));
        Assert.True(first.Contains("with population_growth at -2% and technology_growth at -2% the scenario breaks a " +
            "model rule (n + g + δ below 0.1%)"), first);
    }

    [Theory]
    [InlineData(
        "saving_rate: { distribution: normal, mean: 20%, sd: 1000 }",
        "uncertainty.parameters: the distributions break a model rule too often: ")]
    [InlineData(
        "saving_rate: { distribution: uniform, low: 0%, high: 30% }",
        "uncertainty.parameters.saving_rate.low: must be at least 0.1% and less than 100%. Got '0%'.")]
    [InlineData(
        "capital_share: { distribution: triangular, low: 0.2, mode: 0.3, high: 0.99 }",
        "uncertainty.parameters.capital_share.high: must be greater than 0 and less than 0.9. Got '0.99'.")]
    [InlineData("saving_rate: { distribution: normal, mean: 20%, sd: 5% }", "no problem")]
    public void Distributions_follow_the_same_rules_and_a_pilot_draw_catches_rejection(
        string parameter,
        string expected)
    {
        var r = MemoryReader.Load(
            MemoryReader.Valid + $"\nuncertainty:\n  seed: 1\n  draws: 1000\n  parameters:\n    {parameter}\n");
        Assert.Contains(expected, First(r));
    }

    [Fact]
    public void The_uncertainty_work_of_one_brief_is_bounded()
    {
        var r = MemoryReader.Load(MemoryReader.Valid + "\nreform:\n  horizon_years: 400\nuncertainty:\n  seed: 1\n" +
            "  draws: 200000\n  sobol_samples: 8192\n  parameters:\n    saving_rate: { distribution: uniform, low: " +
            "10%, high: 30% }\n");
        Assert.Contains("uncertainty: asks for 89,830,400 simulated years ((draws + sobol_samples × (parameters + " +
            "2)) × reform.horizon_years = (200000 + 8192 × 3) × 400); the limit for one brief is 10,000,000", First(r));
    }

    [Fact]
    public void Monte_Carlo_rejects_draws_that_break_the_new_bounds()
    {
        var r = MemoryReader.Load(MemoryReader.Valid);
        var inputs = r.Document!.Inputs;
        Assert.Null(Model.Uncertainty.Parameters.Violation(inputs));
        Assert.NotNull(Model.Uncertainty.Parameters
            .Violation(inputs with { Production = inputs.Production with { SavingRate = 1e-300 } }));
        Assert.NotNull(Model.Uncertainty.Parameters
            .Violation(inputs with { Production = inputs.Production with { CapitalShare = 0.95 } }));
        var dead = inputs with { Demography = inputs.Demography with { Survival = new TabulatedSurvival(
            new double[] { 0, 1, 100 },
            new double[] { 1, 0, 0 }) } };
        Assert.Contains("nobody survives", Model.Uncertainty.Parameters.Violation(dead));
    }
}
