using System.Globalization;
using Briefwright.Charts;
using Briefwright.Model.Uncertainty;
using Briefwright.Templating;

namespace Briefwright.Brief;

/// <summary>Charts 3–6: the reform path (with the Monte Carlo band), the tornado, the heat map and the distribution.</summary>
public static class AnalysisChartSet
{
    private static string F(double v, string f = "0.0") => TemplateFunctions.Localise(v.ToString(f, CultureInfo.InvariantCulture));

    /// <summary>A text of the brief's language (templates/languages/*.texts), by key.</summary>
    private static string T(string key, params object?[] args) => BriefLanguage.Current.Format(key, args);

    /// <summary>Page 1's chart: the headline option's path over time with its Monte Carlo band, described from its facts.</summary>
    public static ChartSpec HeadlinePath(SolvedScenario solved, string source)
    {
        var a = solved.Analysis;
        var scenario = solved.Scenario;
        var facts = HeadlineFacts.From(solved.BalancedGrowth, a);
        string label = scenario.Inputs.Options.First(o => o.Id == a.HeadlineOptionId).Label;
        int years = Math.Min(HeadlinePathChart.Years, a.Reform.HorizonYears);
        return new ChartSpec("headline-path", HeadlinePathChart.Build(a.Reform, a.HeadlineOptionId, label, a.MonteCarlo),
            T(a.MonteCarlo is null ? "chart.headline.caption" : "chart.headline.caption_band", label, a.Reform.ReformYear, a.Reform.ReformYear + years),
            T("chart.headline.alt", Wording.Arrival(facts, a.Reform.ReformYear)) + (a.MonteCarlo is null ? "" : T("chart.headline.alt_band")),
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
            T("chart.reform.caption", a.Reform.ReformYear, a.Reform.ReformYear + 80),
            T("chart.reform.alt", solved.Scenario.OptionName(a.HeadlineOptionId), Wording.Arrival(HeadlineFacts.From(solved.BalancedGrowth, a), a.Reform.ReformYear), TemplateFunctions.Change(100 * path.BalancedGrowthGain)) + (a.MonteCarlo is null ? "" : T("chart.reform.alt_band")),
            source);
        if (a.Tornado.Count > 0)
            yield return new ChartSpec("tornado", AnalysisCharts.Tornado(a.Tornado, k, central, headline),
                T("chart.tornado.caption", headline),
                T("chart.tornado.alt", ParameterLabel(a.Tornado[0].Parameter, a.Tornado[0].Label), TemplateFunctions.Change(a.Tornado[0].AtLow.LongRunChangePct[k]), TemplateFunctions.Change(a.Tornado[0].AtHigh.LongRunChangePct[k]), TemplateFunctions.Change(central)),
                source);
        foreach (var (grid, i) in a.Grids.Select((g, i) => (g, i)))
        {
            string what = grid.Spec.Output == "optimum" ? T("chart.heatmap.optimum") : T("chart.heatmap.change", headline);
            string x = ParameterLabel(grid.Spec.X, Parameters.Find(grid.Spec.X)!.Label), y = ParameterLabel(grid.Spec.Y, Parameters.Find(grid.Spec.Y)!.Label);
            var values = grid.Values.SelectMany(v => v).Where(v => v is not null).Select(v => v!.Value).ToList();
            yield return new ChartSpec(i == 0 ? "heatmap" : $"heatmap-{i + 1}", AnalysisCharts.Heatmap(grid, Axis(grid.Spec.X, x), Axis(grid.Spec.Y, y), what, Scale(grid.Spec.X), Scale(grid.Spec.Y)),
                T("chart.heatmap.caption", what, InSentence(x), InSentence(y)),
                T(grid.Invalid > 0 ? "chart.heatmap.alt_blank" : "chart.heatmap.alt", InSentence(what), F(values.Min()), F(values.Max()), grid.Invalid),
                source);
        }
        if (a.MonteCarlo is { } mc)
            yield return new ChartSpec("distribution", AnalysisCharts.Distribution(mc, k, headline),
                T("chart.distribution.caption", headline, TemplateFunctions.Big(mc.Draws)),
                T("chart.distribution.alt", TemplateFunctions.Change(mc.Options[k].LongRunChangePct.P5), TemplateFunctions.Change(mc.Options[k].LongRunChangePct.P95), TemplateFunctions.Change(mc.Options[k].LongRunChangePct.P50)),
                source);
    }

    private static string Axis(string parameter, string label) => Parameters.Find(parameter)!.IsRate ? label + " (%)" : label;

    private static string ParameterLabel(string name, string fallback) =>
        BriefLanguage.Current.Texts.TryGetValue("parameter." + name, out var t) ? t.Text : fallback;

    private static string InSentence(string label) => BriefLanguage.Current.Get("list.lower_case") == "yes" ? label.ToLowerInvariant() : label;

    private static double Scale(string parameter) => Parameters.Find(parameter)!.IsRate ? 100 : 1;


}
