using Briefwright.Charts;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>Tornado: the headline option's long-run change with each assumption at the ends of its range.</summary>
public sealed class TornadoFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var w = c.Texts;
        var a = c.Solved.Analysis;
        if (a.Tornado.Count == 0) yield break;
        string headline = c.Solved.Scenario.Inputs.Options.First(o => o.Id == a.HeadlineOptionId).Label;
        var h = c.Solved.Outcomes.Headline;
        double central = h.BalancedGrowth.ChangeVsBaselinePct;
        yield return new ChartSpec("tornado", AnalysisCharts.Tornado(c.Drawing, h.Swings, central, headline),
            w.T("chart.tornado.caption", headline),
            w.T("chart.tornado.alt", w.ParameterLabel(a.Tornado[0].Parameter, a.Tornado[0].Label),
                w.Change(h.Swings[0].AtLowPct), w.Change(h.Swings[0].AtHighPct),
                w.Change(central)),
            c.Source);
    }
}
