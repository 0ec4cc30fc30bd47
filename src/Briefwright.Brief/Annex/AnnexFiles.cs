using System.Text;
using Briefwright.Charts;
using Briefwright.Model.Uncertainty;

namespace Briefwright.Brief.Annex;

/// <summary>A file written beside the brief, named <c>&lt;stem&gt;.&lt;Suffix&gt;</c>.</summary>
public sealed record AnnexFile(string Suffix, byte[] Bytes);

/// <summary>The data annex: CSV tables and each chart as SVG and PNG. File names are stable and documented.</summary>
public static class AnnexFiles
{
    public static IReadOnlyList<AnnexFile> Build(SolvedScenario solved, IReadOnlyList<RenderedChart> charts)
    {
        var files = new List<AnnexFile>
        {
            new("assumptions.csv", Csv.Write(new[] { "path", "label", "value", "text", "unit", "source", "note" },
                solved.Scenario.Assumptions.Select(a => (IReadOnlyList<object?>)new object?[] { a.Path, a.Label,
                    a.Value, a.Text, a.Unit.ToString().ToLowerInvariant(), a.Source, a.Note }))),
            new("options.csv", Csv.Write(new[] { "id", "label", "is_baseline", "schooling_years",
                "worker_share_fraction", "human_capital_per_worker_index", "output_per_person_index",
                "change_vs_baseline_pct" },
                solved.BalancedGrowth.Options.Select(o => (IReadOnlyList<object?>)new object?[] { o.Id, o.Label,
                    o.IsBaseline, o.SchoolingYears, o.WorkerShare, o.HumanCapitalPerWorker, o.OutputPerPerson,
                    o.ChangeVsBaselinePct }))),
        };
        var a = solved.Analysis;
        files.Add(new("reform-path.csv", Csv.Write(new[] { "calendar_year", "years_after_reform", "option_id",
            "gain_fraction" },
            a.Reform.Options.SelectMany(o => o.Path.Gain.Select(
                (g, t) => (IReadOnlyList<object?>)new object?[] { a.Reform.ReformYear + t, t, o.OptionId, g })))));
        files.Add(new("present-values.csv", Csv.Write(new[] { "option_id", "schedule_id", "schedule_label",
            "valuation_year", "discount_factor_to_reform", "to_horizon_years_of_output", "tail_years_of_output",
            "total_years_of_output", "break_even_calendar_year", "break_even_years_after_reform" },
            a.Reform.Options.SelectMany(o => o.PresentValues.Select(p => (IReadOnlyList<object?>)new object?[] {
                o.OptionId, p.ScheduleId, p.ScheduleLabel, p.ValuationYear, p.DiscountFactorToReform, p.ToHorizon,
                p.Tail, p.Total, p.BreakEvenCalendarYear, p.BreakEvenYear })))));
        if (a.Tornado.Count > 0)
            files.Add(new("sensitivity.csv", Csv.Write(new[] { "parameter", "parameter_unit", "low", "high",
                "option_id", "change_at_low_pct", "change_at_high_pct", "optimum_at_low_years",
                "optimum_at_high_years" },
                a.Tornado.SelectMany(t => t.AtLow.OptionIds.Select((id, k) => (IReadOnlyList<object?>)new object?[] {
                    t.Parameter, ParameterUnit(t.Parameter), t.Low, t.High, id, t.AtLow.LongRunChangePct[k],
                    t.AtHigh.LongRunChangePct[k], t.AtLow.OptimumYears, t.AtHigh.OptimumYears })))));
        if (a.MonteCarlo is { } mc)
            files.Add(new("montecarlo.csv", Csv.Write(MonteCarloHeader,
                mc.Options.SelectMany(o => new[]
                {
                    MonteCarloRow("long_run_change", "pct", o.OptionId, o.LongRunChangePct, o.ProbabilityGain),
                    MonteCarloRow("present_value_to_horizon", "years_of_output", o.OptionId, o.PresentValue,
                        o.ProbabilityPositivePv),
                }).Append(MonteCarloRow("optimum_schooling", "years", "", mc.OptimumYears, null)))));
        if (a.Sobol is { } sobol)
            files.Add(new("sobol.csv", Csv.Write(new[] { "output", "parameter", "first_order_share",
                "first_order_low_share", "first_order_high_share", "total_share", "total_low_share", "total_high_share",
                "confidence_level_fraction", "base_samples", "resamples" },
                sobol.Outputs.SelectMany((output, k) => sobol.Indices[k].Inputs.Select((name, i) =>
                {
                    var x = sobol.Indices[k];
                    return (IReadOnlyList<object?>)new object?[] { output, name, x.FirstOrder[i], x.FirstOrderLow[i],
                        x.FirstOrderHigh[i], x.Total[i], x.TotalLow[i], x.TotalHigh[i], x.Level, x.Samples,
                        x.Resamples };
                })))));
        foreach (var c in charts)
        {
            if (c.Svg is not null) files.Add(new($"fig-{c.Id}.svg", Encoding.UTF8.GetBytes(c.Svg)));
            if (c.Png is not null) files.Add(new($"fig-{c.Id}.png", c.Png));
        }
        return files;
    }

    private static string ParameterUnit(string parameter)
        => Parameters.Find(parameter)?.IsRate == true ? "fraction" : "number";

    private static readonly string[] MonteCarloHeader =
    {
        "result", "unit", "option_id", "p5", "p25", "p50", "p75", "p95", "mean", "mean_standard_error",
        "p5_low", "p5_high", "p25_low", "p25_high", "p50_low", "p50_high", "p75_low", "p75_high", "p95_low",
        "p95_high", "probability_positive_fraction", "probability_low_fraction", "probability_high_fraction",
        "positive_draws", "draws",
    };

    /// <summary>
    /// One result's percentiles in <paramref name="unit"/>, their 95% intervals, and the probability that it is
    /// positive (fractions) with its 95% Wilson interval.
    /// </summary>
    private static IReadOnlyList<object?> MonteCarloRow(string result, string unit, string optionId,
        PercentileSummary s, Probability? p) => new object?[]
    {
        result, unit, optionId, s.P5, s.P25, s.P50, s.P75, s.P95, s.Mean, s.MeanStandardError,
        s.P5Interval.Low, s.P5Interval.High, s.P25Interval.Low, s.P25Interval.High,
        s.P50Interval.Low, s.P50Interval.High,
        s.P75Interval.Low, s.P75Interval.High, s.P95Interval.Low, s.P95Interval.High,
        p?.Estimate, p?.Low, p?.High, p?.Count, p?.Draws,
    };
}
