using Briefwright.Charts;
using Briefwright.Templating;

using static Briefwright.Brief.ChartSet.ChartTexts;

namespace Briefwright.Brief.ChartSet;

/// <summary>Tornado: the headline option's long-run change with each assumption at the ends of its range.</summary>
public sealed class TornadoFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var a = c.Solved.Analysis;
        if (a.Tornado.Count == 0) yield break;
        string headline = c.Solved.Scenario.Inputs.Options.First(o => o.Id == a.HeadlineOptionId).Label;
        var h = c.Solved.Outcomes.Headline;
        double central = h.BalancedGrowth.ChangeVsBaselinePct;
        yield return new ChartSpec("tornado", AnalysisCharts.Tornado(h.Swings, central, headline),
            T("chart.tornado.caption", headline),
            T("chart.tornado.alt", ParameterLabel(a.Tornado[0].Parameter, a.Tornado[0].Label),
                TemplateFunctions.Change(h.Swings[0].AtLowPct), TemplateFunctions.Change(h.Swings[0].AtHighPct),
                TemplateFunctions.Change(central)),
            c.Source);
    }
}
