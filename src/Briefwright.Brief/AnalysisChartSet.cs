using System.Globalization;
using Briefwright.Charts;
using Briefwright.Model.Uncertainty;
using Briefwright.Templating;

namespace Briefwright.Brief;

/// <summary>Charts 3–6: the reform path (with the Monte Carlo band), the tornado, the heat map and the distribution.</summary>
public static class AnalysisChartSet
{
    private static string F(double v, string f = "0.0") => v.ToString(f, CultureInfo.InvariantCulture);

    /// <summary>Page 1's chart: the headline option's path over time with its Monte Carlo band, described from its facts.</summary>
    public static ChartSpec HeadlinePath(SolvedScenario solved, string source)
    {
        var a = solved.Analysis;
        var scenario = solved.Scenario;
        var facts = HeadlineFacts.From(solved.BalancedGrowth, a);
        string label = scenario.Inputs.Options.First(o => o.Id == a.HeadlineOptionId).Label;
        int years = Math.Min(HeadlinePathChart.Years, a.Reform.HorizonYears);
        return new ChartSpec("headline-path", HeadlinePathChart.Build(a.Reform, a.HeadlineOptionId, label, a.MonteCarlo),
            $"{label}: change in output per person against no reform, {a.Reform.ReformYear}–{a.Reform.ReformYear + years}" + (a.MonteCarlo is null ? "" : ", with the range of 90% of model runs"),
            $"Line chart over years. {Wording.Arrival(facts, a.Reform.ReformYear)}" + (a.MonteCarlo is null ? "" : " A shaded band shows where 90% of the model runs with uncertain assumptions lie."),
            source);
    }

    public static IEnumerable<ChartSpec> Specs(SolvedScenario solved, string source)
    {
        var a = solved.Analysis;
        var inputs = solved.Scenario.Inputs;
        var labels = inputs.Options.ToDictionary(o => o.Id, o => o.Label);
        string headline = labels[a.HeadlineOptionId];
        int k = a.Reform.Options.Select(o => o.OptionId).ToList().IndexOf(a.HeadlineOptionId);
        var path = a.Reform.Options[k].Path;
        double central = solved.BalancedGrowth.Options.First(o => o.Id == a.HeadlineOptionId).ChangeVsBaselinePct;

        yield return new ChartSpec("reform-path", AnalysisCharts.ReformPath(a.Reform, a.HeadlineOptionId, labels, a.MonteCarlo),
            $"Output per person after the reform relative to no reform, {a.Reform.ReformYear}–{a.Reform.ReformYear + 80}",
            $"Line chart over years, one line per option. For {solved.Scenario.OptionName(a.HeadlineOptionId)}: {Wording.Arrival(HeadlineFacts.From(solved.BalancedGrowth, a), a.Reform.ReformYear)} Once the economy has adjusted the change is {TemplateFunctions.Change(100 * path.BalancedGrowthGain)}." + (a.MonteCarlo is null ? "" : " A shaded band shows the 5–95% range of the Monte Carlo draws."),
            source);
        if (a.Tornado.Count > 0)
            yield return new ChartSpec("tornado", AnalysisCharts.Tornado(a.Tornado, k, central, headline),
                $"Sensitivity of the long-run change for {headline} to each assumption",
                $"Tornado chart: {a.Tornado[0].Label} moves the long-run change most, from {TemplateFunctions.Change(a.Tornado[0].AtLow.LongRunChangePct[k])} to {TemplateFunctions.Change(a.Tornado[0].AtHigh.LongRunChangePct[k])} across its range; the central value is {TemplateFunctions.Change(central)}.",
                source);
        foreach (var (grid, i) in a.Grids.Select((g, i) => (g, i)))
        {
            string what = grid.Spec.Output == "optimum" ? "Output-maximising schooling E* (years)" : $"Long-run change, {headline} (%)";
            string x = Parameters.Find(grid.Spec.X)!.Label, y = Parameters.Find(grid.Spec.Y)!.Label;
            var values = grid.Values.SelectMany(v => v).Where(v => v is not null).Select(v => v!.Value).ToList();
            yield return new ChartSpec(i == 0 ? "heatmap" : $"heatmap-{i + 1}", AnalysisCharts.Heatmap(grid, Axis(grid.Spec.X, x), Axis(grid.Spec.Y, y), what, Scale(grid.Spec.X), Scale(grid.Spec.Y)),
                $"{what} over {x.ToLowerInvariant()} and {y.ToLowerInvariant()}",
                $"Heat map: {what.ToLowerInvariant()} ranges from {F(values.Min())} to {F(values.Max())} over the grid" + (grid.Invalid > 0 ? $"; {grid.Invalid} cells break a model rule and are blank." : "."),
                source);
        }
        if (a.MonteCarlo is { } mc)
            yield return new ChartSpec("distribution", AnalysisCharts.Distribution(mc, k, headline),
                $"Distribution of the long-run change for {headline} over {mc.Draws:N0} Monte Carlo draws",
                $"Histogram: the long-run change lies between {TemplateFunctions.Change(mc.Options[k].LongRunChangePct.P5)} and {TemplateFunctions.Change(mc.Options[k].LongRunChangePct.P95)} in 90% of draws, median {TemplateFunctions.Change(mc.Options[k].LongRunChangePct.P50)}.",
                source);
    }

    private static string Axis(string parameter, string label) => Parameters.Find(parameter)!.IsRate ? label + " (%)" : label;

    private static double Scale(string parameter) => Parameters.Find(parameter)!.IsRate ? 100 : 1;


}
