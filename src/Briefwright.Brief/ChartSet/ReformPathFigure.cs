using Briefwright.Charts;
using Briefwright.Model.Uncertainty;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>Output per person after the reform relative to no reform, one line per option, with the headline's band.</summary>
public sealed class ReformPathFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var solved = c.Solved;
        var a = solved.Analysis;
        var labels = solved.Scenario.Inputs.Options.ToDictionary(o => o.Id, o => o.Label);
        var path = a.Reform.Options.First(o => o.OptionId == a.HeadlineOptionId).Path;
        yield return new ChartSpec("reform-path", AnalysisCharts.ReformPath(a.Reform, a.HeadlineOptionId, labels, a.MonteCarlo, styles: c.Styles),
            $"Output per person after the reform relative to no reform, {a.Reform.ReformYear}–{a.Reform.ReformYear + 80}",
            $"Line chart over years, one line per option. For {solved.Scenario.OptionName(a.HeadlineOptionId)}: {Wording.Arrival(HeadlineFacts.From(solved.BalancedGrowth, a), a.Reform.ReformYear)} Once the economy has adjusted the change is {TemplateFunctions.Change(100 * path.BalancedGrowthGain)}." + (a.MonteCarlo is null ? "" : " A shaded band shows the 5–95% range of the Monte Carlo draws."),
            c.Source);
    }
}
