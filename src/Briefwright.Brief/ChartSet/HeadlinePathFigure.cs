using Briefwright.Charts;
using Briefwright.Model.Uncertainty;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>
/// Page 1's chart: the headline option's path over time with its Monte Carlo band, described from its facts.
/// </summary>
public sealed class HeadlinePathFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var w = c.Texts;
        var a = c.Solved.Analysis;
        var scenario = c.Solved.Scenario;
        var headline = c.Solved.Outcomes.Headline;
        var facts = HeadlineFacts.From(headline, a.Reform);
        string label = scenario.Inputs.Options.First(o => o.Id == a.HeadlineOptionId).Label;
        int years = Math.Min(HeadlinePathChart.Years, a.Reform.HorizonYears);
        yield return new ChartSpec("headline-path",
            HeadlinePathChart.Build(c.Drawing, headline.Path, label, a.MonteCarlo, c.Styles[headline.Id]),
            w.T(a.MonteCarlo is null ? "chart.headline.caption" : "chart.headline.caption_band", label,
                a.Reform.ReformYear, a.Reform.ReformYear + years),
            w.T("chart.headline.alt", w.Wording.Arrival(facts, a.Reform.ReformYear))
                + (a.MonteCarlo is null ? "" : w.T("chart.headline.alt_band")),
            c.Source);
    }
}
