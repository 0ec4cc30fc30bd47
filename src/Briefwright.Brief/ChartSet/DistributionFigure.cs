using Briefwright.Charts;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>
/// Distribution of the headline option's long-run change over the Monte Carlo draws, in its option colour.
/// </summary>
public sealed class DistributionFigure : IChartDefinition
{
    public IEnumerable<ChartSpec> Build(ChartContext c)
    {
        var w = c.Texts;
        var a = c.Solved.Analysis;
        if (a.MonteCarlo is not { } mc) yield break;
        string headline = c.Solved.Scenario.Inputs.Options.First(o => o.Id == a.HeadlineOptionId).Label;
        var h = c.Solved.Outcomes.Headline.Uncertainty!;
        yield return new ChartSpec("distribution",
            AnalysisCharts.Distribution(c.Drawing, mc, h, headline, c.Styles[a.HeadlineOptionId]),
            w.T("chart.distribution.caption", headline, w.Big(mc.Draws)),
            w.T("chart.distribution.alt", w.Change(h.LongRunChangePct.P5),
                w.Change(h.LongRunChangePct.P95), w.Change(h.LongRunChangePct.P50)),
            c.Source);
    }
}
