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
        int k = a.Reform.Options.Select(o => o.OptionId).ToList().IndexOf(a.HeadlineOptionId);
        double central = c.Solved.BalancedGrowth.Options.First(o => o.Id == a.HeadlineOptionId).ChangeVsBaselinePct;
        yield return new ChartSpec("tornado", AnalysisCharts.Tornado(c.Drawing, a.Tornado, k, central, headline),
            w.T("chart.tornado.caption", headline),
            w.T("chart.tornado.alt", w.ParameterLabel(a.Tornado[0].Parameter, a.Tornado[0].Label),
                w.Change(a.Tornado[0].AtLow.LongRunChangePct[k]), w.Change(a.Tornado[0].AtHigh.LongRunChangePct[k]),
                w.Change(central)),
            c.Source);
    }
}
