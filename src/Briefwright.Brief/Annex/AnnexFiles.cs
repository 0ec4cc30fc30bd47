using System.Text;
using Briefwright.Charts;

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
                solved.Scenario.Assumptions.Select(a => (IReadOnlyList<object?>)new object?[] { a.Path, a.Label, a.Value, a.Text, a.Unit.ToString().ToLowerInvariant(), a.Source, a.Note }))),
            new("options.csv", Csv.Write(new[] { "id", "label", "is_baseline", "schooling_years", "worker_share", "human_capital_per_worker", "output_per_person", "change_vs_baseline_pct" },
                solved.BalancedGrowth.Options.Select(o => (IReadOnlyList<object?>)new object?[] { o.Id, o.Label, o.IsBaseline, o.SchoolingYears, o.WorkerShare, o.HumanCapitalPerWorker, o.OutputPerPerson, o.ChangeVsBaselinePct }))),
        };
        var a = solved.Analysis;
        files.Add(new("reform-path.csv", Csv.Write(new[] { "year", "option_id", "gain" },
            a.Reform.Options.SelectMany(o => o.Path.Gain.Select((g, t) => (IReadOnlyList<object?>)new object?[] { a.Reform.ReformYear + t, o.OptionId, g })))));
        files.Add(new("present-values.csv", Csv.Write(new[] { "option_id", "schedule_id", "schedule_label", "to_horizon", "tail", "total", "break_even_year" },
            a.Reform.Options.SelectMany(o => o.PresentValues.Select(p => (IReadOnlyList<object?>)new object?[] { o.OptionId, p.ScheduleId, p.ScheduleLabel, p.ToHorizon, p.Tail, p.Total, a.Reform.ReformYear + p.BreakEvenYear })))));
        if (a.Tornado.Count > 0)
            files.Add(new("sensitivity.csv", Csv.Write(new[] { "parameter", "low", "high", "option_id", "change_at_low_pct", "change_at_high_pct", "optimum_at_low", "optimum_at_high" },
                a.Tornado.SelectMany(t => t.AtLow.OptionIds.Select((id, k) => (IReadOnlyList<object?>)new object?[] { t.Parameter, t.Low, t.High, id, t.AtLow.LongRunChangePct[k], t.AtHigh.LongRunChangePct[k], t.AtLow.OptimumYears, t.AtHigh.OptimumYears })))));
        if (a.MonteCarlo is { } mc)
            files.Add(new("montecarlo.csv", Csv.Write(new[] { "result", "option_id", "p5", "p25", "p50", "p75", "p95", "mean", "probability_positive" },
                mc.Options.SelectMany(o => new[]
                {
                    (IReadOnlyList<object?>)new object?[] { "long_run_change_pct", o.OptionId, o.LongRunChangePct.P5, o.LongRunChangePct.P25, o.LongRunChangePct.P50, o.LongRunChangePct.P75, o.LongRunChangePct.P95, o.LongRunChangePct.Mean, o.ProbabilityGain },
                    new object?[] { "present_value", o.OptionId, o.PresentValue.P5, o.PresentValue.P25, o.PresentValue.P50, o.PresentValue.P75, o.PresentValue.P95, o.PresentValue.Mean, o.ProbabilityPositivePv },
                }).Append(new object?[] { "optimum_schooling_years", "", mc.OptimumYears.P5, mc.OptimumYears.P25, mc.OptimumYears.P50, mc.OptimumYears.P75, mc.OptimumYears.P95, mc.OptimumYears.Mean, null }))));
        foreach (var c in charts)
        {
            if (c.Svg is not null) files.Add(new($"fig-{c.Id}.svg", Encoding.UTF8.GetBytes(c.Svg)));
            if (c.Png is not null) files.Add(new($"fig-{c.Id}.png", c.Png));
        }
        return files;
    }
}
