using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;

namespace Briefwright.Brief.Tests;

/// <summary>The demo brief's results JSON and CSV annex follow the units rule of docs/results-json.md.</summary>
public class AnnexUnitsTests
{
    private const string Name = "auroria-national";

    private static JsonElement Analysis(JsonDocument doc) => doc.RootElement.GetProperty("analysis");

    private static IEnumerable<string> PropertyNames(JsonElement e) => e.ValueKind switch
    {
        JsonValueKind.Object => e.EnumerateObject().SelectMany(p => PropertyNames(p.Value).Prepend(p.Name)),
        JsonValueKind.Array => e.EnumerateArray().SelectMany(PropertyNames),
        _ => Enumerable.Empty<string>(),
    };

    [Fact]
    public void Present_values_are_valued_at_the_brief_s_year_and_break_even_is_named_by_its_unit()
    {
        using var doc = JsonDocument.Parse(Demo.Build(Name).ResultsJson);
        var reform = Analysis(doc).GetProperty("reform");
        Assert.Equal(2026, reform.GetProperty("valuation_year").GetInt32());
        Assert.Contains("2026", reform.GetProperty("price_base").GetString());
        int reformYear = reform.GetProperty("reform_year").GetInt32();
        foreach (var option in reform.GetProperty("options").EnumerateArray())
            foreach (var pv in option.GetProperty("present_values").EnumerateArray())
            {
                Assert.Equal(2026, pv.GetProperty("valuation_year").GetInt32());
                if (pv.GetProperty("break_even_years_after_reform").ValueKind == JsonValueKind.Number)
                    Assert.Equal(
                        reformYear + pv.GetProperty("break_even_years_after_reform").GetInt32(),
                        pv.GetProperty("break_even_calendar_year").GetInt32());
                // US OMB Circular A-4 (2003): 3% a year, two years from 2026 to the reform in 2028.
                if (pv.GetProperty("schedule_id").GetString() == "omb-3")
                    Assert.Equal(
                        Math.Pow(1.03, -(reformYear - 2026)),
                        pv.GetProperty("discount_factor_to_reform").GetDouble(),
                        12);
            }
        // Names whose meaning was ambiguous (offset in the JSON, calendar year in the CSV) are gone.
        var names = PropertyNames(doc.RootElement).ToHashSet();
        Assert.DoesNotContain("break_even_year", names);
        Assert.DoesNotContain("dip_year", names);
        Assert.DoesNotContain("first_positive_year", names);
        Assert.Contains("dip_calendar_year", names);
    }

    [Fact]
    public void Probabilities_and_Sobol_indices_carry_intervals_and_the_headline_intervals_are_within_five_hundredths()
    {
        using var doc = JsonDocument.Parse(Demo.Build(Name).ResultsJson);
        var a = Analysis(doc);
        foreach (var o in a.GetProperty("monte_carlo").GetProperty("options").EnumerateArray())
        {
            var p = o.GetProperty("probability_gain");
            double estimate = p.GetProperty("estimate").GetDouble();
            double low = p.GetProperty("low").GetDouble(), high = p.GetProperty("high").GetDouble();
            Assert.True(low <= estimate && estimate <= high && low < high, $"{low} ≤ {estimate} ≤ {high}");
            var change = o.GetProperty("long_run_change_pct");
            Assert.True(
                change.GetProperty("p5_interval").GetProperty("low").GetDouble()
                <= change.GetProperty("p5").GetDouble());
        }
        // The default base sample size was chosen so that the headline's 95% intervals are at most ±0.05
        // (docs/model.md).
        var headline = a.GetProperty("sobol").GetProperty("indices")[0];
        double[] Arr(string name) => headline.GetProperty(name).EnumerateArray().Select(x => x.GetDouble()).ToArray();
        var (first, firstLow, firstHigh) = (Arr("first_order"), Arr("first_order_low"), Arr("first_order_high"));
        var (total, totalLow, totalHigh) = (Arr("total"), Arr("total_low"), Arr("total_high"));
        for (int i = 0; i < first.Length; i++)
        {
            Assert.InRange(first[i], firstLow[i], firstHigh[i]);
            Assert.InRange(total[i], totalLow[i], totalHigh[i]);
            Assert.True(
                firstHigh[i] - firstLow[i] <= 0.1 && totalHigh[i] - totalLow[i] <= 0.1,
                $"input {i}: [{firstLow[i]}, {firstHigh[i]}], [{totalLow[i]}, {totalHigh[i]}]");
        }
    }

    private static readonly Regex UnitSuffix = new(
        "(_pct|_fraction|_share|_years|_year|_years_after_reform|_index|_years_of_output|_draws|^draws|^base_samples"
        + "|^resamples|^discount_factor_to_reform|^years_after_reform)$");

    [Fact]
    public void Every_numeric_CSV_column_says_its_unit_and_numbers_are_written_in_their_shortest_round_trip_form()
    {
        foreach (var file in Demo.Build(Name).Annex.Where(f => f.Suffix.EndsWith(".csv")))
        {
            var lines = Encoding.UTF8.GetString(file.Bytes).Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
            var header = lines[0].Split(',');
            var rows = lines.Skip(1).Select(l => Regex.Split(l, ",(?=(?:[^\"]*\"[^\"]*\")*[^\"]*$)")).ToList();
            bool unitColumn = header.Contains("unit") || header.Contains("parameter_unit");
            for (int c = 0; c < header.Length; c++)
            {
                var values = rows.Select(r => r[c]).Where(v => v.Length > 0).ToList();
                bool numeric = values.Count > 0
                    && values.All(v => double.TryParse(v, NumberStyles.Float, CultureInfo.InvariantCulture, out _));
                if (!numeric) continue;
                foreach (var v in values)
                    Assert.Equal(
                        v,
                        double.Parse(v, CultureInfo.InvariantCulture).ToString("R", CultureInfo.InvariantCulture));
                if (unitColumn && !UnitSuffix.IsMatch(header[c])) continue;
                Assert.True(
                    UnitSuffix.IsMatch(header[c]) || file.Suffix == "assumptions.csv",
                    $"{file.Suffix}: column '{header[c]}' does not say its unit");
            }
        }
    }

    [Fact]
    public void A_percentage_in_the_scenario_is_written_as_its_decimal_value()
    {
        // The demo's population growth is 0.9%: the annex says 0.009, not 0.009000000000000001.
        var csv = Encoding.UTF8.GetString(Demo.Build(Name).Annex.Single(f => f.Suffix == "assumptions.csv").Bytes);
        Assert.Contains("demography.population_growth,Population growth rate,0.009,", csv);
    }
}
