using Briefwright.Model.Uncertainty;

namespace Briefwright.Scenario.Tests;

public class AnalysisBinderTests
{
    private static LoadResult Load(string extra) => MemoryReader.Load(MemoryReader.Valid + "\n" + extra);

    [Fact]
    public void Defaults_run_the_reform_from_the_year_after_the_brief_with_the_published_discount_rates()
    {
        var r = Load("");
        Assert.True(r.Ok, string.Join("\n", r.Problems));
        var a = r.Document!.Analysis;
        Assert.Equal(2027, a.Reform.Year);
        Assert.Equal("more", a.HeadlineOptionId);
        Assert.Equal(new[] { "green-book", "omb-3", "omb-7" }, a.Discounts.Select(d => d.Id));
        Assert.Null(a.MonteCarlo);
        // Present values are valued at the brief's date unless the scenario names another year, and the brief says so.
        Assert.Equal(2026, a.Reform.ValuedAt);
        Assert.Equal(1, a.Reform.ValuationOffset);
        var row = r.Document.Assumptions.Single(x => x.Path == "appraisal.valuation_year");
        Assert.Equal((2026.0, "the brief's date"), (row.Value, row.Source));
    }

    [Fact]
    public void A_valuation_year_may_be_set_and_the_sobol_samples_default_to_the_measured_size()
    {
        var r = Load("reform:\n  year: 2035\nappraisal:\n  valuation_year: 2030\nuncertainty:\n  seed: 1\n" +
            "  parameters:\n    saving_rate: { distribution: uniform, low: 10%, high: 30% }\n");
        Assert.True(r.Ok, string.Join("\n", r.Problems));
        Assert.Equal((2030, 5), (r.Document!.Analysis.Reform.ValuedAt, r.Document.Analysis.Reform.ValuationOffset));
        Assert.Equal(2560, r.Document.Analysis.MonteCarlo!.SobolSamples);
    }

    [Fact]
    public void A_percentage_is_the_double_nearest_its_decimal_value()
    {
        // 0.9/100.0 is 0.009000000000000001 in binary floating point; the scenario said 0.9%, which is 0.009.
        var r = MemoryReader.Load(MemoryReader.Valid
            .Replace("population_growth: 1%", "population_growth: 0.9%")
            .Replace("technology_growth: 2%", "technology_growth: 1.1%"));
        Assert.True(r.Ok, string.Join("\n", r.Problems));
        Assert.Equal(0.009, r.Document!.Inputs.Demography.GrowthRate);
        Assert.Equal(0.011, r.Document.Inputs.Production.TechnologyGrowth);
        Assert.Equal("0.009", r.Document.Assumptions.Single(x => x.Path == "demography.population_growth").Value!.Value
            .ToString("R", System.Globalization.CultureInfo.InvariantCulture));
    }

    [Fact]
    public void Reads_ranges_grids_distributions_and_own_discount_rates()
    {
        var r = Load("""
            appraisal:
              discount_rates:
                - omb_7
                - { id: own, label: Own rule, schedule: [ { from_year: 1, rate: 4% }, { from_year: 41, rate: 3% } ] }
            sensitivity:
              ranges:
                saving_rate: [18%, 26%]
              grids:
                - { x: population_growth, x_range: [-1%, 2%], y: return_scale, y_range: [0.8, 1.2], steps: 5 }
            uncertainty:
              draws: 500
              seed: 7
              parameters:
                saving_rate: { distribution: triangular, low: 15%, mode: 20%, high: 25% }
                return_scale: { distribution: lognormal, median: 1, sigma_log: 0.1 }
            """);
        Assert.True(r.Ok, string.Join("\n", r.Problems));
        var a = r.Document!.Analysis;
        Assert.Equal(0.03, a.Discounts[1].RateInYear(41), 12);
        Assert.Equal(new SensitivityRange("saving_rate", 0.18, 0.26), a.Ranges.Single());
        Assert.Equal(-0.01, a.Grids.Single().XLow, 12);
        Assert.Equal(new TriangularDistribution(0.15, 0.2, 0.25), a.MonteCarlo!.Parameters[0].Distribution);
        Assert.Equal((500, 7UL), (a.MonteCarlo.Draws, a.MonteCarlo.Seed));
    }

    [Theory]
    [InlineData("sensitivity:\n  ranges:\n    saving_rat: [18%, 26%]\n",
        "s.yaml:27:5: sensitivity.ranges.saving_rat: unknown parameter (did you mean 'saving_rate'?). " +
        "Got 'saving_rat'.")]
    [InlineData("sensitivity:\n  ranges:\n    saving_rate: [26%, 18%]\n",
        "s.yaml:27:24: sensitivity.ranges.saving_rate[1]: the high end must be above the low end (0.26). Got '18%'.")]
    [InlineData("reform:\n  headline_option: base\n",
        "s.yaml:26:20: reform.headline_option: must name an option other than the baseline (more). Got 'base'.")]
    [InlineData("appraisal:\n  discount_rates: [green_bok]\n",
        "s.yaml:26:20: appraisal.discount_rates[0]: must be one of green_book, omb_3, omb_7 or a mapping with id, " +
        "label and rate or schedule (did you mean 'green_book'?). Got 'green_bok'.")]
    [InlineData("uncertainty:\n  seed: 1\n  parameters:\n" +
        "    saving_rate: { distribution: gaussian, mean: 20%, sd: 1% }\n",
        "s.yaml:28:34: uncertainty.parameters.saving_rate.distribution: must be one of normal, truncated_normal, " +
        "uniform, triangular, lognormal. Got 'gaussian'.")]
    [InlineData("appraisal:\n  valuation_year: 2030\n",
        "s.yaml:26:19: appraisal.valuation_year: must not be after the reform year (2027). Got '2030'.")]
    [InlineData("reform:\n  year: 2020\n",
        "s.yaml:26:9: reform.year: must not be before the valuation year (2026, the brief's year); set " +
        "appraisal.valuation_year to value an earlier reform. Got '2020'.")]
    [InlineData("appraisal:\n  valuation_year: 2026.5\n",
        "s.yaml:26:19: appraisal.valuation_year: must be a whole number. Got '2026.5'.")]
    [InlineData("uncertainty:\n  parameters:\n    saving_rate: { distribution: uniform, low: 10%, high: 30% }\n",
        "s.yaml:26:3: uncertainty.seed: required field is missing.")]
    public void Problems_are_positioned(string extra, string expected)
    {
        var r = Load(extra);
        Assert.Null(r.Document);
        Assert.Equal(expected, r.Problems[0].Message);
    }
}
