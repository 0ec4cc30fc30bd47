using Briefwright.Charts;
using Briefwright.Model.Uncertainty;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>
/// Output per person after the reform relative to no reform, one line per option, with the headline's band.
/// </summary>
public sealed class ReformPathFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var w = c.Texts;
        var solved = c.Solved;
        var a = solved.Analysis;
        var labels = solved.Scenario.Inputs.Options.ToDictionary(o => o.Id, o => o.Label);
        var headline = solved.Outcomes.Headline;
        var path = headline.Path;
        yield return new ChartSpec("reform-path", AnalysisCharts.ReformPath(c.Drawing, a.Reform, a.HeadlineOptionId,
            labels, a.MonteCarlo, styles: c.Styles),
            w.T("chart.reform.caption", a.Reform.ReformYear, a.Reform.ReformYear + 80),
            w.T("chart.reform.alt", solved.Scenario.OptionName(a.HeadlineOptionId),
                w.Wording.Arrival(HeadlineFacts.From(headline, a.Reform), a.Reform.ReformYear),
                w.Change(100 * path.BalancedGrowthGain))
                + (a.MonteCarlo is null ? "" : w.T("chart.reform.alt_band")),
            c.Source);
    }
}
