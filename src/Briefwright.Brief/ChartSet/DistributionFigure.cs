using Briefwright.Charts;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>Distribution of the headline option's long-run change over the Monte Carlo draws, in its option colour.</summary>
public sealed class DistributionFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var w = c.Texts;
        var a = c.Solved.Analysis;
        if (a.MonteCarlo is not { } mc) yield break;
        string headline = c.Solved.Scenario.Inputs.Options.First(o => o.Id == a.HeadlineOptionId).Label;
        int k = a.Reform.Options.Select(o => o.OptionId).ToList().IndexOf(a.HeadlineOptionId);
        yield return new ChartSpec("distribution", AnalysisCharts.Distribution(c.Drawing, mc, k, headline,
            c.Styles[a.HeadlineOptionId]),
            w.T("chart.distribution.caption", headline, w.Big(mc.Draws)),
            w.T("chart.distribution.alt", w.Change(mc.Options[k].LongRunChangePct.P5),
                w.Change(mc.Options[k].LongRunChangePct.P95), w.Change(mc.Options[k].LongRunChangePct.P50)),
            c.Source);
    }
}
